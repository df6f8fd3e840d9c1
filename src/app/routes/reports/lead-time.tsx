import { createColumnHelper } from '@tanstack/react-table';
import type { LeadTimeOrder, Summary } from '@shared/schemas/reports';
import { ChartAndTable, ReportFrame, StatTable } from '@/features/reports/components/report-frame';
import { useReportPage } from '@/features/reports/api/use-report-page';
import { Histogram, Lines, bins } from '@/features/reports/components/charts';
import { DataTable } from '@/components/ui/data-table';
import { Card, ErrorPanel, Loading, Pill } from '@/components/ui/panels';
import { humanise } from '@/lib/labels';
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
const columnsFor = (tz: string) => [
  col.accessor('number', { header: 'Order' }),
  col.accessor('customer', { header: 'Customer' }),
  col.accessor('process', { header: 'Process', cell: (c) => humanise(c.getValue()) }),
  col.accessor('releasedAt', { header: 'Released', cell: (c) => factoryTime(c.getValue(), tz) }),
  col.accessor('shippedAt', { header: 'Shipped', cell: (c) => factoryTime(c.getValue(), tz) }),
  col.accessor('calendarHours', { header: 'Calendar h' }),
  col.accessor('workingHours', { header: 'Working h' }),
  col.accessor('dueDate', { header: 'Due' }),
  col.accessor('onTime', { header: 'On time', cell: (c) => (c.getValue() ? <Pill tone="ok">On time</Pill> : <Pill tone="stop">Late</Pill>) }),
];

export function Component() {
  const { report, frame } = useReportPage('lead-time');
  const r = report.data;
  return (
    <ReportFrame
      {...frame}
      percentiles
      note="Lead time runs from release to the dispatch scan of the order’s last tray; working hours count only the factory’s shifts."
    >
      {report.isPending ? (
        <Loading label="Working out lead times…" />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r ? (
        <>
          <Card>
            <h2 className="mb-2 text-xl font-bold text-harbour-900">Lead time of orders shipped in the period (hours and days)</h2>
            <StatTable label="Lead time summary" head={['', 'n', 'p50', 'p85', 'p95', 'mean']} rows={[summaryRow('Calendar hours', r.summary), summaryRow('Calendar days', daysOf(r.summary)), summaryRow('Working hours', r.summaryWorkingHours)]} />
          </Card>
          <ChartAndTable
            title="Distribution"
            caption="How many orders took how long, in calendar hours; the dashed lines mark p50 and p85."
            chart={<Histogram data={bins(r.orders.map((o) => o.calendarHours))} p50={r.summary.p50} p85={r.summary.p85} unit="calendar hours" />}
            table={
              <StatTable
                label="Distribution table"
                head={['Calendar hours', 'Orders']}
                rows={bins(r.orders.map((o) => o.calendarHours)).map((b) => [b.bin, b.n])}
              />
            }
          />
          <ChartAndTable
            title="Trend per week"
            chart={<Lines data={r.trend} x="week" yLabel="calendar hours" series={[{ key: 'p50', name: 'p50' }, { key: 'p85', name: 'p85' }]} />}
            table={<StatTable label="Trend table" head={['Week of', 'n', 'p50', 'p85', 'On time']} rows={r.trend.map((w) => [w.week, w.n, w.p50 ?? '–', w.p85 ?? '–', w.onTime])} />}
          />
          <Card>
            <h2 className="mb-3 text-xl font-bold text-harbour-900">Orders</h2>
            <DataTable data={r.orders} columns={columnsFor(r.window.timeZone)} filterLabel="Find an order" caption="Orders shipped in the period" initialSorting={[{ id: 'shippedAt', desc: true }]} />
          </Card>
        </>
      ) : null}
    </ReportFrame>
  );
}
