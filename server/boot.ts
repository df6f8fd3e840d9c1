import fs from 'node:fs';
import path from 'node:path';
import { pino } from 'pino';
import type { Env } from './env';
import type { AppDeps } from './app-deps';
import { openDb, migrateDb } from './db/client';
import { loadOrCreateKey } from './lib/keys';
import { seedIfEmpty } from './seed/seed';

/** Opens the data folder: database migrated, keys present, seeded when empty. */
export async function boot(env: Env, overrides: Partial<AppDeps> = {}): Promise<AppDeps> {
  // the data folder holds the database, keys, uploads and backups: only the server user may read it
  fs.mkdirSync(env.dataDir, { recursive: true, mode: 0o700 });
  fs.chmodSync(env.dataDir, 0o700);
  const db = openDb(path.join(env.dataDir, 'trayce.db'));
  migrateDb(db);
  const log = pino({ level: env.logLevel, base: undefined });
  const deps: AppDeps = {
    db,
    env,
    log,
    keys: { session: loadOrCreateKey(env.dataDir, 'session'), traveller: loadOrCreateKey(env.dataDir, 'traveller') },
    now: () => Date.now(),
    loginAttemptsPerWindow: 30,
    ...overrides,
  };
  await seedIfEmpty(deps);
  return deps;
}
