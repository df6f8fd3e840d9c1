import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CycleTimeReport, FlowReport, LeadTimeReport, OnTimeReport, YieldReport } from '@shared/schemas/reports';
import { reportsKeys } from './reports-keys';

export interface ReportTypes {
  'lead-time': LeadTimeReport;
  'cycle-time': CycleTimeReport;
  flow: FlowReport;
  'on-time': OnTimeReport;
  yield: YieldReport;
}
export type ReportName = keyof ReportTypes;

export const reportQueryOptions = <N extends ReportName>(name: N, params: Record<string, string>) =>
  queryOptions({
    queryKey: reportsKeys.report(name, params),
    queryFn: () => api.get<ReportTypes[N]>(`/reports/${name}`, params),
    staleTime: 60_000,
    placeholderData: keepPreviousData,
  });

export const useReport = <N extends ReportName>(name: N, params: Record<string, string>, enabled = true) =>
  useQuery({ ...reportQueryOptions(name, params), enabled });

/** The CSV of the same report with the same filters (same path with .csv). */
export function reportCsvUrl(name: ReportName, params: Record<string, string>): string {
  const q = new URLSearchParams(Object.entries(params).filter(([, v]) => v !== ''));
  const s = q.toString();
  return `/api/reports/${name}.csv${s ? `?${s}` : ''}`;
}
