import { useSearchParams } from 'react-router';
import { defaultFilters, type ReportFilterValues } from './report-frame';
import { useReportFilterOptions } from '../api/get-filters';

/**
 * Filters kept in the address, so a report can be bookmarked or sent as a link. Without a period
 * in the address, the last four weeks with data; `ready` turns true once that is known.
 */
export function useReportFilters(): [ReportFilterValues, (patch: Partial<ReportFilterValues>) => void, boolean] {
  const [params, setParams] = useSearchParams();
  const options = useReportFilterOptions();
  const d = defaultFilters(options.data?.lastDataDay);
  const ready = (!!params.get('from') && !!params.get('to')) || !options.isPending;
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
  return [values, update, ready];
}
