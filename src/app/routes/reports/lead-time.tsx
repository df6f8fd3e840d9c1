import { createColumnHelper } from '@tanstack/react-table';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import type { LeadTimeOrder, Summary } from '@shared/schemas/reports';
import { ChartAndTable, ReportFrame, StatTable } from '@/features/reports/components/report-frame';
import { useReportPage } from '@/features/reports/api/use-report-page';
import { Histogram, Lines, bins } from '@/features/reports/components/charts';
import { DataTable } from '@/components/ui/data-table';
import { Card, ErrorPanel, Loading, Pill } from '@/components/ui/panels';
import { factoryTime } from '@/lib/duration';
import { WITH_SALES } from './layout';

export const handle = { roles: WITH_SALES };

/** The same figures in days (hours ÷ 24, one decimal): a lead time reads better in days. */
const daysOf = (s: Summary): Summary => {
  const d = (h: number | null) => (h == null ? null : Math.round((h / 24) * 10) / 10);
  return { ...s, p50: d(s.p50), p85: d(s.p85), p95: d(s.p95), mean: d(s.mean) };
};
const summaryRow = (label: string, s: Summary | undefined) => [label, s?.n ?? 0, s?.p50 ?? '–', s?.p85 ?? '–', s?.p95 ?? '–', s?.mean ?? '–'];
const col = createColumnHelper<LeadTimeOrder>();
const columnsFor = (tz: string, t: TFunction<['reports', 'common']>) => [
  col.accessor('number', { header: t('leadTime.col.order') }),
  col.accessor('customer', { header: t('leadTime.col.customer') }),
  col.accessor('process', {
    header: t('leadTime.col.process'),
    cell: (c) => t(`common:process.${c.getValue()}` as 'common:process.printed', { defaultValue: c.getValue() }),
  }),
  col.accessor('releasedAt', { header: t('leadTime.col.released'), cell: (c) => factoryTime(c.getValue(), tz) }),
  col.accessor('shippedAt', { header: t('leadTime.col.shipped'), cell: (c) => factoryTime(c.getValue(), tz) }),
  col.accessor('calendarHours', { header: t('leadTime.col.calendarH') }),
  col.accessor('workingHours', { header: t('leadTime.col.workingH') }),
  col.accessor('dueDate', { header: t('leadTime.col.due') }),
  col.accessor('onTime', {
    header: t('leadTime.onTime'),
    cell: (c) => (c.getValue() ? <Pill tone="ok">{t('leadTime.onTime')}</Pill> : <Pill tone="stop">{t('leadTime.late')}</Pill>),
  }),
];

export function Component() {
  const { t } = useTranslation(['reports', 'common']);
  const { report, frame } = useReportPage('lead-time');
  const r = report.data;
  return (
    <ReportFrame {...frame} percentiles note={t('leadTime.note')}>
      {report.isPending ? (
        <Loading label={t('leadTime.loading')} />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r ? (
        <>
          <Card>
            <h2 className="mb-2 text-xl font-bold text-harbour-900">{t('leadTime.summaryTitle')}</h2>
            <StatTable
              label={t('leadTime.summaryTable')}
              head={['', 'n', 'p50', 'p85', 'p95', t('cycleTime.stat.mean')]}
              rows={[
                summaryRow(t('leadTime.calendarHours'), r.summary),
                summaryRow(t('leadTime.calendarDays'), daysOf(r.summary)),
                summaryRow(t('leadTime.workingHours'), r.summaryWorkingHours),
              ]}
            />
          </Card>
          <ChartAndTable
            title={t('leadTime.distribution')}
            caption={t('leadTime.distributionCaption')}
            chart={<Histogram data={bins(r.orders.map((o) => o.calendarHours))} p50={r.summary.p50} p85={r.summary.p85} unit={t('leadTime.unit')} />}
            table={
              <StatTable
                label={t('leadTime.distributionTable')}
                head={[t('leadTime.calendarHours'), t('leadTime.orders')]}
                rows={bins(r.orders.map((o) => o.calendarHours)).map((b) => [b.bin, b.n])}
              />
            }
          />
          <ChartAndTable
            title={t('leadTime.trend')}
            chart={
              <Lines
                data={r.trend}
                x="week"
                yLabel={t('leadTime.unit')}
                series={[
                  { key: 'p50', name: 'p50' },
                  { key: 'p85', name: 'p85' },
                ]}
              />
            }
            table={
              <StatTable
                label={t('leadTime.trendTable')}
                head={[t('leadTime.weekOf'), 'n', 'p50', 'p85', t('leadTime.onTime')]}
                rows={r.trend.map((w) => [w.week, w.n, w.p50 ?? '–', w.p85 ?? '–', w.onTime])}
              />
            }
          />
          <Card>
            <h2 className="mb-3 text-xl font-bold text-harbour-900">{t('leadTime.orders')}</h2>
            <DataTable
              data={r.orders}
              columns={columnsFor(r.window.timeZone, t)}
              filterLabel={t('leadTime.find')}
              caption={t('leadTime.ordersCaption')}
              initialSorting={[{ id: 'shippedAt', desc: true }]}
            />
          </Card>
        </>
      ) : null}
    </ReportFrame>
  );
}
