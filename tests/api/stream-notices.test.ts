// The wall's notice feed: every accepted scan gets its notice, also in a burst larger than the
// 200 the feed reads per check (a batch of 450 from a tablet coming back online).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import http from 'node:http';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertFloorOrder, scan, stationId } from '../support/scan-fixtures';
import { NOTICE_PAGE } from '../../server/services/stream.service';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

describe('GET /api/stream scan notices', () => {
  it(`sends all of a burst of scans beyond ${NOTICE_PAGE} per check, each once`, async () => {
    const BURST = 450;
    expect(BURST).toBeGreaterThan(2 * NOTICE_PAGE);
    const manager = await t.agentAs('manager');
    const operator = await t.agentAs('operator');
    const { trays } = insertFloorOrder(t.deps, { releasedAt: Date.now() - 3600_000, trays: BURST });
    const server = t.app.listen(0);
    try {
      const port = (server.address() as { port: number }).port;
      const login = await fetch(`http://127.0.0.1:${port}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: manager.user.email, password: manager.user.password }),
      });
      const cookie = login.headers
        .getSetCookie()
        .map((c) => c.split(';')[0])
        .join('; ');
      const ids = new Map<string, number>();
      let text = '';
      let sent = false;
      let request: http.ClientRequest | undefined;
      const all = new Promise<void>((resolve, reject) => {
        request = http.get(`http://127.0.0.1:${port}/api/stream`, { headers: { cookie, accept: 'text/event-stream' } }, (res) => {
          res.setEncoding('utf8');
          res.on('data', (chunk: string) => {
            text += chunk;
            if (!sent && text.includes('event:')) {
              sent = true;
              const st = stationId(t.deps, 'STR-1');
              const now = Date.now();
              void operator
                .post('/api/scans')
                .send({ events: trays.map((tr, i) => scan(tr.code, st, 'start', now - (BURST - i) * 10)) })
                .then((r) => expect(r.body.results.filter((x: { status: string }) => x.status === 'accepted')).toHaveLength(BURST), reject);
            }
            // whole messages only (each ends with a blank line); the rest waits for the next chunk
            const cut = text.lastIndexOf('\n\n');
            if (cut < 0) return;
            for (const m of text.slice(0, cut + 2).matchAll(/event: scan\ndata: (\{[^\n]*\})\n\n/g)) {
              const id = (JSON.parse(m[1]) as { id: string }).id;
              ids.set(id, (ids.get(id) ?? 0) + 1);
            }
            text = text.slice(cut + 2);
            if (ids.size >= BURST) resolve();
          });
        });
        request.on('error', reject);
      });
      await Promise.race([all, new Promise((_, reject) => setTimeout(() => reject(new Error(`only ${ids.size} of ${BURST} notices`)), 60_000))]);
      expect(ids.size).toBe(BURST);
      expect([...ids.values()].every((n) => n === 1)).toBe(true);
      request?.destroy();
    } finally {
      server.close();
    }
  }, 90_000);
});
