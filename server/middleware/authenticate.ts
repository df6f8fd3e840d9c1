import type { Request, RequestHandler } from 'express';
import type { AuthState } from '../http/api';
import type { AppDeps } from '../app-deps';
import { authService, SESSION_COOKIE, DEVICE_COOKIE } from '../services/auth.service';

/** Who a request comes from: its session cookie and device token (cookie, or `Authorization: Device <token>`). */
export async function readAuth(deps: AppDeps, req: Request): Promise<AuthState> {
  const sessionToken: string | undefined = req.cookies?.[SESSION_COOKIE];
  const header = req.get('authorization');
  const deviceToken: string | undefined = header?.startsWith('Device ') ? header.slice('Device '.length).trim() : req.cookies?.[DEVICE_COOKIE];
  return {
    user: sessionToken ? await authService.resolveSession(deps, sessionToken) : null,
    device: deviceToken ? authService.resolveDevice(deps, deviceToken) : null,
  };
}

/** Reads the session cookie and the device token on every API request. */
export function authenticate(deps: AppDeps): RequestHandler {
  return async (req, _res, next) => {
    try {
      req.auth = await readAuth(deps, req);
      next();
    } catch (error) {
      next(error);
    }
  };
}
