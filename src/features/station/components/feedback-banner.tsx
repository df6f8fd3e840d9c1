import { CheckCircle2, AlertTriangle, XOctagon } from 'lucide-react';
import type { ReactNode } from 'react';
import type { FeedbackKind } from '../lib/feedback';

export interface FeedbackView {
  kind: FeedbackKind;
  title: string;
  detail?: string;
  next?: string;
  actions?: ReactNode;
  /** increases with every new feedback, so the same words twice still show as new */
  serial: number;
}

const STYLE: Record<FeedbackKind, string> = {
  accepted: 'border-ok-700 bg-ok-50 text-ok-700',
  warning: 'border-warn-700 bg-warn-50 text-warn-700',
  refused: 'border-stop-700 bg-stop-50 text-stop-700',
};

/** Large colour + icon + words: the result of the last scan, readable from a step away. */
export function FeedbackBanner({ feedback }: { feedback: FeedbackView }) {
  const Icon = feedback.kind === 'accepted' ? CheckCircle2 : feedback.kind === 'warning' ? AlertTriangle : XOctagon;
  return (
    <div key={feedback.serial} role={feedback.kind === 'refused' ? 'alert' : 'status'} data-testid="feedback" data-kind={feedback.kind} className={`flex gap-4 rounded-2xl border-4 p-4 ${STYLE[feedback.kind]}`}>
      <Icon className="h-14 w-14 shrink-0" aria-hidden />
      <div className="flex-1">
        <p className="text-3xl font-bold">{feedback.title}</p>
        {feedback.detail && <p className="mt-1 text-xl text-ink">{feedback.detail}</p>}
        {feedback.next && <p className="mt-1 text-xl font-bold text-ink">{feedback.next}</p>}
        {feedback.actions && <div className="mt-3 flex flex-wrap gap-3">{feedback.actions}</div>}
      </div>
    </div>
  );
}
