import { useTranslation } from 'react-i18next';
import { CheckCircle2, AlertTriangle, XOctagon } from 'lucide-react';
import type { FeedbackKind } from '../lib/feedback';
import type { RefusalChoices } from '../lib/refusal-choices';

export interface FeedbackView {
  kind: FeedbackKind;
  title: string;
  detail?: string;
  next?: string;
  /** a scan the tablet refused: what the operator can do next (ask a supervisor, send it anyway) */
  choices?: RefusalChoices;
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
    <div key={feedback.serial} data-testid="feedback" data-kind={feedback.kind} className={`flex gap-3 rounded-2xl border-4 px-4 py-2 ${STYLE[feedback.kind]}`}>
      <Icon className="mt-1 h-10 w-10 shrink-0" aria-hidden />
      <div className="min-w-0 flex-1">
        <p className="text-2xl font-bold">{feedback.title}</p>
        {feedback.detail && <p className="text-xl text-ink">{feedback.detail}</p>}
        {feedback.next && <p className="text-xl font-bold text-ink">{feedback.next}</p>}
      </div>
    </div>
  );
}

/**
 * The result of every scan, in a fixed place above the scrolling part of the screen. The two live
 * regions are always on the page, so screen readers announce each new result: accepted and
 * warnings politely, refusals at once.
 */
export function FeedbackZone({
  feedback,
  onOverride,
  onSendAnyway,
}: {
  feedback: FeedbackView | null;
  onOverride: (choices: RefusalChoices) => void;
  onSendAnyway: (choices: RefusalChoices) => void;
}) {
  const { t } = useTranslation('station');
  const choices = feedback?.choices;
  const refused = feedback?.kind === 'refused';
  return (
    <section aria-label={t('feedback.region')} className={`shrink-0 px-4 ${feedback ? 'pt-3' : ''}`}>
      <div role="status" aria-live="polite" aria-atomic="true">
        {feedback && !refused && <FeedbackBanner feedback={feedback} />}
      </div>
      <div role="alert" aria-live="assertive" aria-atomic="true">
        {feedback && refused && <FeedbackBanner feedback={feedback} />}
      </div>
      {choices && (
        <div className="mt-2 flex flex-wrap gap-3">
          {choices.override && (
            <button type="button" className="min-h-14 rounded-xl bg-brass-700 px-5 text-xl font-bold text-white" onClick={() => onOverride(choices)}>
              {t('action.override')}
            </button>
          )}
          <button
            type="button"
            className="min-h-14 rounded-xl bg-white px-5 text-lg font-bold text-harbour-800 ring-2 ring-harbour-800"
            onClick={() => onSendAnyway(choices)}
          >
            {t('action.sendAnyway')}
          </button>
        </div>
      )}
    </section>
  );
}
