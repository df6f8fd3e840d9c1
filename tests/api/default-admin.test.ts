// The documented first-admin password (README: admin@trayce.local / trayce-admin) must never leave
// an account open: a demo start makes no such account, and on any other start the first admin
// must choose a new password before anything else answers. Following the OWASP Authentication
// Cheat Sheet (change of default credentials) and the ASVS 2.1 requirement that initial
// passwords be changed at first use.
import { afterEach, describe, expect, it, vi } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import request from 'supertest';
import { pino } from 'pino';
import { openDb, migrateDb } from '../../server/db/client';
import { createApp } from '../../server/app';
import { DEFAULT_ADMIN_PASSWORD, loadEnv } from '../../server/env';
import type { AppDeps } from '../../server/app-deps';
import { seedIfEmpty } from '../../server/seed/seed';
import { DEMO_PASSWORD } from '../../server/seed/demo-people';
import { testRoot } from '../support/paths';

// The demo factory's own content is seeded and checked in demo-seed.test.ts (about two minutes);
// here only the choice of accounts around it matters, so its body is left out.
const seedDemo = vi.hoisted(() => vi.fn(async () => {}));
vi.mock('../../server/seed/demo', () => ({ seedDemo }));

const ADMIN_EMAIL = 'admin@trayce.local';
const open: AppDeps[] = [];
const dirs: string[] = [];

function freshDeps(env: Record<string, string>): AppDeps {
  const dataDir = path.join(testRoot(), `first-admin-${crypto.randomUUID()}`);
  fs.mkdirSync(dataDir, { recursive: true });
  dirs.push(dataDir);
  const db = openDb(path.join(dataDir, 'trayce.db'));
  migrateDb(db);
  const deps: AppDeps = {
    db,
    env: loadEnv({ TRAYCE_DATA_DIR: dataDir, NODE_ENV: 'test', LOG_LEVEL: 'silent', ...env }),
    log: pino({ level: 'silent' }),
    keys: { session: crypto.randomBytes(32), traveller: crypto.randomBytes(32) },
    now: () => Date.now(),
    loginAttemptsPerWindow: 10_000,
  };
  open.push(deps);
  return deps;
}

afterEach(() => {
  for (const d of open.splice(0)) d.db.$client.close();
  for (const d of dirs.splice(0)) fs.rmSync(d, { recursive: true, force: true });
  seedDemo.mockClear();
});

const activeUsers = (deps: AppDeps) =>
  deps.db.$client.prepare('select email, password_hash, must_change_password from users where active = 1').all() as {
    email: string;
    password_hash: string;
    must_change_password: number;
  }[];

describe('the documented default admin password', () => {
  it('is not the demo people’s password (README lists both)', () => {
    expect(DEFAULT_ADMIN_PASSWORD).toBe('trayce-admin');
    expect(DEMO_PASSWORD).not.toBe(DEFAULT_ADMIN_PASSWORD);
  });

  it('a demo start leaves no account that opens with it, and its sign-in is refused', async () => {
    const deps = freshDeps({ TRAYCE_SEED: 'demo' });
    expect(deps.env.adminPassword).toBe(DEFAULT_ADMIN_PASSWORD);
    expect(await seedIfEmpty(deps)).toBe('seeded');
    expect(seedDemo).toHaveBeenCalledTimes(1);
    for (const u of activeUsers(deps)) expect(bcrypt.compareSync(DEFAULT_ADMIN_PASSWORD, u.password_hash), u.email).toBe(false);
    expect(activeUsers(deps).some((u) => u.email === ADMIN_EMAIL)).toBe(false);
    const { app } = createApp(deps, { serveClient: false });
    const res = await request(app).post('/api/auth/login').send({ email: ADMIN_EMAIL, password: DEFAULT_ADMIN_PASSWORD });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('invalid_credentials');
  });

  it('a demo start with an admin password of the installer’s own keeps that admin, free to work', async () => {
    const deps = freshDeps({ TRAYCE_SEED: 'demo', TRAYCE_ADMIN_PASSWORD: 'own-long-password-7' });
    await seedIfEmpty(deps);
    const admin = activeUsers(deps).find((u) => u.email === ADMIN_EMAIL);
    expect(admin?.must_change_password).toBe(0);
  });

  it('on a non-demo start the first admin must change it at first sign-in; nothing else answers until then', async () => {
    const deps = freshDeps({ TRAYCE_SEED: 'none' });
    await seedIfEmpty(deps);
    expect(seedDemo).not.toHaveBeenCalled();
    const { app } = createApp(deps, { serveClient: false });
    const admin = request.agent(app);
    const login = await admin.post('/api/auth/login').send({ email: ADMIN_EMAIL, password: DEFAULT_ADMIN_PASSWORD });
    expect(login.status).toBe(200);
    expect(login.body.user).toMatchObject({ role: 'admin', mustChangePassword: true });
    expect((await admin.get('/api/auth/me')).body.user.mustChangePassword).toBe(true);

    // the attack: use the published password to make a second admin, read the people, change a station
    const before = deps.db.$client.prepare('select count(*) n from users').get();
    for (const [method, url, body] of [
      ['post', '/api/users', { name: 'Second Admin', email: 'second@test.trayce.local', role: 'admin', password: 'long-enough-password' }],
      ['get', '/api/users', undefined],
      ['get', '/api/orders', undefined],
      ['get', '/api/stations', undefined],
    ] as const) {
      const res = method === 'get' ? await admin.get(url) : await admin.post(url).send(body);
      expect(res.status, url).toBe(403);
      expect(res.body.error.code, url).toBe('password_change_required');
    }
    expect(deps.db.$client.prepare('select count(*) n from users').get()).toEqual(before);

    // a wrong current password, the default again and a short one are refused, nothing changed
    const wrong = await admin.post('/api/auth/me/password').send({ currentPassword: 'not-it-at-all', newPassword: 'a-brand-new-password' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.code).toBe('wrong_password');
    const same = await admin.post('/api/auth/me/password').send({ currentPassword: DEFAULT_ADMIN_PASSWORD, newPassword: DEFAULT_ADMIN_PASSWORD });
    expect(same.body.error.code).toBe('password_reused');
    expect((await admin.post('/api/auth/me/password').send({ currentPassword: DEFAULT_ADMIN_PASSWORD, newPassword: 'short' })).status).toBe(400);
    expect((await admin.get('/api/users')).status).toBe(403);

    // a second browser signed in with the default password is signed out by the change
    const other = request.agent(app);
    expect((await other.post('/api/auth/login').send({ email: ADMIN_EMAIL, password: DEFAULT_ADMIN_PASSWORD })).status).toBe(200);
    const changed = await admin.post('/api/auth/me/password').send({ currentPassword: DEFAULT_ADMIN_PASSWORD, newPassword: 'a-brand-new-password' });
    expect(changed.status).toBe(200);
    expect((await admin.get('/api/users')).status).toBe(200);
    expect((await admin.get('/api/auth/me')).body.user.mustChangePassword).toBe(false);
    expect((await other.get('/api/auth/me')).status).toBe(401);
    expect((await request(app).post('/api/auth/login').send({ email: ADMIN_EMAIL, password: DEFAULT_ADMIN_PASSWORD })).status).toBe(401);
    expect((await request(app).post('/api/auth/login').send({ email: ADMIN_EMAIL, password: 'a-brand-new-password' })).status).toBe(200);
  });

  it('a database made before this rule, with the admin still on the default password, holds it at the next start', async () => {
    const deps = freshDeps({ TRAYCE_SEED: 'none' });
    await seedIfEmpty(deps);
    deps.db.$client.prepare('update users set must_change_password = 0').run();
    expect(await seedIfEmpty(deps)).toBe('kept');
    expect(activeUsers(deps).find((u) => u.email === ADMIN_EMAIL)?.must_change_password).toBe(1);
  });
});
