// An open live stream outlives nothing: when the person is switched off, the stream that was
// opened with their session is told why and closed (checked again every few seconds).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import http from 'node:http';
import { makeTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

describe('GET /api/stream after access ends', () => {
  it('a switched-off user’s open stream is sent "closed" and ended', async () => {
    const admin = await t.agentAs('admin');
    const manager = await t.agentAs('manager');
    const server = t.app.listen(0);
    try {
      const port = (server.address() as { port: number }).port;
      const login = await fetch(`http://127.0.0.1:${port}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: manager.user.email, password: manager.user.password }),
      });
      expect(login.status).toBe(200);
      const cookie = login.headers
        .getSetCookie()
        .map((c) => c.split(';')[0])
        .join('; ');
      let text = '';
      let switched = false;
      const ended = new Promise<void>((resolve, reject) => {
        const req = http.get(`http://127.0.0.1:${port}/api/stream`, { headers: { cookie, accept: 'text/event-stream' } }, (res) => {
          expect(res.statusCode).toBe(200);
          res.setEncoding('utf8');
          res.on('data', (chunk: string) => {
            text += chunk;
            // once the stream is live, the admin switches the person off
            if (text.includes('event:') && !switched) {
              switched = true;
              void admin
                .patch(`/api/users/${manager.user.id}`)
                .send({ active: false })
                .then((r) => expect(r.status).toBe(200), reject);
            }
          });
          res.on('end', resolve);
        });
        req.on('error', reject);
      });
      // waits for the condition (the server's re-check runs every few seconds), with room for a loaded machine
      await Promise.race([ended, new Promise((_, reject) => setTimeout(() => reject(new Error(`stream still open: ${text.slice(-200)}`)), 60_000))]);
      expect(switched).toBe(true);
      expect(text).toMatch(/event: closed\ndata: \{"reason":"access_ended"\}/);
    } finally {
      server.close();
    }
  }, 90_000);
});
