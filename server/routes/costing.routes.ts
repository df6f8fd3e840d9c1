import type { Response } from 'express';
import { z } from 'zod';
import type { Api } from '../http/api';
import { COSTING_READERS } from '@shared/domain/access';
import { reportQuery } from '@shared/schemas/reports';
import { costingReportCsv, costingService } from '../services/costing.service';

const idParams = z.object({ id: z.string().min(1).max(64) });

function sendCsv(res: Response, name: string, body: string) {
  res.status(200);
  res.set('Content-Type', 'text/csv; charset=utf-8');
  res.set('Content-Disposition', `attachment; filename="${name}.csv"`);
  // a byte-order mark lets spreadsheet programs read the text as UTF-8
  res.send(`\uFEFF${body}`);
}

/** Quoted against actual: the manager's view of what orders cost to make. */
export function registerCostingRoutes(api: Api) {
  api.route({
    method: 'get',
    path: '/orders/:id/costing',
    access: { roles: COSTING_READERS },
    params: idParams,
    handler: ({ deps, params }) => costingService.order(deps, params.id),
  });
  api.route({
    method: 'get',
    path: '/reports/costing',
    access: { roles: COSTING_READERS },
    query: reportQuery,
    handler: ({ deps, query }) => costingService.report(deps, query),
  });
  api.route({
    method: 'get',
    path: '/reports/costing.csv',
    access: { roles: COSTING_READERS },
    query: reportQuery,
    handler: ({ deps, query, res }) => {
      const data = costingService.report(deps, query);
      sendCsv(res, `costing-${data.window.from.slice(0, 10)}-${data.window.to.slice(0, 10)}`, costingReportCsv(data));
    },
  });
}
