import { z } from 'zod';
import path from 'node:path';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(5180),
  TRAYCE_DATA_DIR: z.string().min(1).default('./data'),
  TRAYCE_SEED: z.enum(['demo', 'none']).default('demo'),
  TRAYCE_ADMIN_EMAIL: z.email().default('admin@trayce.local'),
  TRAYCE_ADMIN_PASSWORD: z.string().min(8).max(72).default('trayce-admin'),
  SMTP_URL: z.string().url().optional(),
  MAIL_FROM: z.string().min(3).optional(),
  TRAYCE_PUBLIC_URL: z.string().url().optional(),
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
    logLevel: e.LOG_LEVEL,
  };
}
