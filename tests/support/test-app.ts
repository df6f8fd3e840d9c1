import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { pino } from 'pino';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { openDb } from '../../server/db/client';
import { createApp } from '../../server/app';
import { loadEnv } from '../../server/env';
import type { AppDeps } from '../../server/app-deps';
import { usersService } from '../../server/services/users.service';
import { templateDb, testRoot, TEST_ADMIN } from './paths';
import type { Role } from '@shared/domain/vocabulary';

export interface TestApp {
  deps: AppDeps;
  app: ReturnType<typeof createApp>['app'];
  api: ReturnType<typeof createApp>['api'];
  dataDir: string;
  /** a signed-in Supertest agent for a new user of that role */
  agentAs(role: Role, extra?: { badge?: string; pin?: string }): Promise<TestAgent & { user: { id: string; email: string; password: string } }>;
  /** let the test move the server clock */
  setNow(ms: number | null): void;
  close(): void;
}

/** A fresh app on its own copy of the migrated template database (a real SQLite file). */
export function makeTestApp(overrides: Partial<AppDeps> = {}): TestApp {
  const dataDir = path.join(testRoot(), `app-${crypto.randomUUID()}`);
  fs.mkdirSync(dataDir, { recursive: true });
  fs.copyFileSync(templateDb(), path.join(dataDir, 'trayce.db'));
  const db = openDb(path.join(dataDir, 'trayce.db'));
  let pinned: number | null = null;
  const env = loadEnv({
    TRAYCE_DATA_DIR: dataDir,
    TRAYCE_SEED: 'none',
    TRAYCE_ADMIN_EMAIL: TEST_ADMIN.email,
    TRAYCE_ADMIN_PASSWORD: TEST_ADMIN.password,
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
  });
  const deps: AppDeps = {
    db,
    env,
    log: pino({ level: 'silent' }),
    keys: { session: crypto.randomBytes(32), traveller: crypto.randomBytes(32) },
    now: () => pinned ?? Date.now(),
    loginAttemptsPerWindow: 10_000,
    ...overrides,
  };
  const { app, api } = createApp(deps, { serveClient: false });
  let counter = 0;
  return {
    deps,
    app,
    api,
    dataDir,
    async agentAs(role, extra = {}) {
      counter += 1;
      const email = `${role}${counter}-${crypto.randomUUID().slice(0, 6)}@test.trayce.local`;
      const password = `pw-${crypto.randomUUID()}`;
      const created = await usersService.create(deps, { name: `Test ${role} ${counter}`, email, role, password, ...extra }, null);
      const agent = request.agent(app);
      const res = await agent.post('/api/auth/login').send({ email, password });
      if (res.status !== 200) throw new Error(`sign-in failed in test setup: ${res.status} ${JSON.stringify(res.body)}`);
      return Object.assign(agent, { user: { id: created.id, email, password } });
    },
    setNow(ms) {
      pinned = ms;
    },
    close() {
      db.$client.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
