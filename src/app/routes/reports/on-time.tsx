import { reportCsvUrl, useReport } from '@/features/reports/api/get-report';
import { useReportFilterOptions } from '@/features/reports/api/get-filters';
import { ChartAndTable, ReportFrame, StatTable, filterParams } from '@/features/reports/components/report-frame';
import { useReportFilters } from '@/features/reports/components/use-report-filters';
import { Bars } from '@/features/reports/components/charts';
import { Card, ErrorPanel, Loading } from '@/components/ui/panels';
import { percentText } from '@/lib/duration';
import { WITH_SALES } from './layout';

export const handle = { roles: WITH_SALES };

export function Component() {
  const [filters, setFilters] = useReportFilters();
  const params = filterParams(filters, { bucket: true });
  const report = useReport('on-time', params);
  const options = useReportFilterOptions();
  const r = report.data;
  return (
    <ReportFrame
      filters={filters}
      onChange={setFilters}
      customers={options.data?.customers ?? []}
      bucket
      csvUrl={reportCsvUrl('on-time', params)}
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
            chart={<Bars data={r.buckets.filter((b) => b.shipped > 0)} x="label" yLabel="share" percent series={[{ key: 'share', name: 'Shipped on time' }]} />}
            table={<StatTable label="On-time table" head={['From', 'Shipped', 'On time', 'Share']} rows={r.buckets.map((b) => [b.label, b.shipped, b.onTime, percentText(b.share)])} />}
          />
        </>
      ) : null}
    </ReportFrame>
  );
}
