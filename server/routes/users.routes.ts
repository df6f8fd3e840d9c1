import { z } from 'zod';
import type { Api } from '../http/api';
import { ADMIN_ONLY } from '@shared/domain/access';
import { createUserBody, updateUserBody } from '@shared/schemas/users';
import { usersService } from '../services/users.service';

const idParams = z.object({ id: z.string().min(1) });

export function registerUserRoutes(api: Api) {
  api.route({ method: 'get', path: '/users', access: { roles: ADMIN_ONLY }, handler: ({ deps }) => usersService.list(deps) });
  api.route({
    method: 'post',
    path: '/users',
    access: { roles: ADMIN_ONLY },
    body: createUserBody,
    status: 201,
    handler: ({ deps, body, user }) => usersService.create(deps, body, user!.id),
  });
  api.route({
    method: 'patch',
    path: '/users/:id',
    access: { roles: ADMIN_ONLY },
    params: idParams,
    body: updateUserBody,
    handler: ({ deps, params, body, user }) => usersService.update(deps, params.id, body, user!.id),
  });
}
