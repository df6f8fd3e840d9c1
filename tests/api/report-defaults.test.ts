// Reports open on the last four weeks with data: GET /api/reports/filters says the last factory
// day with scans (Asia/Shanghai in the base seed, UTC+8: 20:30 UTC is 04:30 the next local day).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertFloorOrder, scan, stationId } from '../support/scan-fixtures';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

describe('the period a report opens on', () => {
  it('an empty floor has no last day with data; after a scan it is the factory day of that scan', async () => {
    const manager = await t.agentAs('manager');
    const before = await manager.get('/api/reports/filters');
    expect(before.status).toBe(200);
    expect(before.body.lastDataDay).toBeNull();

    // signed in on the real clock (the agent's cookie jar reads it), then the server's clock is set
    const operator = await t.agentAs('operator');
    const at = Date.parse('2026-11-12T20:30:00.000Z');
    t.setNow(at + 60_000);
    const { trays } = insertFloorOrder(t.deps, { releasedAt: at - 3600_000 });
    const res = await operator.post('/api/scans').send({ events: [scan(trays[0].code, stationId(t.deps, 'STR-1'), 'start', at)] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.results[0].status).toBe('accepted');
    t.setNow(Date.parse('2026-12-04T02:00:00.000Z'));
    const after = await manager.get('/api/reports/filters');
    expect(after.body.lastDataDay).toBe('2026-11-13');
    t.setNow(null);
  });
});
