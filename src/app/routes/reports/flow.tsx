import { REPORT_READERS } from '@shared/domain/access';
import { ChartAndTable, ReportFrame, StatTable } from '@/features/reports/components/report-frame';
import { useReportPage } from '@/features/reports/api/use-report-page';
import { Bars, CumulativeFlow, Lines } from '@/features/reports/components/charts';
import { ErrorPanel, Loading } from '@/components/ui/panels';

export const handle = { roles: REPORT_READERS };

const STAGE_NAMES: Record<string, string> = { released: 'Released', started: 'Started', inspected: 'Inspected', packed: 'Packed', shipped: 'Shipped' };

export function Component() {
  const { filters, report, frame } = useReportPage('flow', { bucket: true });
  const r = report.data;
  const per = filters.bucket === 'week' ? 'week' : 'day';
  return (
    <ReportFrame
      {...frame}
      note="Counted in trays. The diagram shows only what has happened; trays scrapped whole leave it."
    >
      {report.isPending ? (
        <Loading label="Drawing the flow…" />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r ? (
        <>
          <ChartAndTable
            title="Cumulative flow"
            caption="Each line counts the trays that have reached a stage by the end of each day or week (less those shipped before the period). Lines never fall; the vertical gap between two lines is the number of trays between those stages."
            chart={
              <CumulativeFlow
                data={r.buckets.map((b) => ({ label: b.label, ...Object.fromEntries(r.stages.map((s, i) => [s, b.cumulative[i]])) }))}
                stages={r.stages.map((s) => ({ key: s, name: STAGE_NAMES[s] ?? s }))}
              />
            }
            table={
              <StatTable
                label="Cumulative flow table"
                head={[per === 'week' ? 'Week of' : 'Day', ...r.stages.map((s) => STAGE_NAMES[s] ?? s)]}
                rows={r.buckets.map((b) => [b.label, ...b.cumulative])}
              />
            }
          />
          <ChartAndTable
            title={`Throughput per ${per}`}
            caption="Trays and orders that left dispatch."
            chart={<Bars data={r.buckets} x="label" yLabel="trays" series={[{ key: 'trays', name: 'Trays shipped' }, { key: 'orders', name: 'Orders shipped' }]} />}
            table={<StatTable label="Throughput table" head={[per === 'week' ? 'Week of' : 'Day', 'Trays', 'Pieces', 'Orders']} rows={r.buckets.map((b) => [b.label, b.trays, b.pieces, b.orders])} />}
          />
          <ChartAndTable
            title="Work in progress over time"
            caption="Trays released and not yet shipped: the average over each day or week, and the count at its end."
            chart={<Lines data={r.buckets} x="label" yLabel="trays" series={[{ key: 'wipAverage', name: 'Average' }, { key: 'wipAtEnd', name: 'At the end' }]} />}
            table={<StatTable label="WIP table" head={[per === 'week' ? 'Week of' : 'Day', 'Average', 'At the end']} rows={r.buckets.map((b) => [b.label, b.wipAverage, b.wipAtEnd])} />}
          />
        </>
      ) : null}
    </ReportFrame>
  );
}
