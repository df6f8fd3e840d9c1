import { z } from 'zod';
import type { Api } from '../http/api';
import { ADMIN_ONLY, ALL_ROLES } from '@shared/domain/access';
import { stationBody, updateStationBody } from '@shared/schemas/stations';
import { stationsService } from '../services/stations.service';

const idParams = z.object({ id: z.string().min(1) });

export function registerStationRoutes(api: Api) {
  api.route({
    method: 'get',
    path: '/stations',
    access: { roles: ALL_ROLES, devices: ['tablet', 'wall'] },
    handler: ({ deps }) => stationsService.list(deps),
  });
  api.route({
    method: 'post',
    path: '/stations',
    access: { roles: ADMIN_ONLY },
    body: stationBody,
    status: 201,
    handler: ({ deps, body, user }) => stationsService.create(deps, body, user!.id),
  });
  api.route({
    method: 'patch',
    path: '/stations/:id',
    access: { roles: ADMIN_ONLY },
    params: idParams,
    body: updateStationBody,
    handler: ({ deps, params, body, user }) => stationsService.update(deps, params.id, body, user!.id),
  });
  api.route({
    method: 'get',
    path: '/reason-codes',
    access: { roles: ALL_ROLES, devices: ['tablet'] },
    handler: ({ deps }) => stationsService.reasonCodes(deps),
  });
}
