import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import bcrypt from 'bcryptjs';
import { SignJWT } from 'jose';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from '../support/test-app';
import { TEST_ADMIN } from '../support/paths';
import { users } from '../../server/db/schema/users';
import { BCRYPT_COST } from '../../server/services/auth.service';

let t: TestApp;
beforeEach(() => {
  t = makeTestApp();
});
afterEach(() => t.close());

const login = (body: unknown) =>
  request(t.app)
    .post('/api/auth/login')
    .send(body as object);

describe('sign-in', () => {
  it('signs the first admin in with an HttpOnly SameSite cookie and answers /me', async () => {
    const res = await login(TEST_ADMIN);
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ role: 'admin', name: 'Administrator' });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/trayce_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const me = await request(t.app).get('/api/auth/me').set('Cookie', cookie.split(';')[0]);
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe('admin');
  });

  it('stores passwords with bcrypt at work factor 10 or more (OWASP Password Storage Cheat Sheet)', () => {
    const row = t.deps.db.select().from(users).where(eq(users.email, TEST_ADMIN.email)).get()!;
    expect(bcrypt.getRounds(row.passwordHash)).toBeGreaterThanOrEqual(10);
    expect(BCRYPT_COST).toBeGreaterThanOrEqual(10);
  });

  it('gives a new token on every sign-in', async () => {
    const a = String((await login(TEST_ADMIN)).headers['set-cookie']).split(';')[0];
    const b = String((await login(TEST_ADMIN)).headers['set-cookie']).split(';')[0];
    expect(a).not.toBe(b);
  });

  it('refuses a wrong password with one clear error and no cookie', async () => {
    const res = await login({ ...TEST_ADMIN, password: 'wrong-password' });
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'invalid_credentials', message: expect.any(String) } });
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  it('throttles an account after repeated failures, briefly (OWASP Authentication Cheat Sheet)', async () => {
    const start = Date.now();
    t.setNow(start);
    for (let i = 0; i < 3; i++) expect((await login({ ...TEST_ADMIN, password: 'nope' })).status).toBe(401);
    // the right password is held back while the delay runs …
    const held = await login(TEST_ADMIN);
    expect(held.status).toBe(429);
    expect(held.body.error.code).toBe('throttled');
    // … and works once it has run out: nobody is locked out for long.
    t.setNow(start + 61_000);
    expect((await login(TEST_ADMIN)).status).toBe(200);
  });

  it('refuses a password longer than 72 bytes when it is set (bcrypt limit, OWASP)', async () => {
    const admin = await t.agentAs('admin');
    const res = await admin.post('/api/users').send({ name: 'Long Pw', email: 'long@test.trayce.local', role: 'sales', password: 'é'.repeat(40) });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_input');
    expect(JSON.stringify(res.body.error.issues)).toMatch(/72 bytes/);
    expect((await admin.get('/api/users')).body.some((u: { email: string }) => u.email === 'long@test.trayce.local')).toBe(false);
  });

  it('ends the session of a user who is switched off, and refuses their sign-in', async () => {
    const admin = await t.agentAs('admin');
    const planner = await t.agentAs('planner');
    expect((await planner.get('/api/auth/me')).status).toBe(200);
    expect((await admin.patch(`/api/users/${planner.user.id}`).send({ active: false })).status).toBe(200);
    expect((await planner.get('/api/auth/me')).status).toBe(401);
    const res = await login({ email: planner.user.email, password: planner.user.password });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('account_inactive');
  });

  it('refuses a tampered token and a token signed with another key', async () => {
    const cookie = String((await login(TEST_ADMIN)).headers['set-cookie']).split(';')[0];
    const [name, token] = cookie.split('=');
    const [h, p, s] = token.split('.');
    const payload = JSON.parse(Buffer.from(p, 'base64url').toString());
    const forged = Buffer.from(JSON.stringify({ ...payload, role: 'admin', sub: 'someone-else' })).toString('base64url');
    expect((await request(t.app).get('/api/auth/me').set('Cookie', `${name}=${h}.${forged}.${s}`)).status).toBe(401);
    const other = await new SignJWT(payload).setProtectedHeader({ alg: 'HS256' }).sign(new Uint8Array(32).fill(7));
    expect((await request(t.app).get('/api/auth/me').set('Cookie', `${name}=${other}`)).status).toBe(401);
  });

  it('expires a session after the idle time and after 12 hours in all (OWASP Session Management)', async () => {
    const start = Date.now();
    t.setNow(start);
    const cookie = String((await login(TEST_ADMIN)).headers['set-cookie']).split(';')[0];
    const me = () => request(t.app).get('/api/auth/me').set('Cookie', cookie);
    t.setNow(start + 59 * 60_000);
    expect((await me()).status).toBe(200);
    t.setNow(start + 59 * 60_000 + 61 * 60_000);
    expect((await me()).status).toBe(401);
    // absolute expiry even when active all the time
    const cookie2 = String((await login(TEST_ADMIN)).headers['set-cookie']).split(';')[0];
    const base = start + 120 * 60_000;
    for (let h = 1; h <= 12; h++) {
      t.setNow(base + h * 55 * 60_000);
      await request(t.app).get('/api/auth/me').set('Cookie', cookie2);
    }
    t.setNow(base + 12 * 3600_000 + 1000);
    expect((await request(t.app).get('/api/auth/me').set('Cookie', cookie2)).status).toBe(401);
  });

  it('logs out: the token stops working', async () => {
    const cookie = String((await login(TEST_ADMIN)).headers['set-cookie']).split(';')[0];
    expect((await request(t.app).post('/api/auth/logout').set('Cookie', cookie)).status).toBe(204);
    expect((await request(t.app).get('/api/auth/me').set('Cookie', cookie)).status).toBe(401);
  });

  it('signs an operator in with badge and PIN only on a registered tablet', async () => {
    const admin = await t.agentAs('admin');
    const station = (await admin.get('/api/stations')).body[0];
    await admin
      .post('/api/users')
      .send({ name: 'Op One', email: 'op1@test.trayce.local', role: 'operator', password: 'operator-pw-1', badge: 'B-1001', pin: '4321' })
      .expect(201);
    const device = (await admin.post('/api/devices').send({ name: 'Tablet A', stationId: station.id })).body;
    expect(device.token).toBeTruthy();
    // without a tablet: not allowed
    expect((await request(t.app).post('/api/auth/badge').send({ badge: 'B-1001', pin: '4321' })).status).toBe(401);
    const tablet = request.agent(t.app);
    const paired = await tablet.post('/api/devices/pair').send({ code: device.pairingCode });
    expect(paired.status).toBe(200);
    expect((await tablet.post('/api/auth/badge').send({ badge: 'B-1001', pin: '0000' })).status).toBe(401);
    const ok = await tablet.post('/api/auth/badge').send({ badge: 'B-1001', pin: '4321' });
    expect(ok.status).toBe(200);
    expect(ok.body.user).toMatchObject({ name: 'Op One', role: 'operator' });
    // the pairing code is used up
    expect((await request(t.app).post('/api/devices/pair').send({ code: device.pairingCode })).status).toBe(404);
  });
});

describe("each person's language", () => {
  it('starts in English, is set by the person themselves and comes back with /me and the next sign-in', async () => {
    const planner = await t.agentAs('planner');
    expect((await planner.get('/api/auth/me')).body.user.locale).toBe('en');
    const set = await planner.put('/api/auth/me/locale').send({ locale: 'zh-CN' });
    expect(set.status).toBe(200);
    expect(set.body).toEqual({ locale: 'zh-CN' });
    expect((await planner.get('/api/auth/me')).body.user.locale).toBe('zh-CN');
    const again = await login({ email: planner.user.email, password: planner.user.password });
    expect(again.body.user.locale).toBe('zh-CN');
  });

  it('refuses a language the app does not have, and changes nothing', async () => {
    const sales = await t.agentAs('sales');
    const res = await sales.put('/api/auth/me/locale').send({ locale: 'fr' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_input');
    expect((await sales.get('/api/auth/me')).body.user.locale).toBe('en');
  });

  it("lets an admin set someone's language", async () => {
    const admin = await t.agentAs('admin');
    const op = await t.agentAs('operator', { badge: 'B-7001', pin: '2580' });
    const res = await admin.patch(`/api/users/${op.user.id}`).send({ locale: 'zh-CN' });
    expect(res.status).toBe(200);
    expect(res.body.locale).toBe('zh-CN');
    expect((await op.get('/api/auth/me')).body.user.locale).toBe('zh-CN');
    expect((await admin.get('/api/users')).body.find((u: { id: string }) => u.id === op.user.id).locale).toBe('zh-CN');
  });
});
