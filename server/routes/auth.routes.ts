import type { Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { Api } from '../http/api';
import type { AppDeps } from '../app-deps';
import { loginBody, badgeBody, localeBody } from '@shared/schemas/auth';
import { authService, SESSION_COOKIE } from '../services/auth.service';
import { ALL_ROLES } from '@shared/domain/access';
import { throttled } from '../errors';

function setSessionCookie(res: Response, deps: AppDeps, token: string, expiresAt: number) {
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: deps.env.publicUrl.startsWith('https://'),
    path: '/',
    expires: new Date(expiresAt),
  });
}

export function registerAuthRoutes(api: Api, deps: AppDeps) {
  // Per-address throttle of failed attempts (OWASP): successful sign-ins do not count.
  const perAddress = rateLimit({
    windowMs: 15 * 60_000,
    limit: deps.loginAttemptsPerWindow,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(throttled('Too many sign-in attempts from this address. Wait a few minutes.', 60)),
  });

  api.route({ method: 'get', path: '/health', access: 'public', handler: () => ({ ok: true }) });

  api.route({
    method: 'post',
    path: '/auth/login',
    access: 'public',
    before: [perAddress],
    body: loginBody,
    handler: async ({ body, res, deps }) => {
      const session = await authService.login(deps, body.email, body.password);
      setSessionCookie(res, deps, session.token, session.expiresAt);
      return { user: session.user };
    },
  });

  api.route({
    method: 'post',
    path: '/auth/badge',
    access: { roles: [], devices: ['tablet'] },
    before: [perAddress],
    body: badgeBody,
    handler: async ({ body, res, deps, device }) => {
      const session = await authService.badgeLogin(deps, device!, body.badge, body.pin);
      setSessionCookie(res, deps, session.token, session.expiresAt);
      return { user: session.user };
    },
  });

  api.route({
    method: 'post',
    path: '/auth/logout',
    access: 'public',
    handler: ({ req, res, deps }) => {
      if (req.auth?.user) authService.logout(deps, req.auth.user.sessionId);
      res.clearCookie(SESSION_COOKIE, { path: '/' });
      return undefined;
    },
  });

  api.route({
    method: 'get',
    path: '/auth/me',
    access: { roles: ALL_ROLES },
    handler: ({ user, device }) => ({
      user: { id: user!.id, name: user!.name, role: user!.role, locale: user!.locale },
      device,
    }),
  });

  api.route({
    method: 'put',
    path: '/auth/me/locale',
    access: { roles: ALL_ROLES },
    body: localeBody,
    handler: ({ deps, body, user }) => authService.setLocale(deps, user!.id, body.locale),
  });
}
