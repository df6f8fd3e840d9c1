import { z } from 'zod';
import { rateLimit } from 'express-rate-limit';
import type { RequestHandler } from 'express';
import type { Api } from '../http/api';
import { FLOOR_LEADS } from '@shared/domain/access';
import { photoShareBodySchema, portalApproveBodySchema, portalChangesBodySchema, portalProofParamsSchema } from '@shared/schemas/payments';
import { portalService } from '../services/portal.service';
import { photosService } from '../services/photos.service';
import { throttled } from '../errors';

/** Requests per address per minute on the customer's order page and its files (a person is far below it). */
export const PORTAL_PER_MINUTE = 60;
/** Writes per address per minute (approve, ask for changes, pay): a person taps a handful. */
export const PORTAL_WRITES_PER_MINUTE = 10;

const tokenParams = z.object({ token: z.string().max(200) });

/** The customer's page is for her eyes: not indexed, not cached, not framed, no referrer. */
const privateAnswer: RequestHandler = (_req, res, next) => {
  res.set('X-Robots-Tag', 'noindex, nofollow, noarchive');
  res.set('Cache-Control', 'no-store');
  res.set('Referrer-Policy', 'no-referrer');
  next();
};

function limiter(limit: number, what: string) {
  return rateLimit({
    windowMs: 60_000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(throttled(`Too many ${what} from this address. Wait a minute and try again.`, 60)),
  });
}

export function registerPortalRoutes(api: Api) {
  const reads = limiter(PORTAL_PER_MINUTE, 'requests for order pages');
  const writes = limiter(PORTAL_WRITES_PER_MINUTE, 'changes to order pages');

  api.route({
    method: 'get',
    path: '/public/orders/:token',
    access: 'public',
    before: [privateAnswer, reads],
    params: tokenParams,
    handler: ({ deps, params }) => portalService.order(deps, params.token),
  });
  api.route({
    method: 'post',
    path: '/public/orders/:token/checkout',
    access: 'public',
    before: [privateAnswer, writes],
    params: tokenParams,
    handler: ({ deps, params }) => portalService.checkout(deps, params.token),
  });
  api.route({
    method: 'post',
    path: '/public/orders/:token/proofs/:revision/approve',
    access: 'public',
    before: [privateAnswer, writes],
    params: portalProofParamsSchema,
    body: portalApproveBodySchema,
    handler: ({ deps, params, body }) => portalService.approve(deps, params.token, params.revision, body.name),
  });
  api.route({
    method: 'post',
    path: '/public/orders/:token/proofs/:revision/changes',
    access: 'public',
    before: [privateAnswer, writes],
    params: portalProofParamsSchema,
    body: portalChangesBodySchema,
    handler: ({ deps, params, body }) => portalService.requestChanges(deps, params.token, params.revision, body.comment),
  });
  for (const kind of ['file', 'thumbnail'] as const) {
    api.route({
      method: 'get',
      path: `/public/orders/:token/proofs/:revision/${kind}`,
      access: 'public',
      before: [privateAnswer, reads],
      params: portalProofParamsSchema,
      handler: ({ deps, params, res }) => {
        const f = portalService.proofFile(deps, params.token, params.revision, kind === 'thumbnail');
        res.type(f.mime).set('Content-Disposition', `inline; filename="${f.name}"`).send(f.content);
      },
    });
  }
  api.route({
    method: 'get',
    path: '/public/status/:token/photos/:photoId',
    access: 'public',
    before: [privateAnswer, reads],
    params: z.object({ token: z.string().max(200), photoId: z.string().min(1).max(80) }),
    handler: ({ deps, params, res }) => {
      const f = portalService.photo(deps, params.token, params.photoId);
      res.type(f.mime).set('Content-Disposition', 'inline').send(f.content);
    },
  });

  // The supervisor's side: a tray's QC photos, and which of them the customer may see.
  api.route({
    method: 'get',
    path: '/trays/:id/photos',
    access: { roles: FLOOR_LEADS },
    params: z.object({ id: z.string().min(1).max(80) }),
    handler: ({ deps, params }) => photosService.ofTray(deps, params.id),
  });
  api.route({
    method: 'get',
    path: '/photos/:id/file',
    access: { roles: FLOOR_LEADS },
    params: z.object({ id: z.string().min(1).max(80) }),
    handler: ({ deps, params, res }) => {
      const f = photosService.file(deps, params.id);
      res.type(f.mime).set('Cache-Control', 'private, max-age=3600').send(f.content);
    },
  });
  api.route({
    method: 'patch',
    path: '/photos/:id',
    access: { roles: ['supervisor', 'admin'] },
    params: z.object({ id: z.string().min(1).max(80) }),
    body: photoShareBodySchema,
    handler: ({ deps, params, body, user }) => photosService.setShareable(deps, params.id, body.shareable, user!.id),
  });
}
