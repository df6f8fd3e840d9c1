import type { Request, RequestHandler } from 'express';
import type { Env } from '../env';
import { AppError } from '../errors';

/** Methods that change state: the only ones the same-origin and body-kind rules apply to. */
const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export function isWrite(method: string): boolean {
  return WRITE_METHODS.has(method.toUpperCase());
}

function originOf(url: string): string | null {
  try {
    return new URL(url).origin.toLowerCase();
  } catch {
    return null;
  }
}

/**
 * Refuses a state-changing request that a browser sent from another origin: the `Origin` header
 * when present must be the app's own (the request's scheme and Host, or TRAYCE_PUBLIC_URL);
 * without it, `Sec-Fetch-Site` when present must be `same-origin` or `none`. A request with neither
 * header is not from a browser page (curl, tests, scripts) and passes. Header checks only: no
 * database access, so the scan path pays a few string compares.
 */
export function sameOrigin(env: Env, signedRoutes: ReadonlySet<string> = new Set()): RequestHandler {
  const configured = originOf(env.publicUrl);
  return (req, _res, next) => {
    if (!isWrite(req.method)) return next();
    // The one exemption: a route declared `origin: 'signed'` (the payment webhook, posted by the
    // payment service's servers) is authenticated by the signature over its body instead, which
    // its handler verifies before anything changes. Exact method and path only.
    if (signedRoutes.has(`${req.method.toUpperCase()} ${req.path}`)) return next();
    const origin = req.get('origin');
    if (origin !== undefined) {
      const given = origin.trim().toLowerCase();
      const own = `${req.protocol}://${req.get('host') ?? ''}`.toLowerCase();
      if (given === own || (configured !== null && given === configured)) return next();
      return next(crossOrigin());
    }
    const site = req.get('sec-fetch-site');
    if (site !== undefined && site !== 'same-origin' && site !== 'none') return next(crossOrigin());
    next();
  };
}

function crossOrigin(): AppError {
  return new AppError(403, 'cross_origin', 'This change must come from a Trayce page on this server; requests from other sites are refused.');
}

/**
 * What a write route takes as its body: JSON (the default), a multipart form carrying a file, or
 * either (a CSV preview takes an uploaded file or pasted text).
 */
export type BodyKind = 'json' | 'file' | 'json-or-file';

function hasBody(req: Request): boolean {
  if (req.headers['transfer-encoding'] !== undefined) return true;
  const length = Number(req.headers['content-length'] ?? 0);
  return Number.isNaN(length) || length > 0;
}

/**
 * The one body rule for write routes: a JSON route takes `application/json`; an upload route
 * takes `multipart/form-data` (and a route that takes either accepts both). A JSON route may also be called with no body and no Content-Type
 * (DELETE, approve, logout): an empty body carries nothing to forge. Any other content type
 * (a form post, text/plain) is refused before the body is read.
 */
export function checkBodyKind(kind: BodyKind, req: Request): void {
  if (!isWrite(req.method)) return;
  const type = req.get('content-type');
  if (type === undefined || type.trim() === '') {
    if (kind !== 'file' && !hasBody(req)) return;
    throw unsupported(kind);
  }
  const media = type.split(';')[0]!.trim().toLowerCase();
  if (media === 'application/json' && kind !== 'file') return;
  if (media === 'multipart/form-data' && kind !== 'json') return;
  throw unsupported(kind);
}

function unsupported(kind: BodyKind): AppError {
  const wanted = {
    json: 'as JSON (Content-Type: application/json)',
    file: 'as a multipart form with the file (Content-Type: multipart/form-data)',
    'json-or-file': 'as JSON (Content-Type: application/json) or as a multipart form with the file',
  }[kind];
  return new AppError(415, 'unsupported_media_type', `Send this request ${wanted}.`);
}
