import type { ReactNode } from 'react';
import { AlertTriangle, Loader2, Inbox } from 'lucide-react';
import { useTranslation } from 'react-i18next';

export function Card({ children, className = '' }: { children: ReactNode; className?: string }) {
  return <section className={`rounded-xl border border-harbour-100 bg-white p-5 shadow-sm ${className}`}>{children}</section>;
}

export function PageHeader({ title, subtitle, actions }: { title: string; subtitle?: ReactNode; actions?: ReactNode }) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div>
        <h1 className="text-3xl font-bold text-harbour-900">{title}</h1>
        {subtitle && <p className="mt-1 text-harbour-700">{subtitle}</p>}
      </div>
      {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
    </header>
  );
}

export function Loading({ label }: { label?: string }) {
  const { t } = useTranslation();
  return (
    <div role="status" className="flex items-center gap-3 p-6 text-harbour-700">
      <Loader2 className="h-6 w-6 animate-spin" aria-hidden />
      <span>{label ?? t('app.loading')}</span>
    </div>
  );
}

/** A readable problem message: what happened and what to do, never a stack trace. */
export function ErrorPanel({ title, message, action }: { title?: string; message: string; action?: ReactNode }) {
  const { t } = useTranslation();
  return (
    <div role="alert" className="flex gap-3 rounded-xl border-2 border-stop-700 bg-stop-50 p-5 text-ink">
      <AlertTriangle className="mt-1 h-6 w-6 shrink-0 text-stop-700" aria-hidden />
      <div>
        <p className="font-bold text-stop-700">{title ?? t('app.somethingWrong')}</p>
        <p className="mt-1">{message}</p>
        {action && <div className="mt-3">{action}</div>}
      </div>
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="flex flex-col items-center gap-2 rounded-xl border-2 border-dashed border-harbour-100 p-10 text-center text-harbour-700">
      <Inbox className="h-8 w-8" aria-hidden />
      <p className="font-bold">{title}</p>
      {children}
    </div>
  );
}

type Tone = 'neutral' | 'ok' | 'warn' | 'stop' | 'info';
const tones: Record<Tone, string> = {
  neutral: 'bg-harbour-50 text-harbour-800 border-harbour-100',
  ok: 'bg-ok-50 text-ok-700 border-ok-700/30',
  warn: 'bg-warn-50 text-warn-700 border-warn-700/30',
  stop: 'bg-stop-50 text-stop-700 border-stop-700/30',
  info: 'bg-harbour-100 text-harbour-800 border-harbour-600/30',
};

/** A short status word in a pill: the word carries the meaning, the colour only helps. */
export function Pill({ tone = 'neutral', children }: { tone?: Tone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded-full whitespace-nowrap border px-2.5 py-0.5 text-sm font-bold ${tones[tone]}`}>{children}</span>
  );
}
