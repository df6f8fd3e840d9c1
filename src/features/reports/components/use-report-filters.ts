import { useSearchParams } from 'react-router';
import { defaultFilters, type ReportFilterValues } from './report-frame';

/** Filters kept in the address, so a report can be bookmarked or sent as a link. */
export function useReportFilters(): [ReportFilterValues, (patch: Partial<ReportFilterValues>) => void] {
  const [params, setParams] = useSearchParams();
  const d = defaultFilters();
  const values: ReportFilterValues = {
    from: params.get('from') || d.from,
    to: params.get('to') || d.to,
    process: params.get('process') ?? '',
    customerId: params.get('customerId') ?? '',
    stationId: params.get('stationId') ?? '',
    bucket: params.get('bucket') || d.bucket,
  };
  const update = (patch: Partial<ReportFilterValues>) => {
    const next = { ...values, ...patch };
    setParams(Object.fromEntries(Object.entries(next).filter(([, v]) => v !== '')), { replace: true });
  };
  return [values, update];
}
