import { z } from 'zod';
import type { Api } from '../http/api';
import { ADMIN_ONLY } from '@shared/domain/access';
import { mailService, queueLateDigest } from '../services/mail.service';

const limitQuery = z.object({ limit: z.coerce.number().int().min(1).max(500).default(200) });

export function registerMailRoutes(api: Api) {
  api.route({
    method: 'get',
    path: '/mail',
    access: { roles: ADMIN_ONLY },
    query: limitQuery,
    handler: ({ deps, query }) => mailService.caught(deps, query.limit),
  });
  api.route({
    method: 'get',
    path: '/mail/queue',
    access: { roles: ADMIN_ONLY },
    query: limitQuery,
    handler: ({ deps, query }) => mailService.queue(deps, query.limit),
  });
  api.route({
    method: 'post',
    path: '/mail/queue/:id/retry',
    access: { roles: ADMIN_ONLY },
    params: z.object({ id: z.string().min(1) }),
    handler: ({ deps, params, user }) => mailService.retry(deps, params.id, user!.id),
  });
  api.route({
    method: 'post',
    path: '/mail/late-digest',
    access: { roles: ADMIN_ONLY },
    handler: ({ deps }) => queueLateDigest(deps),
  });
}
