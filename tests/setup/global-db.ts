import fs from 'node:fs';
import path from 'node:path';
import { pino } from 'pino';
import { openDb, migrateDb } from '../../server/db/client';
import { seedBase } from '../../server/seed/base';
import { loadEnv } from '../../server/env';
import { PROJECT_ROOT, TEST_ADMIN } from '../support/paths';

/** Migrates and base-seeds one template database; each test file copies it (fast, isolated). */
export default async function setup() {
  const TEST_ROOT = path.join(PROJECT_ROOT, '.tmp', 'tests', `run-${process.pid}-${Date.now()}`);
  process.env.TRAYCE_TEST_ROOT = TEST_ROOT;
  fs.mkdirSync(TEST_ROOT, { recursive: true });
  const db = openDb(path.join(TEST_ROOT, 'template.db'));
  migrateDb(db);
  const env = loadEnv({
    TRAYCE_DATA_DIR: TEST_ROOT,
    TRAYCE_SEED: 'none',
    TRAYCE_ADMIN_EMAIL: TEST_ADMIN.email,
    TRAYCE_ADMIN_PASSWORD: TEST_ADMIN.password,
    NODE_ENV: 'test',
  });
  await seedBase({
    db,
    env,
    log: pino({ level: 'silent' }),
    keys: { session: new Uint8Array(32), traveller: new Uint8Array(32) },
    now: () => Date.now(),
    loginAttemptsPerWindow: 1000,
  });
  db.$client.pragma('wal_checkpoint(TRUNCATE)');
  db.$client.close();
  return () => fs.rmSync(TEST_ROOT, { recursive: true, force: true });
}
