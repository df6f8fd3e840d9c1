import { REPORT_READERS } from '@shared/domain/access';
import type { Summary } from '@shared/schemas/reports';
import { ChartAndTable, ReportFrame, StatTable } from '@/features/reports/components/report-frame';
import { useReportPage } from '@/features/reports/api/use-report-page';
import { Bars } from '@/features/reports/components/charts';
import { useStations } from '@/features/stations/api/get-stations';
import { Card, ErrorPanel, Loading } from '@/components/ui/panels';
import { humanise } from '@/lib/labels';
import { hoursText, percentText } from '@/lib/duration';

export const handle = { roles: REPORT_READERS };

const cells = (s: Summary) => [s.n, s.p50 ?? '–', s.p85 ?? '–', s.p95 ?? '–', s.mean ?? '–'];

export function Component() {
  const { filters, report, frame } = useReportPage('cycle-time', { station: true });
  const stations = useStations();
  const r = report.data;
  return (
    <ReportFrame
      {...frame}
      stations={stations.data ?? []}
      note="Queue time runs from the previous step’s finish (or the end of a cure, or release) to the start; process time from start to finish. Minutes of the clock."
    >
      {report.isPending ? (
        <Loading label="Working out cycle times…" />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r ? (
        <>
          <Card>
            <h2 className="text-xl font-bold text-harbour-900">Flow efficiency</h2>
            {r.flowEfficiency.trays === 0 ? (
              <p className="text-harbour-700">No tray finished in this period{filters.stationId ? ' (not shown for a single station)' : ''}.</p>
            ) : (
              <p className="mt-1 text-lg">
                <strong className="text-3xl">{percentText(r.flowEfficiency.flowEfficiency)}</strong> of working time was spent on the trays’ process steps (
                {hoursText(r.flowEfficiency.processMinutes / 60)} of work in {hoursText(r.flowEfficiency.workingFlowMinutes / 60)} of working time, summed over the{' '}
                {r.flowEfficiency.trays.toLocaleString('en-GB')} trays finished). Counted against the clock: {percentText(r.flowEfficiency.flowEfficiencyCalendar)}. Oven cure is needed but unattended, so it is not counted as
                value-adding: it took {percentText(r.flowEfficiency.cureShare)} of the clock time, shown apart.
              </p>
            )}
          </Card>
          <ChartAndTable
            title="Queue and process time per kind of station (minutes, p50)"
            caption="The full spread (n, p50, p85, p95, mean) is in the table."
            chart={
              <Bars
                layout="vertical"
                data={r.stations.map((s) => ({ kind: humanise(s.stationKind), queue: s.queue.p50, process: s.process.p50 }))}
                x="kind"
                yLabel="minutes"
                series={[
                  { key: 'queue', name: 'Waiting (p50)' },
                  { key: 'process', name: 'Process (p50)' },
                ]}
              />
            }
            table={
              <StatTable
                label="Cycle time table"
                head={['Kind', 'Process n', 'p50', 'p85', 'p95', 'mean', 'Queue n', 'p50', 'p85', 'p95', 'mean']}
                rows={r.stations.map((s) => [humanise(s.stationKind), ...cells(s.process), ...cells(s.queue)])}
              />
            }
          />
        </>
      ) : null}
    </ReportFrame>
  );
}
