import type { Db } from './db/client';
import type { Env } from './env';
import type { Logger } from 'pino';
import type { SendMailOptions } from 'nodemailer';
import type Stripe from 'stripe';

/** What every route handler and service can reach. Features add optional members here. */
export interface AppDeps {
  db: Db;
  env: Env;
  log: Logger;
  keys: {
    /** signs session tokens */
    session: Uint8Array;
    /** signs traveller QR codes */
    traveller: Uint8Array;
  };
  /** the server clock in epoch ms; tests may pin it */
  now: () => number;
  /** per-address sign-in attempts allowed per 15 minutes */
  loginAttemptsPerWindow: number;
  /** outgoing mail (set by startMail); without it, messages stay queued */
  mail?: { send: (message: SendMailOptions) => Promise<unknown>; from: string };
  /** hosted checkout (set by startPayments): the real service, or the local fake; without it, checkout answers 503 */
  payments?: { stripe: Stripe; webhookSecret: string; mode: 'service' | 'local' };
}
