import { createColumnHelper } from '@tanstack/react-table';
import { REPORT_READERS } from '@shared/domain/access';
import type { YieldOrder } from '@shared/schemas/reports';
import { ChartAndTable, ReportFrame, StatTable } from '@/features/reports/components/report-frame';
import { useReportPage } from '@/features/reports/api/use-report-page';
import { Bars, Pareto } from '@/features/reports/components/charts';
import { useStations } from '@/features/stations/api/get-stations';
import { DataTable } from '@/components/ui/data-table';
import { Card, ErrorPanel, Loading } from '@/components/ui/panels';
import { humanise } from '@/lib/labels';
import { percentText } from '@/lib/duration';
import { percentAxis } from '@/features/reports/lib/percent-axis';

export const handle = { roles: REPORT_READERS };

const col = createColumnHelper<YieldOrder>();
const columns = [
  col.accessor('number', { header: 'Order' }),
  col.accessor('customer', { header: 'Customer' }),
  col.accessor('inQty', { header: 'Pieces in' }),
  col.accessor('goodQty', { header: 'Good out' }),
  col.accessor('reworkQty', { header: 'Reworked' }),
  col.accessor('rolledThroughputYield', { header: 'Rolled throughput yield', cell: (c) => percentText(c.getValue(), 2) }),
  col.accessor('finalYield', { header: 'Final yield', cell: (c) => percentText(c.getValue(), 2) }),
];

export function Component() {
  const { report, frame } = useReportPage('yield', { station: true });
  const stations = useStations();
  const r = report.data;
  // yields sit near 100 %: the axis starts just below the lowest bar
  const axis = r ? percentAxis(r.steps.flatMap((s) => [s.firstPassYield, s.finalYield])) : null;
  return (
    <ReportFrame
      {...frame}
      stations={stations.data ?? []}
      note="First-pass yield counts reworked pieces as not passed; final yield counts them as good. Rolled throughput yield multiplies the steps’ first-pass yields as exact ratios."
    >
      {report.isPending ? (
        <Loading label="Counting good pieces…" />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r ? (
        <>
          <ChartAndTable
            title="Yield per kind of step"
            caption={
              axis?.zoomed ? `The axis starts at ${percentText(axis.domain[0], 1)}, not 0 %, so differences near 100 % can be seen; the table has the exact figures.` : undefined
            }
            chart={
              <Bars
                layout="vertical"
                percent
                domain={axis?.domain}
                data={r.steps.map((s) => ({ kind: humanise(s.stationKind), fpy: s.firstPassYield, fy: s.finalYield }))}
                x="kind"
                yLabel="yield"
                series={[
                  { key: 'fpy', name: 'First-pass yield' },
                  { key: 'fy', name: 'Final yield' },
                ]}
              />
            }
            table={
              <StatTable
                label="Yield per step table"
                head={['Kind', 'In', 'Passed first time', 'Good', 'Scrap', 'Reworked', 'First-pass', 'Final']}
                rows={r.steps.map((s) => [humanise(s.stationKind), s.inQty, s.firstPassQty, s.goodQty, s.scrapQty, s.reworkQty, percentText(s.firstPassYield, 2), percentText(s.finalYield, 2)])}
              />
            }
          />
          <ChartAndTable
            title="Scrap by reason"
            caption={`Largest first, with the running share. ${r.rework.qty.toLocaleString('en-GB')} pieces were reworked (recorded apart, not scrap).`}
            chart={<Pareto data={r.scrap} />}
            table={<StatTable label="Scrap table" head={['Reason', 'Pieces', 'Share', 'Running share']} rows={r.scrap.map((s) => [s.name, s.qty, percentText(s.share), percentText(s.cumulativeShare)])} />}
          />
          <Card>
            <h2 className="mb-3 text-xl font-bold text-harbour-900">Rolled throughput yield per order shipped in the period</h2>
            <DataTable data={r.orders} columns={columns} filterLabel="Find an order" caption="Yield per order" />
          </Card>
        </>
      ) : null}
    </ReportFrame>
  );
}
