import { ChartAndTable, ReportFrame, StatTable } from '@/features/reports/components/report-frame';
import { useReportPage } from '@/features/reports/api/use-report-page';
import { Bars } from '@/features/reports/components/charts';
import { Card, ErrorPanel, Loading } from '@/components/ui/panels';
import { percentText } from '@/lib/duration';
import { WITH_SALES } from './layout';

export const handle = { roles: WITH_SALES };

export function Component() {
  const { filters, report, frame } = useReportPage('on-time', { bucket: true });
  const r = report.data;
  return (
    <ReportFrame
      {...frame}
      note="An order is on time when its last tray left dispatch on or before its due date (factory time)."
    >
      {report.isPending ? (
        <Loading label="Counting deliveries…" />
      ) : report.error ? (
        <ErrorPanel message={report.error.message} />
      ) : r ? (
        <>
          <Card>
            <p className="text-lg">
              <strong className="text-3xl">{percentText(r.total.share)}</strong> on time: {r.total.onTime.toLocaleString('en-GB')} of {r.total.shipped.toLocaleString('en-GB')} orders shipped in
              the period.
            </p>
          </Card>
          <ChartAndTable
            title={`On-time share per ${filters.bucket === 'week' ? 'week' : 'day'}`}
            caption="Periods without shipments have no bar; a period where none shipped on time shows 0 %."
            chart={<Bars data={r.buckets.filter((b) => b.shipped > 0)} x="label" yLabel="share" percent markZero series={[{ key: 'share', name: 'Shipped on time' }]} />}
            table={<StatTable label="On-time table" head={['From', 'Shipped', 'On time', 'Share']} rows={r.buckets.map((b) => [b.label, b.shipped, b.onTime, percentText(b.share)])} />}
          />
        </>
      ) : null}
    </ReportFrame>
  );
}
