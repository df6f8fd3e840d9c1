import { useTranslation } from 'react-i18next';
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { ErrorPanel, Loading } from '@/components/ui/panels';
import { formatDate, formatDateTime } from '@/lib/labels';
import { errorText } from '@/lib/error-text';
import { useDateHistory } from '../api/date-history';
import { CoverageNote } from './coverage-note';

const axis = { fontSize: 13, fill: '#14323a' };

/**
 * How the order's projected ship date moved: a small line of the expected and the 85 % date
 * per day, and the same points as a table (the line carries no meaning the table does not).
 */
export function DateHistoryChart({ orderId }: { orderId: string }) {
  const { t } = useTranslation(['projections', 'common']);
  const kindName = (k: string | null) => (k ? t(`common:kind.${k}` as 'common:kind.fill', { defaultValue: k }) : '–');
  const q = useDateHistory(orderId);
  if (q.isPending) return <Loading />;
  if (q.error) return <ErrorPanel message={errorText(q.error)} />;
  const points = q.data.map((p) => ({
    ...p,
    x: Date.parse(p.at),
    expected: p.expectedAt ? Date.parse(p.expectedAt) : null,
    p85: p.p85At ? Date.parse(p.p85At) : null,
  }));
  return (
    <section aria-labelledby={`date-history-${orderId}`} className="flex flex-col gap-2" data-testid="date-history">
      <h2 id={`date-history-${orderId}`} className="text-xl font-bold">
        {t('history.title')}
      </h2>
      <p className="text-sm text-harbour-700">{t('history.intro')}</p>
      {points.length === 0 ? (
        <p>{t('history.empty')}</p>
      ) : (
        <>
          <div className="h-44 w-full" role="img" aria-label={t('history.chartLabel')}>
            <ResponsiveContainer width="100%" height="100%">
              <LineChart data={points} margin={{ top: 8, right: 16, bottom: 4, left: 8 }}>
                <CartesianGrid strokeDasharray="3 3" />
                <XAxis
                  dataKey="x"
                  type="number"
                  scale="time"
                  domain={['dataMin', 'dataMax']}
                  tick={axis}
                  tickFormatter={(v: number) => formatDate(new Date(v).toISOString())}
                />
                <YAxis
                  type="number"
                  domain={['auto', 'auto']}
                  tick={axis}
                  width={150}
                  tickCount={4}
                  tickFormatter={(v: number) => formatDateTime(new Date(v).toISOString())}
                />
                <Tooltip
                  labelFormatter={(v) => formatDateTime(new Date(Number(v)).toISOString())}
                  formatter={(v) => formatDateTime(new Date(Number(v)).toISOString())}
                />
                <Legend />
                <Line dataKey="expected" name={t('history.expected')} stroke="#1f5a63" strokeWidth={2} dot isAnimationActive={false} connectNulls />
                <Line dataKey="p85" name={t('history.p85')} stroke="#8a4b00" strokeDasharray="6 3" strokeWidth={2} dot isAnimationActive={false} connectNulls />
              </LineChart>
            </ResponsiveContainer>
          </div>
          <CoverageNote />
          <details>
            <summary className="cursor-pointer font-bold text-harbour-700">{t('history.table')}</summary>
            <table className="mt-2 w-full text-left text-sm">
              <thead>
                <tr className="border-b border-harbour-100 text-harbour-700">
                  <th className="py-1 pr-3">{t('history.date')}</th>
                  <th className="py-1 pr-3">{t('history.expected')}</th>
                  <th className="py-1 pr-3">{t('history.p85')}</th>
                  <th className="py-1">{t('history.drivingKind')}</th>
                </tr>
              </thead>
              <tbody>
                {q.data.map((p) => (
                  <tr key={`${p.reason}-${p.at}`} className="border-b border-harbour-100 last:border-0">
                    <td className="py-1 pr-3">
                      {formatDate(p.at)}
                      {p.reason === 'release' && ` · ${t('history.release')}`}
                    </td>
                    <td className="py-1 pr-3">{formatDateTime(p.expectedAt)}</td>
                    <td className="py-1 pr-3">{formatDateTime(p.p85At)}</td>
                    <td className="py-1">{kindName(p.drivingKind)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </details>
        </>
      )}
    </section>
  );
}
