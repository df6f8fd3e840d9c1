import type { ReactNode } from 'react';
import { Link, redirect } from 'react-router';
import { useQueries, useQuery } from '@tanstack/react-query';
import { useTranslation } from 'react-i18next';
import { ArrowRight } from 'lucide-react';
import type { WipResponse } from '@shared/schemas/reports';
import { REPORT_READERS } from '@shared/domain/access';
import { api } from '@/lib/api-client';
import { liveKeys } from '@/features/live/api/live-keys';
import { reportQueryOptions } from '@/features/reports/api/get-report';
import { lateRiskQueryOptions } from '@/features/reports/api/get-late-risk';
import { lastWeeks, throughputByWeek, yieldTotals } from '@/features/reports/lib/summary';
import { Card, ErrorPanel, Loading } from '@/components/ui/panels';
import { factoryTodayDate, formatDueDay } from '@/lib/datetime';
import { percentText } from '@/lib/duration';
import { paths } from '@/config/paths';
import { queryClient } from '@/lib/query-client';
import { meQueryOptions } from '@/features/auth/api/get-me';

export const handle = { roles: REPORT_READERS };

/** Sales read some reports but not all of these figures: they open on lead time. */
export async function loader() {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (me && !REPORT_READERS.includes(me.user.role)) throw redirect('/reports/lead-time');
  return null;
}

const num = (n: number, lang: string) => n.toLocaleString(lang);

function Tile({ title, to, linkText, children, testId }: { title: string; to: string; linkText: string; children: ReactNode; testId: string }) {
  return (
    <Card className="flex flex-col gap-3">
      <h2 className="text-xl font-bold text-harbour-900">{title}</h2>
      <div className="flex-1" data-testid={testId}>
        {children}
      </div>
      <Link to={to} className="inline-flex min-h-11 items-center gap-2 self-start font-bold text-harbour-800 underline">
        {linkText} <ArrowRight className="h-4 w-4" aria-hidden />
      </Link>
    </Card>
  );
}

function State({ pending, error, children }: { pending: boolean; error: unknown; children: ReactNode }) {
  const { t } = useTranslation('reports');
  if (pending) return <Loading label={t('summary.loading')} />;
  if (error) return <ErrorPanel message={t('summary.failed')} />;
  return <>{children}</>;
}

/** The manager's first page: WIP now, on-time delivery, yield and scrap, late orders and throughput. */
export function Component() {
  const { t, i18n } = useTranslation('reports');
  const lang = i18n.language;
  const weeks = lastWeeks(factoryTodayDate());
  const window = { from: weeks[0].from, to: weeks.at(-1)!.to };
  const query = (extra: Record<string, string> = {}) => new URLSearchParams({ ...window, ...extra }).toString();

  const wip = useQuery({ queryKey: liveKeys.wip(), queryFn: () => api.get<WipResponse>('/wip'), refetchInterval: 30_000 });
  const onTime = useQuery(reportQueryOptions('on-time', { ...window, bucket: 'week' }));
  // throughput per day, summed into the same weeks as the yield table
  const flow = useQuery(reportQueryOptions('flow', { ...window, bucket: 'day' }));
  const late = useQuery(lateRiskQueryOptions());
  const yields = useQueries({ queries: weeks.map((w) => reportQueryOptions('yield', { from: w.from, to: w.to })) });

  const lateCount = late.data?.filter((o) => o.risk === 'late').length ?? 0;
  const atRisk = late.data?.filter((o) => o.risk === 'at_risk').length ?? 0;

  return (
    <div className="flex flex-col gap-4">
      <p className="text-harbour-700">{t('summary.subtitle', { from: formatDueDay(window.from), to: formatDueDay(window.to) })}</p>
      <div className="grid gap-4 lg:grid-cols-2 xl:grid-cols-3">
        <Tile title={t('summary.wip.title')} to={paths.floor} linkText={t('summary.wip.link')} testId="summary-wip">
          <State pending={wip.isPending} error={wip.error}>
            {wip.data && (
              <>
                <p className="text-3xl font-bold text-ink">
                  {t('summary.wip.value', { trays: num(wip.data.totals.trays, lang), pieces: num(wip.data.totals.pieces, lang) })}
                </p>
                <p className="text-harbour-700">{t('summary.wip.moulds', { count: wip.data.totals.moulds })}</p>
              </>
            )}
          </State>
        </Tile>

        <Tile title={t('summary.onTime.title')} to={`/reports/on-time?${query({ bucket: 'week' })}`} linkText={t('summary.open')} testId="summary-on-time">
          <State pending={onTime.isPending} error={onTime.error}>
            {onTime.data &&
              (onTime.data.total.shipped === 0 ? (
                <p>{t('summary.onTime.none')}</p>
              ) : (
                <>
                  <p className="text-3xl font-bold text-ink">{percentText(onTime.data.total.share)}</p>
                  <p className="text-harbour-700">{t('summary.onTime.value', { onTime: onTime.data.total.onTime, shipped: onTime.data.total.shipped })}</p>
                </>
              ))}
          </State>
        </Tile>

        <Tile title={t('summary.late.title')} to={`${paths.orders}?view=all&late=1`} linkText={t('summary.late.link')} testId="summary-late">
          <State pending={late.isPending} error={late.error}>
            {late.data &&
              (lateCount + atRisk === 0 ? (
                <p>{t('summary.late.none')}</p>
              ) : (
                <>
                  <p className="text-3xl font-bold text-ink">{t('summary.late.value', { late: lateCount, atRisk })}</p>
                  <ul className="mt-2 text-sm">
                    {late.data.slice(0, 5).map((o) => (
                      <li key={o.orderId} className="truncate">
                        <Link className="font-bold underline" to={paths.order(o.orderId)}>
                          {o.number}
                        </Link>{' '}
                        · {o.customer}
                      </li>
                    ))}
                  </ul>
                </>
              ))}
          </State>
        </Tile>

        <Tile title={t('summary.yield.title')} to={`/reports/yield?${query()}`} linkText={t('summary.open')} testId="summary-yield">
          <State pending={yields.some((y) => y.isPending)} error={yields.find((y) => y.error)?.error}>
            <table className="w-full text-left text-sm">
              <thead>
                <tr className="border-b-2 border-harbour-100">
                  <th scope="col" className="py-1 pr-2">
                    {t('summary.yield.week')}
                  </th>
                  <th scope="col" className="py-1 pr-2 text-right">
                    {t('summary.yield.fpy')}
                  </th>
                  <th scope="col" className="py-1 pr-2 text-right">
                    {t('summary.yield.scrap')}
                  </th>
                  <th scope="col" className="py-1 text-right">
                    {t('summary.yield.pieces')}
                  </th>
                </tr>
              </thead>
              <tbody>
                {weeks.map((w, i) => {
                  const y = yields[i].data ? yieldTotals(yields[i].data!.steps) : null;
                  return (
                    <tr key={w.from} className="border-b border-harbour-50">
                      <td className="py-1 pr-2">{formatDueDay(w.from)}</td>
                      <td className="py-1 pr-2 text-right font-bold">{percentText(y?.firstPassYield, 1)}</td>
                      <td className="py-1 pr-2 text-right">{percentText(y?.scrapRate, 2)}</td>
                      <td className="py-1 text-right">{y ? num(y.inQty, lang) : '–'}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
            <p className="mt-2 text-sm text-harbour-700">{t('summary.yield.note')}</p>
          </State>
        </Tile>

        <Tile title={t('summary.throughput.title')} to={`/reports/flow?${query({ bucket: 'week' })}`} linkText={t('summary.open')} testId="summary-throughput">
          <State pending={flow.isPending} error={flow.error}>
            <table className="w-full text-left text-sm">
              <thead>
                <tr className="border-b-2 border-harbour-100">
                  <th scope="col" className="py-1 pr-2">
                    {t('summary.throughput.week')}
                  </th>
                  <th scope="col" className="py-1 pr-2 text-right">
                    {t('summary.throughput.orders')}
                  </th>
                  <th scope="col" className="py-1 pr-2 text-right">
                    {t('summary.throughput.trays')}
                  </th>
                  <th scope="col" className="py-1 text-right">
                    {t('summary.throughput.pieces')}
                  </th>
                </tr>
              </thead>
              <tbody>
                {throughputByWeek(weeks, flow.data?.buckets ?? []).map((b) => (
                  <tr key={b.from} className="border-b border-harbour-50">
                    <td className="py-1 pr-2">{formatDueDay(b.from)}</td>
                    <td className="py-1 pr-2 text-right">{num(b.orders, lang)}</td>
                    <td className="py-1 pr-2 text-right">{num(b.trays, lang)}</td>
                    <td className="py-1 text-right font-bold">{num(b.pieces, lang)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </State>
        </Tile>
      </div>
    </div>
  );
}
