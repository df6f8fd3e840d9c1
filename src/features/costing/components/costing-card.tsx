import { useTranslation } from 'react-i18next';
import { Card, ErrorPanel, Loading } from '@/components/ui/panels';
import { useOrderCosting } from '../api/get-costing';
import { useCostFormats } from './money';

/** The manager's card on the order page: the quoted cost against the actual one, by step. */
export function CostingCard({ orderId }: { orderId: string }) {
  const { t } = useTranslation('costing');
  const f = useCostFormats();
  const q = useOrderCosting(orderId);
  if (q.isPending) return <Loading label={t('card.loading')} />;
  if (q.error) return <ErrorPanel title={t('card.title')} message={q.error.message} />;
  const c = q.data;
  const m = (x: number) => f.money(x, c.currency);
  const tone = c.variance > 0 ? 'text-stop-700' : 'text-harbour-900';
  return (
    <Card>
      <section aria-labelledby="costing-title" data-testid="costing-card">
        <h2 id="costing-title" className="text-xl font-bold text-harbour-900">
          {t('card.title')}
        </h2>
        <p className="mt-1 text-sm text-harbour-700">{c.basis === 'quote' ? t('card.basisQuote', { quote: c.quoteNumber }) : t('card.basisStandard')}</p>
        {!c.complete && <p className="mt-1 text-sm font-bold text-harbour-800">{t('card.running')}</p>}
        <dl className="mt-4 grid grid-cols-1 gap-3 sm:grid-cols-3">
          <div className="rounded-lg bg-harbour-50 p-3">
            <dt className="text-sm">{t('card.quoted')}</dt>
            <dd className="text-2xl font-bold tabular-nums">{m(c.quoted)}</dd>
          </div>
          <div className="rounded-lg bg-harbour-50 p-3">
            <dt className="text-sm">{t('card.actual')}</dt>
            <dd className="text-2xl font-bold tabular-nums">{m(c.actual)}</dd>
          </div>
          <div className="rounded-lg bg-harbour-50 p-3">
            <dt className="text-sm">{t('card.variance')}</dt>
            <dd className={`text-2xl font-bold tabular-nums ${tone}`} data-testid="costing-variance">
              {f.signed(c.variance, c.currency)} <span className="text-base">({f.pct(c.variancePct)})</span>
            </dd>
          </div>
        </dl>
        <p className="mt-3 text-sm">
          {t('card.cycles', { actual: c.cureCycles.actual, quoted: c.cureCycles.quoted })} · {t('card.scrap', { count: c.scrapPieces })}
        </p>
        <p className="text-sm text-harbour-700">
          {t('card.parts', {
            labour: m(c.actualParts.labour),
            oven: m(c.actualParts.oven),
            scrap: m(c.actualParts.scrap),
            material: m(c.actualParts.material),
          })}
        </p>
        <div className="mt-4 overflow-x-auto" tabIndex={0} aria-label={t('card.caption')}>
          <table className="w-full text-left text-sm">
            <caption className="sr-only">{t('card.caption')}</caption>
            <thead>
              <tr className="border-b-2 border-harbour-100">
                <th scope="col" className="px-2 py-2">
                  {t('card.col.step')}
                </th>
                {(['quotedMinutes', 'actualMinutes', 'quotedCost', 'actualCost', 'variance', 'scrap'] as const).map((k) => (
                  <th key={k} scope="col" className="px-2 py-2 text-right">
                    {t(`card.col.${k}`)}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {c.steps.map((s) => (
                <tr key={s.seq} className="border-b border-harbour-50">
                  <th scope="row" className="px-2 py-1.5 font-normal">
                    {s.seq}. {t(`common:kind.${s.stationKind}`, { defaultValue: s.stationKind })}
                    <span className="block text-xs text-harbour-700">{s.name}</span>
                  </th>
                  <td className="px-2 py-1.5 text-right tabular-nums">{f.number(s.quotedMinutes)}</td>
                  <td className="px-2 py-1.5 text-right tabular-nums">{f.number(s.actualMinutes)}</td>
                  <td className="px-2 py-1.5 text-right tabular-nums">{m(s.quotedCost)}</td>
                  <td className="px-2 py-1.5 text-right tabular-nums">{m(s.actualCost)}</td>
                  <td className={`px-2 py-1.5 text-right font-bold tabular-nums ${s.variance > 0 ? 'text-stop-700' : ''}`}>
                    {f.signed(s.variance, c.currency)}
                  </td>
                  <td className="px-2 py-1.5 text-right tabular-nums">{s.scrap}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="mt-3 text-xs text-harbour-700">{t('card.note')}</p>
      </section>
    </Card>
  );
}
