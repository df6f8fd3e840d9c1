import { z } from 'zod';
import type { Api } from '../http/api';
import { FLOOR_LEADS } from '@shared/domain/access';
import { createLoadBody } from '@shared/schemas/loads';
import { loadsService } from '../services/loads.service';

export function registerLoadRoutes(api: Api) {
  api.route({ method: 'get', path: '/loads', access: { roles: FLOOR_LEADS }, handler: ({ deps }) => loadsService.overview(deps) });
  api.route({
    method: 'post',
    path: '/loads',
    access: { roles: FLOOR_LEADS },
    body: createLoadBody,
    status: 201,
    handler: ({ deps, body, user }) => loadsService.create(deps, body, user!.id),
  });
  api.route({
    method: 'post',
    path: '/loads/:id/split',
    access: { roles: FLOOR_LEADS },
    params: z.object({ id: z.string().min(1) }),
    handler: ({ deps, params, user }) => loadsService.split(deps, params.id, user!.id),
  });
}
