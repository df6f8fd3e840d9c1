import { z } from 'zod';
import path from 'node:path';

/** The documented first-admin password (README): whoever starts with it must change it at first sign-in. */
export const DEFAULT_ADMIN_PASSWORD = 'trayce-admin';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(5180),
  TRAYCE_DATA_DIR: z.string().min(1).default('./data'),
  TRAYCE_SEED: z.enum(['demo', 'none']).default('demo'),
  TRAYCE_ADMIN_EMAIL: z.email().default('admin@trayce.local'),
  TRAYCE_ADMIN_PASSWORD: z.string().min(8).max(72).default(DEFAULT_ADMIN_PASSWORD),
  SMTP_URL: z.string().url().optional(),
  MAIL_FROM: z.string().min(3).optional(),
  TRAYCE_PUBLIC_URL: z.string().url().optional(),
  STRIPE_SECRET_KEY: z.string().trim().min(8).optional(),
  STRIPE_WEBHOOK_SECRET: z.string().trim().min(8).optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});

export interface Env {
  nodeEnv: 'development' | 'production' | 'test';
  port: number;
  dataDir: string;
  seed: 'demo' | 'none';
  adminEmail: string;
  adminPassword: string;
  smtpUrl?: string;
  /** sender of outgoing mail ("Name <address>"); default: the factory name at the public host */
  mailFrom?: string;
  publicUrl: string;
  /** the payment service's secret key; unset: the local checkout fake starts with the app */
  stripeSecretKey?: string;
  /** signing secret of the payment service's webhook endpoint (needed with the secret key) */
  stripeWebhookSecret?: string;
  logLevel: z.infer<typeof envSchema>['LOG_LEVEL'];
}

/** Reads the environment once and fails fast with every problem listed. */
export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Trayce cannot start: the environment has errors\n${lines}`);
  }
  const e = parsed.data;
  if (e.STRIPE_SECRET_KEY && !e.STRIPE_WEBHOOK_SECRET) {
    throw new Error('Trayce cannot start: STRIPE_SECRET_KEY is set but STRIPE_WEBHOOK_SECRET is not (the signing secret of the webhook endpoint, whsec_…)');
  }
  return {
    nodeEnv: e.NODE_ENV,
    port: e.PORT,
    dataDir: path.resolve(e.TRAYCE_DATA_DIR),
    seed: e.TRAYCE_SEED,
    adminEmail: e.TRAYCE_ADMIN_EMAIL,
    adminPassword: e.TRAYCE_ADMIN_PASSWORD,
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    publicUrl: e.TRAYCE_PUBLIC_URL ?? `http://localhost:${e.PORT}`,
    stripeSecretKey: e.STRIPE_SECRET_KEY,
    stripeWebhookSecret: e.STRIPE_WEBHOOK_SECRET,
    logLevel: e.LOG_LEVEL,
  };
}
