import type { Response } from 'express';
import type { Api } from '../http/api';
import { OFFICE, REPORT_READERS } from '@shared/domain/access';
import type { Role } from '@shared/domain/vocabulary';
import { reportQuery, type ReportWindow } from '@shared/schemas/reports';
import { localDate } from '@shared/domain/time-zone';
import { reportsCsv, reportsService } from '../services/reports.service';
import { projectionService } from '../services/projection.service';

const WITH_SALES: readonly Role[] = [...REPORT_READERS, 'sales'];

function sendCsv(res: Response, name: string, body: string) {
  res.status(200);
  res.set('Content-Type', 'text/csv; charset=utf-8');
  res.set('Content-Disposition', `attachment; filename="${name}.csv"`);
  // a byte-order mark lets spreadsheet programs read the text as UTF-8
  res.send(`\uFEFF${body}`);
}

/**
 * "on-time-2026-11-02-2026-11-29": the report and its first and last day in the factory's zone,
 * the days the From and To fields showed (the window's end is the instant after its last day).
 */
export function csvFileName(report: string, window: ReportWindow): string {
  const first = localDate(window.timeZone, Date.parse(window.from));
  const last = localDate(window.timeZone, Math.max(Date.parse(window.from), Date.parse(window.to) - 1));
  return `${report}-${first}-${last}`;
}

export function registerReportRoutes(api: Api) {
  const reports = [
    { path: 'lead-time', roles: WITH_SALES, json: reportsService.leadTime, csv: reportsCsv.leadTime },
    { path: 'cycle-time', roles: REPORT_READERS, json: reportsService.cycleTime, csv: reportsCsv.cycleTime },
    { path: 'flow', roles: REPORT_READERS, json: reportsService.flow, csv: reportsCsv.flow },
    { path: 'on-time', roles: WITH_SALES, json: reportsService.onTime, csv: reportsCsv.onTime },
    { path: 'yield', roles: REPORT_READERS, json: reportsService.yield, csv: reportsCsv.yield },
  ] as const;
  for (const r of reports) {
    api.route({
      method: 'get',
      path: `/reports/${r.path}`,
      access: { roles: r.roles },
      query: reportQuery,
      handler: ({ deps, query }) => r.json(deps, query),
    });
    api.route({
      method: 'get',
      path: `/reports/${r.path}.csv`,
      access: { roles: r.roles },
      query: reportQuery,
      handler: ({ deps, query, res }) => {
        const data = r.json(deps, query);
        sendCsv(res, csvFileName(r.path, data.window), (r.csv as (d: typeof data) => string)(data));
      },
    });
  }
  api.route({
    method: 'get',
    path: '/reports/filters',
    access: { roles: WITH_SALES },
    handler: ({ deps }) => reportsService.filters(deps),
  });
  api.route({
    method: 'get',
    path: '/reports/late-risk',
    access: { roles: OFFICE },
    handler: ({ deps }) => projectionService.lateRisk(deps),
  });
  api.route({
    method: 'get',
    path: '/projections',
    access: { roles: OFFICE },
    handler: ({ deps }) => [...projectionService.forOrders(deps).values()],
  });
}
