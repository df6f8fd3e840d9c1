import { Router, type Request, type Response, type RequestHandler } from 'express';
import type { z } from 'zod';
import type { Locale, Role } from '@shared/domain/vocabulary';
import type { AppDeps } from '../app-deps';
import { checkBodyKind, type BodyKind } from '../middleware/same-origin';
import { badInput, forbidden, notSignedIn, passwordChangeRequired, type ErrorIssue } from '../errors';

export interface SessionUser {
  id: string;
  name: string;
  role: Role;
  locale: Locale;
  sessionId: string;
  /** a first admin still on the documented default password: only the routes that change it answer */
  mustChangePassword: boolean;
}

export interface DeviceAuth {
  id: string;
  name: string;
  kind: 'tablet' | 'wall';
  stationId: string | null;
}

export interface AuthState {
  user: SessionUser | null;
  device: DeviceAuth | null;
}

declare module 'express-serve-static-core' {
  interface Request {
    auth?: AuthState;
  }
}

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/**
 * Who may call a route: `public`, or a list of roles (signed-in user), optionally also a kind of
 * registered device (a wall display reads the floor without a person signed in).
 */
export type Access =
  | 'public'
  | {
      roles: readonly Role[];
      devices?: readonly DeviceAuth['kind'][];
      /** open to a person who must change their password before anything else (sign-in info, the change itself) */
      beforePasswordChange?: boolean;
    };

export interface HandlerContext<P, Q, B> {
  req: Request;
  res: Response;
  params: P;
  query: Q;
  body: B;
  /** the signed-in person, or null on public and device-only calls */
  user: SessionUser | null;
  device: DeviceAuth | null;
  deps: AppDeps;
}

export interface RouteSpec<P, Q, B> {
  method: Method;
  path: string;
  access: Access;
  params?: z.ZodType<P>;
  query?: z.ZodType<Q>;
  body?: z.ZodType<B>;
  /** status for a successful answer with a body (default 200; 204 when the handler returns undefined) */
  status?: number;
  /** what a write carries: JSON (default), a file (multipart/form-data), or either */
  bodyKind?: BodyKind;
  /**
   * `signed`: a server-to-server POST that proves itself by a signature over its raw body (the
   * payment webhook). Only such a route is let through the same-origin rule; see decision 0011.
   */
  origin?: 'signed';
  /** extra middleware run after the access check (uploads, rate limits) */
  before?: RequestHandler[];
  handler: (ctx: HandlerContext<P, Q, B>) => unknown | Promise<unknown>;
}

export interface RegisteredRoute {
  method: Method;
  path: string;
  access: Access;
  /** what a write to this route must carry (see server/middleware/same-origin.ts) */
  bodyKind: BodyKind;
  /** checked by its own signature instead of the same-origin rule */
  signed: boolean;
}

function toIssues(error: z.ZodError): ErrorIssue[] {
  return error.issues.map((i) => ({ path: i.path as (string | number)[], message: i.message, code: i.code }));
}

function parse<T>(schema: z.ZodType<T> | undefined, value: unknown, where: string): T {
  if (!schema) return value as T;
  const result = schema.safeParse(value);
  if (!result.success) throw badInput(`The request ${where} is not valid.`, toIssues(result.error));
  return result.data;
}

/** Checks the caller against a route's access rule; throws 401 or 403. */
export function checkAccess(access: Access, auth: AuthState | undefined): void {
  if (access === 'public') return;
  const user = auth?.user ?? null;
  const device = auth?.device ?? null;
  if (user) {
    if (user.mustChangePassword && !access.beforePasswordChange) throw passwordChangeRequired();
    if (access.roles.includes(user.role)) return;
    if (device && access.devices?.includes(device.kind)) return;
    throw forbidden();
  }
  if (device && access.devices?.includes(device.kind)) return;
  throw notSignedIn();
}

/**
 * The one way to add an API route: every route states its access rule, and the registry lets a
 * test walk every route to prove the rule is enforced.
 */
export class Api {
  readonly router = Router();
  readonly routes: RegisteredRoute[] = [];
  /** `METHOD /path` of the routes exempt from the same-origin rule by their signature check */
  readonly signedRoutes = new Set<string>();

  constructor(private readonly deps: AppDeps) {}

  route<P = Record<string, string>, Q = unknown, B = unknown>(spec: RouteSpec<P, Q, B>): void {
    const bodyKind: BodyKind = spec.bodyKind ?? 'json';
    const signed = spec.origin === 'signed';
    if (signed) {
      if (spec.method !== 'post' || spec.access !== 'public' || spec.path.includes(':'))
        throw new Error(`A signed route is a public POST to a fixed path: ${spec.path}`);
      this.signedRoutes.add(`POST ${spec.path}`);
    }
    this.routes.push({ method: spec.method, path: spec.path, access: spec.access, bodyKind, signed });
    const guard: RequestHandler = (req, _res, next) => {
      checkBodyKind(bodyKind, req);
      checkAccess(spec.access, req.auth);
      next();
    };
    const handle: RequestHandler = async (req, res) => {
      const params = parse(spec.params, req.params, 'path');
      const query = parse(spec.query, req.query ?? {}, 'query');
      const body = parse(spec.body, req.body ?? {}, 'body');
      const result = await spec.handler({
        req,
        res,
        params,
        query,
        body,
        user: req.auth?.user ?? null,
        device: req.auth?.device ?? null,
        deps: this.deps,
      });
      if (res.headersSent) return;
      if (result === undefined) res.status(204).end();
      else res.status(spec.status ?? 200).json(result);
    };
    this.router[spec.method](spec.path, guard, ...(spec.before ?? []), handle);
  }
}
