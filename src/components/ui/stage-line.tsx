import { Check } from 'lucide-react';
import { useTranslation } from 'react-i18next';

export interface StageStep {
  name: string;
  done: boolean;
}

/**
 * An order's progress as a line of stages: done ones ticked, the current one marked, the rest
 * to come. The words say it as well as the colours ("done", "now").
 */
export function StageLine({ stages, current, label }: { stages: StageStep[]; current: string | null; label?: string }) {
  const { t } = useTranslation();
  return (
    <ol aria-label={label ?? t('app.orderProgress')} className="flex flex-col gap-0">
      {stages.map((s, i) => {
        const now = !s.done && s.name === current;
        const last = i === stages.length - 1;
        return (
          <li key={s.name} aria-current={now ? 'step' : undefined} className="relative flex min-h-12 items-start gap-3 pb-2">
            {!last && (
              <span aria-hidden className={`absolute left-[15px] top-8 h-[calc(100%-1.5rem)] w-1 rounded ${s.done ? 'bg-ok-700' : 'bg-harbour-100'}`} />
            )}
            <span
              aria-hidden
              className={`z-10 flex h-8 w-8 shrink-0 items-center justify-center rounded-full border-2 font-bold ${
                s.done
                  ? 'border-ok-700 bg-ok-700 text-white'
                  : now
                    ? 'border-brass-700 bg-brass-300 text-harbour-900'
                    : 'border-harbour-100 bg-white text-harbour-700'
              }`}
            >
              {s.done ? <Check className="h-5 w-5" /> : i + 1}
            </span>
            <span className="pt-1">
              <span className={`text-lg ${now ? 'font-bold text-harbour-900' : s.done ? 'text-ink' : 'text-harbour-700'}`}>{s.name}</span>
              <span className="ml-2 text-sm font-bold text-harbour-700">{s.done ? t('app.stageDone') : now ? t('app.stageNow') : ''}</span>
            </span>
          </li>
        );
      })}
    </ol>
  );
}
