import type { RequestHandler } from 'express';
import type { AppDeps } from '../app-deps';
import { authService, SESSION_COOKIE, DEVICE_COOKIE } from '../services/auth.service';

/** Reads the session cookie and the device token (cookie, or `Authorization: Device <token>`). */
export function authenticate(deps: AppDeps): RequestHandler {
  return async (req, _res, next) => {
    try {
      const sessionToken: string | undefined = req.cookies?.[SESSION_COOKIE];
      const header = req.get('authorization');
      const deviceToken: string | undefined =
        header?.startsWith('Device ') ? header.slice('Device '.length).trim() : req.cookies?.[DEVICE_COOKIE];
      req.auth = {
        user: sessionToken ? await authService.resolveSession(deps, sessionToken) : null,
        device: deviceToken ? authService.resolveDevice(deps, deviceToken) : null,
      };
      next();
    } catch (error) {
      next(error);
    }
  };
}
