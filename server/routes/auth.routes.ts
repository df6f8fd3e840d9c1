import type { Response } from 'express';
import type { Api } from '../http/api';
import type { AppDeps } from '../app-deps';
import { loginBody, badgeBody, localeBody, changePasswordBody } from '@shared/schemas/auth';
import { authService, KNOWN_CLIENT_COOKIE, SESSION_COOKIE } from '../services/auth.service';
import type { SignInLimits } from '../middleware/sign-in-limits';
import { ALL_ROLES } from '@shared/domain/access';
import { calendarService } from '../services/calendar.service';

function setSessionCookie(res: Response, deps: AppDeps, token: string, expiresAt: number) {
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: deps.env.publicUrl.startsWith('https://'),
    path: '/',
    expires: new Date(expiresAt),
  });
}

export function registerAuthRoutes(api: Api, limits: SignInLimits) {
  api.route({ method: 'get', path: '/health', access: 'public', handler: () => ({ ok: true }) });

  api.route({
    method: 'post',
    path: '/auth/login',
    access: 'public',
    before: [limits.password],
    body: loginBody,
    handler: async ({ body, req, res, deps }) => {
      const session = await authService.login(deps, body.email, body.password, {
        address: req.ip ?? 'unknown',
        knownToken: req.cookies?.[KNOWN_CLIENT_COOKIE],
      });
      setSessionCookie(res, deps, session.token, session.expiresAt);
      // marks this browser as one that signed in to the account (its own failure counter)
      res.cookie(KNOWN_CLIENT_COOKIE, session.knownToken, {
        httpOnly: true,
        sameSite: 'lax',
        secure: deps.env.publicUrl.startsWith('https://'),
        path: '/api/auth',
        maxAge: 365 * 24 * 3600_000,
      });
      return { user: session.user };
    },
  });

  api.route({
    method: 'post',
    path: '/auth/badge',
    access: { roles: [], devices: ['tablet'] },
    before: [limits.badge],
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
    access: { roles: ALL_ROLES, beforePasswordChange: true },
    handler: ({ user, device, deps }) => ({
      user: { id: user!.id, name: user!.name, role: user!.role, locale: user!.locale, mustChangePassword: user!.mustChangePassword },
      device,
      // every screen shows times in the factory's zone, not the reader's device's
      timeZone: calendarService.timeZone(deps),
    }),
  });

  api.route({
    method: 'put',
    path: '/auth/me/locale',
    access: { roles: ALL_ROLES, beforePasswordChange: true },
    body: localeBody,
    handler: ({ deps, body, user }) => authService.setLocale(deps, user!.id, body.locale),
  });

  api.route({
    method: 'post',
    path: '/auth/me/password',
    access: { roles: ALL_ROLES, beforePasswordChange: true },
    before: [limits.password],
    body: changePasswordBody,
    handler: ({ deps, body, user }) => authService.changePassword(deps, user!, body.currentPassword, body.newPassword),
  });
}
