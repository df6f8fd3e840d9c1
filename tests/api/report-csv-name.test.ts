// The CSV a report downloads is named after the days its From and To fields showed, in the
// factory's zone (Asia/Shanghai in the base seed, UTC+8): the window starts at local midnight,
// which is the evening before in UTC, and its end is the instant after the last day.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

describe('report CSV file names', () => {
  it('match the From and To days, not the UTC day before', async () => {
    const manager = await t.agentAs('manager');
    for (const report of ['lead-time', 'cycle-time', 'flow', 'on-time', 'yield']) {
      const res = await manager.get(`/api/reports/${report}.csv`).query({ from: '2026-11-02', to: '2026-11-29' }).buffer(true);
      expect(res.status, report).toBe(200);
      expect(res.headers['content-disposition'], report).toBe(`attachment; filename="${report}-2026-11-02-2026-11-29.csv"`);
    }
  });

  it('a one-day window names that day twice', async () => {
    const manager = await t.agentAs('manager');
    const res = await manager.get('/api/reports/on-time.csv').query({ from: '2026-01-01', to: '2026-01-01' }).buffer(true);
    expect(res.headers['content-disposition']).toBe('attachment; filename="on-time-2026-01-01-2026-01-01.csv"');
  });
});
