import { z } from 'zod';
import { rateLimit } from 'express-rate-limit';
import type { RequestHandler } from 'express';
import type { Api } from '../http/api';
import { ADMIN_ONLY, QUOTING } from '@shared/domain/access';
import { acceptQuoteBodySchema, quoteBodySchema } from '@shared/schemas/quotes';
import { costingSettingsPatchSchema } from '@shared/schemas/costing';
import { quotesService } from '../services/quotes.service';
import { throttled } from '../errors';

const quoteParams = z.object({ id: z.string().min(1).max(64) });
const tokenParams = z.object({ token: z.string().max(200) });

/** Requests per address per minute on the public quote page and its accept. */
export const PUBLIC_QUOTE_PER_MINUTE = 30;

/** A customer's quote is for her eyes: not indexed, not cached, no referrer. */
const privateAnswer: RequestHandler = (_req, res, next) => {
  res.set('X-Robots-Tag', 'noindex, nofollow, noarchive');
  res.set('Cache-Control', 'no-store');
  res.set('Referrer-Policy', 'no-referrer');
  next();
};

export function registerQuoteRoutes(api: Api) {
  const publicLimit = rateLimit({
    windowMs: 60_000,
    limit: PUBLIC_QUOTE_PER_MINUTE,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(throttled('Too many requests for quotes from this address. Wait a minute and reload.', 60)),
  });

  api.route({ method: 'get', path: '/quotes', access: { roles: QUOTING }, handler: ({ deps }) => quotesService.list(deps) });
  api.route({
    method: 'post',
    path: '/quotes',
    access: { roles: QUOTING },
    body: quoteBodySchema,
    status: 201,
    handler: ({ deps, body, user }) => quotesService.create(deps, body, user!.id),
  });
  api.route({
    method: 'get',
    path: '/quotes/:id',
    access: { roles: QUOTING },
    params: quoteParams,
    handler: ({ deps, params }) => quotesService.get(deps, params.id),
  });
  api.route({
    method: 'put',
    path: '/quotes/:id',
    access: { roles: QUOTING },
    params: quoteParams,
    body: quoteBodySchema,
    handler: ({ deps, params, body, user }) => quotesService.update(deps, params.id, body, user!.id),
  });
  api.route({
    method: 'post',
    path: '/quotes/:id/send',
    access: { roles: QUOTING },
    params: quoteParams,
    handler: ({ deps, params, user }) => quotesService.send(deps, params.id, user!.id),
  });
  api.route({
    method: 'delete',
    path: '/quotes/:id/share',
    access: { roles: QUOTING },
    params: quoteParams,
    handler: ({ deps, params, user }) => quotesService.revokeLinks(deps, params.id, user!.id),
  });
  api.route({
    method: 'get',
    path: '/quotes/:id/quote.pdf',
    access: { roles: QUOTING },
    params: quoteParams,
    handler: async ({ deps, params, res }) => {
      const pdf = await quotesService.pdf(deps, params.id);
      res.set('Content-Type', 'application/pdf');
      res.set('Content-Disposition', `inline; filename="quote-${params.id}.pdf"`);
      res.send(pdf);
    },
  });
  api.route({
    method: 'get',
    path: '/public/quotes/:token',
    access: 'public',
    before: [privateAnswer, publicLimit],
    params: tokenParams,
    handler: ({ deps, params }) => quotesService.publicView(deps, params.token),
  });
  api.route({
    method: 'post',
    path: '/public/quotes/:token/accept',
    access: 'public',
    before: [privateAnswer, publicLimit],
    params: tokenParams,
    body: acceptQuoteBodySchema,
    status: 201,
    handler: ({ deps, params, body }) => quotesService.accept(deps, params.token, body),
  });

  api.route({ method: 'get', path: '/admin/costing', access: { roles: ADMIN_ONLY }, handler: ({ deps }) => quotesService.settings(deps) });
  api.route({
    method: 'put',
    path: '/admin/costing',
    access: { roles: ADMIN_ONLY },
    body: costingSettingsPatchSchema,
    handler: ({ deps, body, user }) => quotesService.saveSettings(deps, body, user!.id),
  });
}
