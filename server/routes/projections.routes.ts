import type { Api } from '../http/api';
import { OFFICE, WHAT_IF } from '@shared/domain/access';
import { whatIfBodySchema } from '@shared/schemas/projections';
import { whatIfService } from '../services/what-if.service';
import { measuredCoverage } from '../backtest/coverage';

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
}
