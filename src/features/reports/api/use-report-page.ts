import { useReport, reportCsvUrl, type ReportName } from './get-report';
import { useReportFilterOptions } from './get-filters';
import { filterParams } from '../components/report-frame';
import { useReportFilters } from '../components/use-report-filters';

/**
 * What every report page needs: its filters (kept in the address), the report for them, and the
 * frame's props (filter bar, customers, CSV link of the same report with the same filters).
 */
export function useReportPage<N extends ReportName>(name: N, use: { station?: boolean; bucket?: boolean } = {}) {
  const [filters, setFilters, ready] = useReportFilters();
  const params = filterParams(filters, use);
  // wait for the default period (the last four weeks with data) before asking for the report
  const report = useReport(name, params, ready);
  const options = useReportFilterOptions();
  return {
    filters,
    report,
    frame: { filters, onChange: setFilters, customers: options.data?.customers ?? [], csvUrl: reportCsvUrl(name, params), bucket: use.bucket },
  };
}
