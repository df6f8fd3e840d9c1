import { rateLimit, type RateLimitRequestHandler } from 'express-rate-limit';
import type { AppDeps } from '../app-deps';
import { throttled } from '../errors';

/**
 * Per-address budgets of failed attempts (express-rate-limit; successful requests do not
 * count). Password sign-in and badge + PIN checks have separate counters: wrong PINs on a
 * tablet never hold back office sign-ins from the same address, nor the other way round.
 */
export interface SignInLimits {
  password: RateLimitRequestHandler;
  /** badge sign-in on a tablet and supervisor approvals (overrides) */
  badge: RateLimitRequestHandler;
}

export function makeSignInLimits(deps: AppDeps): SignInLimits {
  const limiter = (what: string) =>
    rateLimit({
      windowMs: 15 * 60_000,
      limit: deps.loginAttemptsPerWindow,
      skipSuccessfulRequests: true,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: (_req, _res, next) => next(throttled(`Too many failed ${what} from this address. Wait a few minutes.`, 60)),
    });
  return { password: limiter('sign-ins'), badge: limiter('badge and PIN checks') };
}
