// Guessing PINs and passwords, the way an attacker at a tablet or on the network would
// (OWASP Authentication Cheat Sheet: throttle failed attempts with growing delays, do not tell
// which part was wrong, and do not let the lockout keep the owner out).
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import request from 'supertest';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertBadgeUser, insertFloorOrder, pairTablet } from '../support/scan-fixtures';
import { usersService } from '../../server/services/users.service';

const T0 = Math.floor(Date.now() / 60_000) * 60_000;
let t: TestApp;
beforeEach(() => {
  t = makeTestApp();
  t.setNow(T0);
});
afterEach(() => t.close());

const tablet = (token: string, address = '10.1.0.1') =>
  request(t.app).post('/api/auth/badge').set('Authorization', `Device ${token}`).set('X-Forwarded-For', address);
const badgeSignIn = (token: string, badge: string, pin: string, address?: string) => tablet(token, address).send({ badge, pin });

function approve(token: string, body: { badge: string; pin: string; code: string; stationId: string }) {
  return request(t.app)
    .post('/api/scans/overrides')
    .set('Authorization', `Device ${token}`)
    .set('X-Forwarded-For', '10.1.0.1')
    .send({ reason: 'Agreed on the floor', kind: 'wrong_station', ...body });
}

describe('supervisor approvals (POST /api/scans/overrides) on a tablet with nobody signed in', () => {
  it('a wrong badge, a wrong PIN, an operator’s right PIN and a switched-off supervisor all get the same answer', async () => {
    const device = pairTablet(t, 'TRM-1');
    const sup = await insertBadgeUser(t, 'supervisor', 'S-7001', '8024');
    const op = await insertBadgeUser(t, 'operator', 'B-7001', '1357');
    const off = await insertBadgeUser(t, 'supervisor', 'S-7002', '2468');
    await usersService.update(t.deps, off.id, { active: false }, 'test');
    const tray = insertFloorOrder(t.deps, { releasedAt: T0 - 3600_000 }).trays[0];
    const base = { code: tray.code, stationId: device.stationId };
    const answers = [];
    for (const guess of [
      { badge: 'S-9999', pin: '8024' }, // no such badge
      { badge: sup.badge, pin: '0000' }, // wrong PIN
      { badge: op.badge, pin: op.pin }, // right PIN, not a supervisor
      { badge: off.badge, pin: off.pin }, // right PIN, switched off
    ]) {
      const res = await approve(device.token, { ...base, ...guess });
      answers.push({ status: res.status, body: res.body });
    }
    expect(answers[0]).toEqual({ status: 401, body: { error: { code: 'invalid_credentials', message: expect.any(String) } } });
    for (const a of answers) expect(a).toEqual(answers[0]);
    // and nothing was approved
    expect(t.deps.db.$client.prepare('select count(*) n from overrides').get()).toEqual({ n: 0 });
  });

  it('a tablet guessing PINs across many badges is held after 10 failures, for every badge, and the run is listed for supervisors', async () => {
    const device = pairTablet(t, 'TRM-1');
    const other = pairTablet(t, 'POL-1');
    const sup = await insertBadgeUser(t, 'supervisor', 'S-7101', '8024');
    const tray = insertFloorOrder(t.deps, { releasedAt: T0 - 3600_000 }).trays[0];
    for (let i = 0; i < 10; i++) {
      // a different badge every time: the per-badge delay never starts, the per-tablet one does
      const res = await approve(device.token, { badge: `S-${8000 + i}`, pin: '1234', code: tray.code, stationId: device.stationId });
      expect(res.status, `guess ${i + 1}`).toBe(401);
    }
    const held = await approve(device.token, { badge: sup.badge, pin: sup.pin, code: tray.code, stationId: device.stationId });
    expect(held.status).toBe(429);
    expect(held.body.error.code).toBe('throttled');
    // sign-in on the same tablet is held too: one counter for every badge + PIN check on it
    expect((await badgeSignIn(device.token, sup.badge, sup.pin)).status).toBe(429);
    // another tablet is not affected
    expect((await badgeSignIn(other.token, sup.badge, sup.pin)).status).toBe(200);

    const supervisor = await t.agentAs('supervisor');
    const list = (await supervisor.get('/api/scans/exceptions')).body as { code: string; deviceId: string; message: string; params: Record<string, unknown> }[];
    const run = list.find((e) => e.code === 'badge_failures');
    expect(run).toMatchObject({ deviceId: device.deviceId, params: { failures: 10, scope: 'tablet', purpose: 'override' } });
    expect(run!.message).toMatch(/10 wrong supervisor approvals/);
  });
});

describe('badge sign-in on a tablet', () => {
  it('an unknown badge is throttled exactly like a real one (badges cannot be enumerated)', async () => {
    const device = pairTablet(t, 'TRM-1');
    await insertBadgeUser(t, 'operator', 'B-7201', '1357');
    const statuses = async (badge: string) => {
      const out: number[] = [];
      for (let i = 0; i < 5; i++) out.push((await badgeSignIn(device.token, badge, '0000')).status);
      return out;
    };
    const real = await statuses('B-7201');
    t.setNow(T0 + 3600_000); // both runs start from nothing
    const unknown = await statuses('B-7299');
    expect(real).toEqual([401, 401, 401, 429, 429]);
    expect(unknown).toEqual(real);
  });

  it('after the per-badge delay the right PIN signs in at once; refused tries do not stretch the wait', async () => {
    const device = pairTablet(t, 'TRM-1');
    const op = await insertBadgeUser(t, 'operator', 'B-7301', '1357');
    for (let i = 0; i < 3; i++) expect((await badgeSignIn(device.token, op.badge, '0000')).status).toBe(401);
    // while the 1 s delay runs, even the right PIN waits, and the refusals are not counted
    for (let i = 0; i < 5; i++) expect((await badgeSignIn(device.token, op.badge, op.pin)).status).toBe(429);
    t.setNow(T0 + 1000);
    expect((await badgeSignIn(device.token, op.badge, op.pin)).status).toBe(200);
  });

  it('per-address counters: wrong PINs from the tablets’ address never hold back password sign-in from it, nor the other way round', async () => {
    t.close();
    t = makeTestApp({ loginAttemptsPerWindow: 5 });
    t.setNow(T0);
    const op = await insertBadgeUser(t, 'operator', 'B-7401', '1357');
    const office = await t.agentAs('planner');
    const address = '10.2.0.7';
    // five tablets behind one address (so no single tablet's counter is what stops them)
    for (let i = 0; i < 5; i++) {
      const d = pairTablet(t, 'TRM-1');
      expect((await badgeSignIn(d.token, `B-${9000 + i}`, '0000', address)).status).toBe(401);
    }
    const fresh = pairTablet(t, 'TRM-1');
    expect((await badgeSignIn(fresh.token, op.badge, op.pin, address)).status).toBe(429);
    const login = (password: string) => request(t.app).post('/api/auth/login').set('X-Forwarded-For', address).send({ email: office.user.email, password });
    expect((await login(office.user.password)).status).toBe(200);
    // and five wrong passwords from another address leave badge sign-in from it alone
    const address2 = '10.2.0.8';
    for (let i = 0; i < 5; i++) {
      expect(
        (
          await request(t.app)
            .post('/api/auth/login')
            .set('X-Forwarded-For', address2)
            .send({ email: `nobody${i}@test.trayce.local`, password: 'wrong-password' })
        ).status,
      ).toBe(401);
    }
    expect(
      (await request(t.app).post('/api/auth/login').set('X-Forwarded-For', address2).send({ email: office.user.email, password: office.user.password })).status,
    ).toBe(429);
    expect((await badgeSignIn(fresh.token, op.badge, op.pin, address2)).status).toBe(200);
  });
});

describe('password sign-in lockouts that an attacker cannot renew', () => {
  const signIn = (email: string, password: string, address: string, cookie?: string) => {
    const req = request(t.app).post('/api/auth/login').set('X-Forwarded-For', address);
    if (cookie) req.set('Cookie', cookie);
    return req.send({ email, password });
  };

  it('a guesser who fails again at every expiry never keeps the owner out: the owner’s browser and other addresses get in', async () => {
    const victim = await t.agentAs('planner');
    // the owner signed in from this browser before: it holds a known-client cookie
    const first = await signIn(victim.user.email, victim.user.password, '10.3.0.1');
    const known = String(first.headers['set-cookie']).match(/trayce_known=[^;]+/)![0];

    let now = T0;
    for (let i = 0; i < 10; i++) {
      // the attacker waits out each delay exactly and guesses wrong again
      let res = await signIn(victim.user.email, `guess-${i}`, '10.3.0.99');
      while (res.status === 429) {
        now += res.body.error.retryAfterSeconds * 1000;
        t.setNow(now);
        res = await signIn(victim.user.email, `guess-${i}`, '10.3.0.99');
      }
      expect(res.status).toBe(401);
      // … and the owner, a moment later, on the same address as the attacker but in their own browser
      expect((await signIn(victim.user.email, victim.user.password, '10.3.0.99', known)).status).toBe(200);
      // … or from another address
      expect((await signIn(victim.user.email, victim.user.password, '10.3.0.2')).status).toBe(200);
    }
    // the attacker is still held back
    expect((await signIn(victim.user.email, 'one-more', '10.3.0.99')).status).toBe(429);
  }, 120_000);

  it('the right password right after the delay gets in, even from the address that failed', async () => {
    const user = await t.agentAs('manager');
    for (let i = 0; i < 6; i++) {
      t.setNow(T0 + i * 60_000); // each delay waited out
      expect((await signIn(user.user.email, 'wrong-password', '10.4.0.1')).status).toBe(401);
    }
    const held = await signIn(user.user.email, user.user.password, '10.4.0.1');
    expect(held.status).toBe(429);
    expect(held.body.error.retryAfterSeconds).toBe(8); // 1, 2, 4, 8 s after the third failure
    t.setNow(T0 + 5 * 60_000 + 8_000);
    expect((await signIn(user.user.email, user.user.password, '10.4.0.1')).status).toBe(200);
  });

  it('many addresses guessing one account share a budget; a browser the owner used before is not held by it', async () => {
    const user = await t.agentAs('sales');
    const known = String((await signIn(user.user.email, user.user.password, '10.5.0.1')).headers['set-cookie']).match(/trayce_known=[^;]+/)![0];
    for (let i = 0; i < 50; i++) expect((await signIn(user.user.email, 'wrong-password', `10.6.${i}.1`)).status).toBe(401);
    expect((await signIn(user.user.email, user.user.password, '10.7.0.1')).status).toBe(429);
    expect((await signIn(user.user.email, user.user.password, '10.5.0.1', known)).status).toBe(200);
  }, 120_000);

  it('an unknown e-mail is throttled the same way as a real one', async () => {
    const user = await t.agentAs('sales');
    const run = async (email: string) => {
      const out: number[] = [];
      for (let i = 0; i < 5; i++) out.push((await signIn(email, 'wrong-password', '10.8.0.1')).status);
      return out;
    };
    const real = await run(user.user.email);
    const unknown = await run(`nobody-${crypto.randomUUID()}@test.trayce.local`);
    expect(real).toEqual([401, 401, 401, 429, 429]);
    expect(unknown).toEqual(real);
  });
});
