import { z } from 'zod';
import type { Api } from '../http/api';
import { OFFICE, WHAT_IF } from '@shared/domain/access';
import { whatIfBodySchema } from '@shared/schemas/projections';
import { whatIfService } from '../services/what-if.service';
import { measuredCoverage } from '../backtest/coverage';
import { projectionHistoryService } from '../services/projection-history.service';

const idParams = z.object({ id: z.string().min(1).max(64) });

export function registerProjectionRoutes(api: Api) {
  // a question, not a change: it answers with dates and stores nothing
  api.route({
    method: 'post',
    path: '/projections/what-if',
    access: { roles: WHAT_IF },
    body: whatIfBodySchema,
    handler: ({ deps, body }) => whatIfService.project(deps, body),
  });
  // how often the 85 % date held in the last kept backtest (shown beside projected dates)
  api.route({
    method: 'get',
    path: '/projections/coverage',
    access: { roles: OFFICE },
    handler: () => ({ coverage: measuredCoverage() }),
  });
  // how the order's projected dates moved, day by day (the order page's small chart)
  api.route({
    method: 'get',
    path: '/orders/:id/date-history',
    access: { roles: OFFICE },
    params: idParams,
    handler: ({ deps, params }) => projectionHistoryService.forOrder(deps, params.id),
  });
}
