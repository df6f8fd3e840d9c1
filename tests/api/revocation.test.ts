// Access ends when it is taken away: a new password, a tablet switched off.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertBadgeUser, insertFloorOrder, pairTablet, scan, tabletAgent } from '../support/scan-fixtures';

let t: TestApp;
beforeEach(() => {
  t = makeTestApp();
});
afterEach(() => t.close());

describe('sessions end when access is taken away', () => {
  it('an admin’s password reset ends every session of that person: the old cookie stops working', async () => {
    const admin = await t.agentAs('admin');
    const planner = await t.agentAs('planner');
    expect((await planner.get('/api/auth/me')).status).toBe(200);
    expect((await admin.patch(`/api/users/${planner.user.id}`).send({ password: 'a-new-password-1' })).status).toBe(200);
    expect((await planner.get('/api/auth/me')).status).toBe(401);
    expect((await planner.get('/api/orders')).status).toBe(401);
  });

  it('switching a tablet off ends the badge sign-ins on it: their scans are no longer accepted', async () => {
    const admin = await t.agentAs('admin');
    const device = pairTablet(t, 'STR-1');
    const op = await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '1357');
    const tablet = await tabletAgent(t, device.token, op);
    const tray = insertFloorOrder(t.deps, { releasedAt: Date.now() - 3600_000, trays: 2 }).trays;
    expect((await tablet.post('/api/scans').send({ events: [scan(tray[0].code, device.stationId, 'start', Date.now())] })).body.results[0].status).toBe(
      'accepted',
    );
    expect((await admin.patch(`/api/devices/${device.deviceId}`).send({ active: false })).status).toBe(200);
    const after = await tablet.post('/api/scans').send({ events: [scan(tray[1].code, device.stationId, 'start', Date.now())] });
    expect(after.status).toBe(401);
    expect(t.deps.db.$client.prepare('select count(*) n from scan_events where tray_id = ?').get(tray[1].id)).toEqual({ n: 0 });
  });
});
