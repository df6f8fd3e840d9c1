import { useTranslation } from 'react-i18next';
import { XOctagon } from 'lucide-react';
import type { OutboxEntry } from '../lib/station-db';
import { describeRefusal, type StationLang } from '../lib/refusal-text';
import { formatClock, formatDateTime } from '../lib/format';

/** Scans the server refused after the fact (say, after a sync): shown until the operator has seen them. */
export function RefusedPanel({
  entries,
  lang,
  reasonName,
  onSeen,
}: {
  entries: OutboxEntry[];
  lang: StationLang;
  reasonName: (code: string) => string;
  onSeen: (id: string) => void;
}) {
  const { t } = useTranslation('station');
  if (entries.length === 0) return null;
  return (
    <section aria-labelledby="refused-title" className="flex flex-col gap-2 rounded-2xl border-4 border-stop-700 bg-stop-50 p-4">
      <h2 id="refused-title" className="flex items-center gap-2 text-xl font-bold text-stop-700">
        <XOctagon className="h-6 w-6" aria-hidden /> {t('refusedList.title')} ({entries.length})
      </h2>
      <p>{t('refusedList.supervisorKnows')}</p>
      <ul className="flex flex-col gap-2">
        {entries.map((e) => {
          const m = e.code ? describeRefusal(lang, e.code, e.params ?? {}, (iso) => formatClock(lang, iso), reasonName) : null;
          return (
            <li key={e.id} data-testid="refused-row" className="flex items-start justify-between gap-3 rounded-xl bg-white p-3">
              <div>
                <p className="font-mono text-lg font-bold">
                  {e.trayNumber} · {t(`action.${e.event.type}`)}
                </p>
                <p className="text-sm text-harbour-700">{t('refusedList.at', { time: formatDateTime(lang, e.event.occurredAt) })}</p>
                {m && (
                  <>
                    <p className="font-bold text-stop-700">{m.title}</p>
                    <p>{m.detail}</p>
                    <p className="font-bold">{m.next}</p>
                  </>
                )}
              </div>
              <button
                type="button"
                onClick={() => onSeen(e.id)}
                className="min-h-12 rounded-xl bg-white px-4 font-bold text-harbour-800 ring-2 ring-harbour-800"
              >
                {t('refusedList.dismiss')}
              </button>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
