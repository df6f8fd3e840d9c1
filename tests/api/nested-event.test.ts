// Issue: one event nested 50,000 levels deep made the whole batch answer 500. One bad event never
// fails the others: it is answered on its own, and what is kept of it for the refusal is bounded.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pino } from 'pino';
import { sql } from 'drizzle-orm';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertFloorOrder, scan, stationId } from '../support/scan-fixtures';
import { scanRejections } from '../../server/db/schema/scans';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp({ log: pino({ level: 'error' }) });
});
afterAll(() => t.close());

describe('a deeply nested event in a scan batch', () => {
  it('is refused on its own as invalid_event; the good event beside it is accepted; the stored refusal stays small', async () => {
    const operator = await t.agentAs('operator');
    const { trays } = insertFloorOrder(t.deps, { releasedAt: Date.now() - 24 * 3600_000 });
    const depth = 50_000;
    const nested = `${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`;
    const good = JSON.stringify(scan(trays[0].code, stationId(t.deps, 'STR-1'), 'start', Date.now()));
    const body = `{"events":[{"id":"deep-1","code":${JSON.stringify(trays[0].code)},"extra":${nested}},${good}]}`;
    const before = t.deps.db
      .select({ n: sql<number>`count(*)` })
      .from(scanRejections)
      .get()!.n;
    const res = await operator.post('/api/scans').set('content-type', 'application/json').send(body);
    // either the whole body is refused up front as bad input (400) or the event alone is refused;
    // never a 500, and never at the cost of the good event when the batch is read
    expect(res.status).not.toBe(500);
    if (res.status === 200) {
      expect(res.body.results[0]).toMatchObject({ id: 'deep-1', status: 'rejected', code: 'invalid_event' });
      expect(res.body.results[1].status).toBe('accepted');
      const rows = t.deps.db.$client.prepare('select length(payload) n from scan_rejections order by rowid desc limit 1').all() as { n: number }[];
      expect(
        t.deps.db
          .select({ n: sql<number>`count(*)` })
          .from(scanRejections)
          .get()!.n,
      ).toBe(before + 1);
      expect(rows[0].n).toBeLessThan(20_000);
    } else {
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('bad_input');
    }
    // the server still answers
    expect((await operator.get('/api/auth/me')).status).toBe(200);
  });
});
