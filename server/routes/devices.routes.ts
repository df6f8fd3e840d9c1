import { z } from 'zod';
import { rateLimit } from 'express-rate-limit';
import type { Api } from '../http/api';
import type { AppDeps } from '../app-deps';
import { ADMIN_ONLY, ALL_ROLES } from '@shared/domain/access';
import { createDeviceBody, updateDeviceBody, pairDeviceBody } from '@shared/schemas/stations';
import { devicesService } from '../services/devices.service';
import { DEVICE_COOKIE } from '../services/auth.service';
import { throttled } from '../errors';

const idParams = z.object({ id: z.string().min(1) });

export function registerDeviceRoutes(api: Api, deps: AppDeps) {
  const pairLimit = rateLimit({
    windowMs: 15 * 60_000,
    limit: deps.loginAttemptsPerWindow,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(throttled('Too many pairing attempts from this address. Wait a few minutes.', 60)),
  });

  api.route({ method: 'get', path: '/devices', access: { roles: ADMIN_ONLY }, handler: ({ deps }) => devicesService.list(deps) });
  api.route({
    method: 'post',
    path: '/devices',
    access: { roles: ADMIN_ONLY },
    body: createDeviceBody,
    status: 201,
    handler: ({ deps, body, user }) => devicesService.create(deps, body, user!.id),
  });
  api.route({
    method: 'patch',
    path: '/devices/:id',
    access: { roles: ADMIN_ONLY },
    params: idParams,
    body: updateDeviceBody,
    handler: ({ deps, params, body, user }) => devicesService.update(deps, params.id, body, user!.id),
  });
  api.route({
    method: 'post',
    path: '/devices/:id/pairing',
    access: { roles: ADMIN_ONLY },
    params: idParams,
    handler: ({ deps, params, user }) => devicesService.repair(deps, params.id, user!.id),
  });
  api.route({
    method: 'post',
    path: '/devices/pair',
    access: 'public',
    before: [pairLimit],
    body: pairDeviceBody,
    handler: ({ deps, body, res }) => {
      const { token, device } = devicesService.pair(deps, body.code);
      res.cookie(DEVICE_COOKIE, token, {
        httpOnly: true,
        sameSite: 'lax',
        secure: deps.env.publicUrl.startsWith('https://'),
        path: '/',
        maxAge: 5 * 365 * 24 * 3600_000,
      });
      return { device };
    },
  });
  api.route({
    method: 'get',
    path: '/devices/current',
    access: { roles: ALL_ROLES, devices: ['tablet', 'wall'] },
    handler: ({ deps, device }) => (device ? devicesService.current(deps, device.id) : null),
  });
  api.route({
    method: 'post',
    path: '/devices/forget',
    access: 'public',
    handler: ({ res }) => {
      res.clearCookie(DEVICE_COOKIE, { path: '/' });
      return undefined;
    },
  });
}
