import { useTranslation } from 'react-i18next';
import { CalendarClock } from 'lucide-react';
import type { OrderSpec } from '@shared/schemas/orders';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ErrorPanel } from '@/components/ui/panels';
import { formatDateTime } from '@/lib/labels';
import { errorText } from '@/lib/error-text';
import { CoverageNote } from './coverage-note';
import { useWhatIf } from '../api/what-if';

const HOUR = 3_600_000;

/** "When would it ship?": asks the server to project the spec on the floor as it is, and shows whom it would delay. */
export function WhatIfPanel({ withSpec }: { withSpec: (then: (spec: OrderSpec) => void) => void }) {
  const { t } = useTranslation('projections');
  const ask = useWhatIf();
  const { isPending: pending, error, data: result } = ask;
  const [releaseAt, setReleaseAt] = useState('');
  const laterBy = (ms: number) =>
    ms >= HOUR ? t('whatIf.hours', { count: Math.round(ms / HOUR) }) : t('whatIf.minutes', { count: Math.max(1, Math.round(ms / 60_000)) });
  const releaseIso = releaseAt && !Number.isNaN(Date.parse(releaseAt)) ? new Date(releaseAt).toISOString() : undefined;
  return (
    <section aria-labelledby="what-if-title" className="flex flex-col gap-3 rounded-xl border-2 border-harbour-100 bg-harbour-50 p-4">
      <h2 id="what-if-title" className="text-lg font-bold text-harbour-900">
        {t('whatIf.title')}
      </h2>
      <p className="text-harbour-700">{t('whatIf.intro')}</p>
      <div className="flex flex-wrap items-end gap-3">
        <TextField
          label={t('whatIf.releaseAt')}
          type="datetime-local"
          value={releaseAt}
          onChange={(e) => setReleaseAt(e.target.value)}
          hint={t('whatIf.releaseAtHint')}
        />
        <Button variant="secondary" disabled={pending} onClick={() => withSpec((spec) => ask.mutate(releaseIso ? { ...spec, releaseAt: releaseIso } : spec))}>
          <CalendarClock className="h-5 w-5" aria-hidden /> {pending ? t('whatIf.asking') : t('whatIf.ask')}
        </Button>
      </div>
      {error ? <ErrorPanel message={errorText(error)} /> : null}
      {result && !pending && (
        <div className="flex flex-col gap-3" aria-live="polite" data-testid="what-if-result">
          {result.expectedAt ? (
            <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[auto_1fr]">
              <dt className="text-harbour-700">{t('whatIf.expected')}</dt>
              <dd className="text-xl font-bold">{formatDateTime(result.expectedAt)}</dd>
              <dt className="text-harbour-700">{t('whatIf.p85')}</dt>
              <dd>
                <span className="text-xl font-bold">{formatDateTime(result.p85At)}</span>
                <CoverageNote />
              </dd>
            </dl>
          ) : (
            <p>{t('whatIf.noDate')}</p>
          )}
          <p className="text-sm text-harbour-700">{t('whatIf.asOf')}</p>
          <h3 className="font-bold text-harbour-900">{t('whatIf.impactsTitle')}</h3>
          {result.impacts.length === 0 ? (
            <p>{t('whatIf.impactsNone')}</p>
          ) : (
            <div className="overflow-x-auto">
              <table className="w-full text-left">
                <thead>
                  <tr className="border-b border-harbour-100 text-sm text-harbour-700">
                    <th className="py-1 pr-4">{t('whatIf.impactOrder')}</th>
                    <th className="py-1 pr-4">{t('whatIf.impactBefore')}</th>
                    <th className="py-1 pr-4">{t('whatIf.impactAfter')}</th>
                    <th className="py-1">{t('whatIf.impactBy')}</th>
                  </tr>
                </thead>
                <tbody>
                  {result.impacts.map((i) => (
                    <tr key={i.orderId} className="border-b border-harbour-100 last:border-0">
                      <td className="py-1 pr-4 font-bold">{i.number}</td>
                      <td className="py-1 pr-4">{formatDateTime(i.p85Before)}</td>
                      <td className="py-1 pr-4">{formatDateTime(i.p85After)}</td>
                      <td className="py-1">{laterBy(Date.parse(i.p85After) - Date.parse(i.p85Before))}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </div>
      )}
    </section>
  );
}
