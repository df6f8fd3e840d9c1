import { z } from 'zod';
import { rateLimit } from 'express-rate-limit';
import type { RequestHandler } from 'express';
import type { Api } from '../http/api';
import { SALES_VIEW, SHARE_LINKS } from '@shared/domain/access';
import { orderContactSchema, shareLinkBodySchema, proofRevisionParamsSchema, salesSearchQuerySchema } from '@shared/schemas/shipping';
import { salesService } from '../services/sales.service';
import { shareLinksService } from '../services/share-links.service';
import { queueProofReady } from '../services/mail.service';
import { throttled } from '../errors';

const orderParams = z.object({ id: z.string().min(1) });

/** Requests per address per minute on the public status page (a person reloading is far below it). */
export const PUBLIC_STATUS_PER_MINUTE = 30;

/** The public status answer is for one customer's eyes: not indexed, not cached, not framed. */
const privateAnswer: RequestHandler = (_req, res, next) => {
  res.set('X-Robots-Tag', 'noindex, nofollow, noarchive');
  res.set('Cache-Control', 'no-store');
  res.set('Referrer-Policy', 'no-referrer');
  next();
};

export function registerSalesRoutes(api: Api) {
  const publicLimit = rateLimit({
    windowMs: 60_000,
    limit: PUBLIC_STATUS_PER_MINUTE,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(throttled('Too many requests for status pages from this address. Wait a minute and reload.', 60)),
  });

  api.route({
    method: 'get',
    path: '/sales/orders',
    access: { roles: SALES_VIEW },
    query: salesSearchQuerySchema,
    handler: ({ deps, query }) => salesService.search(deps, query.q, query.limit),
  });
  api.route({
    method: 'get',
    path: '/sales/orders/:id',
    access: { roles: SALES_VIEW },
    params: orderParams,
    handler: ({ deps, params }) => salesService.detail(deps, params.id),
  });
  api.route({
    method: 'get',
    path: '/sales/owners',
    access: { roles: SALES_VIEW },
    handler: ({ deps }) => salesService.owners(deps),
  });
  api.route({
    method: 'put',
    path: '/orders/:id/contact',
    access: { roles: SHARE_LINKS },
    params: orderParams,
    body: orderContactSchema,
    handler: ({ deps, params, body, user }) => salesService.setContact(deps, params.id, body, user!.id),
  });
  api.route({
    method: 'post',
    path: '/orders/:id/share',
    access: { roles: SHARE_LINKS },
    params: orderParams,
    body: shareLinkBodySchema,
    status: 201,
    handler: ({ deps, params, body, user }) => shareLinksService.create(deps, params.id, user!.id, body),
  });
  api.route({
    method: 'delete',
    path: '/orders/:id/share',
    access: { roles: SHARE_LINKS },
    params: orderParams,
    handler: ({ deps, params, user }) => shareLinksService.revoke(deps, params.id, user!.id),
  });
  api.route({
    method: 'post',
    path: '/orders/:id/proofs/:revision/send',
    access: { roles: SHARE_LINKS },
    params: proofRevisionParamsSchema,
    status: 202,
    handler: ({ deps, params, user }) => queueProofReady(deps, params.id, params.revision, user!.id),
  });
  api.route({
    method: 'get',
    path: '/public/status/:token',
    access: 'public',
    before: [privateAnswer, publicLimit],
    params: z.object({ token: z.string() }),
    handler: ({ deps, params }) => shareLinksService.publicStatus(deps, params.token),
  });
}
