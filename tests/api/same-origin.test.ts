import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import request from 'supertest';
import { makeTestApp, type TestApp } from '../support/test-app';
import { ROLES, type Role } from '@shared/domain/vocabulary';
import { loadEnv } from '../../server/env';

// Same-origin writes: a page on another origin (another port of the same host counts, as browsers
// define origin by scheme, host and port: RFC 6454 section 4) may not change anything, and a write
// must carry JSON (or a multipart form where a file is sent), never a form post or text/plain.
let t: TestApp;
const agents = new Map<Role, Awaited<ReturnType<TestApp['agentAs']>>>();

beforeAll(async () => {
  t = makeTestApp();
  for (const role of ROLES) agents.set(role, await t.agentAs(role));
});
afterAll(() => t.close());

const concrete = (path: string) => `/api${path.replace(/:[A-Za-z]+/g, 'no-such-id')}`;
const writes = () => t.api.routes.filter((r) => r.method !== 'get');
// The payment webhook is the one route exempt from the origin rule (decision 0011): it is posted by
// the payment service's servers and proves itself by its signature (tests/api/payments.test.ts).
const browserWrites = () => writes().filter((r) => !r.signed);

/** A digest of every row of every table: proves a refused request changed nothing at all. */
function dbDigest(): string {
  const sqlite = t.deps.db.$client;
  const tables = sqlite.prepare(`SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name`).all() as { name: string }[];
  const hash = crypto.createHash('sha256');
  for (const { name } of tables) {
    // the idle clock of the calling sessions is the only thing a request may touch before its rules run
    const rows = sqlite.prepare(`SELECT * FROM "${name}"`).all() as Record<string, unknown>[];
    for (const row of rows) {
      if (name === 'sessions') delete row.last_seen_at;
      hash.update(name + JSON.stringify(row));
    }
  }
  return hash.digest('hex');
}

/** A caller allowed on the route (a signed-in user of a listed role), or nobody for public and device-only routes. */
function callerFor(route: (typeof t.api.routes)[number]) {
  if (route.access === 'public' || route.access.roles.length === 0) return request(t.app);
  return agents.get(route.access.roles[0]!)!;
}

describe('every registered write route', () => {
  it('has write routes to walk, and every file route is declared as such', () => {
    expect(writes().length).toBeGreaterThan(30);
    const fileRoutes = t.api.routes.filter((r) => r.bodyKind !== 'json').map((r) => `${r.method} ${r.path}`);
    expect(fileRoutes).toEqual(expect.arrayContaining(['post /orders/:id/proofs', 'post /scans/photos', 'post /orders/import/preview']));
  });

  it('exempts exactly one signed route from the origin rule', () => {
    expect(
      writes()
        .filter((r) => r.signed)
        .map((r) => `${r.method} ${r.path}`),
    ).toEqual(['post /payments/webhook']);
  });

  it('refuses a foreign Origin with 403 cross_origin and changes nothing', async () => {
    const before = dbDigest();
    for (const route of browserWrites()) {
      const label = `${route.method.toUpperCase()} ${route.path}`;
      for (const origin of ['http://127.0.0.1:5999', 'https://evil.example', 'null']) {
        const res = await callerFor(route)[route.method](concrete(route.path)).set('Origin', origin).send({});
        expect(res.status, `${label} from ${origin}`).toBe(403);
        expect(res.body).toEqual({ error: { code: 'cross_origin', message: expect.any(String) } });
      }
      // without Origin, the Fetch Metadata header speaks for the browser (W3C Fetch Metadata Request Headers)
      for (const site of ['same-site', 'cross-site']) {
        const res = await callerFor(route)[route.method](concrete(route.path)).set('Sec-Fetch-Site', site).send({});
        expect(res.status, `${label} with Sec-Fetch-Site ${site}`).toBe(403);
        expect(res.body.error.code).toBe('cross_origin');
      }
    }
    expect(dbDigest()).toBe(before);
  });

  it('refuses a form or text body with 415 unsupported_media_type and changes nothing', async () => {
    const before = dbDigest();
    for (const route of writes()) {
      const label = `${route.method.toUpperCase()} ${route.path}`;
      const url = concrete(route.path);
      const form = await callerFor(route)[route.method](url).type('form').send('name=x&role=admin&approved=true');
      expect(form.status, `${label} with a form body`).toBe(415);
      expect(form.body).toEqual({ error: { code: 'unsupported_media_type', message: expect.any(String) } });
      const text = await callerFor(route)[route.method](url).set('Content-Type', 'text/plain').send('{"events":[]}');
      expect(text.status, `${label} with a text body`).toBe(415);
      expect(text.body.error.code).toBe('unsupported_media_type');
      // an empty form (a bare <form method=post>) is refused too
      const emptyForm = await callerFor(route)[route.method](url).set('Content-Type', 'application/x-www-form-urlencoded');
      expect(emptyForm.status, `${label} with an empty form`).toBe(415);
      if (route.bodyKind === 'file') {
        const json = await callerFor(route)[route.method](url).send({});
        expect(json.status, `${label} with JSON instead of a file`).toBe(415);
      }
    }
    expect(dbDigest()).toBe(before);
  });
});

describe('the rule in practice', () => {
  it('a forged user creation is refused, the same request from the app itself is accepted', async () => {
    const admin = agents.get('admin')!;
    const body = { name: 'Mallory Test', email: `m-${crypto.randomUUID().slice(0, 6)}@test.trayce.local`, role: 'admin', password: 'long-enough-password' };
    const count = () => (t.deps.db.$client.prepare('SELECT count(*) AS n FROM users').get() as { n: number }).n;
    const n = count();
    const forged = await admin.post('/api/users').set('Origin', 'http://127.0.0.1:4000').send(body);
    expect(forged.status).toBe(403);
    const asForm = await admin.post('/api/users').type('form').send(body);
    expect(asForm.status).toBe(415);
    expect(count()).toBe(n);
    const same = await admin
      .post('/api/users')
      .set('Host', 'trayce.test:5180')
      .set('Origin', 'http://trayce.test:5180')
      .set('Sec-Fetch-Site', 'same-origin')
      .send(body);
    expect(same.status).toBe(201);
    expect(count()).toBe(n + 1);
  });

  it('a forged logout does not end the session; a write without a body and without a content type still works', async () => {
    const planner = await t.agentAs('planner');
    const forged = await planner.post('/api/auth/logout').set('Origin', 'http://localhost:6000');
    expect(forged.status).toBe(403);
    expect((await planner.get('/api/auth/me')).status).toBe(200);
    // what the browser client sends for DELETE: no body, no Content-Type, its own Origin
    const out = await planner.post('/api/auth/logout').set('Host', 'trayce.test').set('Origin', 'http://trayce.test');
    expect(out.status).toBe(204);
    expect((await planner.get('/api/auth/me')).status).toBe(401);
  });

  it('a body sent without a content type is refused (it could only be a form in disguise)', async () => {
    const admin = agents.get('admin')!;
    const res = await admin.post('/api/users').set('Content-Type', '').send(Buffer.from('name=x'));
    expect(res.status).toBe(415);
  });

  it('reads are never refused for their origin (links and images from other sites may fetch them)', async () => {
    const res = await agents.get('admin')!.get('/api/users').set('Origin', 'https://elsewhere.example').set('Sec-Fetch-Site', 'cross-site');
    expect(res.status).toBe(200);
  });

  it('accepts the configured public URL as the own origin behind a proxy, and Sec-Fetch-Site none', async () => {
    const env = loadEnv({ TRAYCE_PUBLIC_URL: 'https://badges.tallowmere.example', TRAYCE_SEED: 'none', NODE_ENV: 'test', LOG_LEVEL: 'silent' });
    const proxied = makeTestApp({ env: { ...t.deps.env, publicUrl: env.publicUrl } });
    try {
      const ok = await request(proxied.app).post('/api/auth/logout').set('Origin', 'https://badges.tallowmere.example');
      expect(ok.status).toBe(204);
      const other = await request(proxied.app).post('/api/auth/logout').set('Origin', 'https://other.tallowmere.example');
      expect(other.status).toBe(403);
      const typed = await request(proxied.app).post('/api/auth/logout').set('Sec-Fetch-Site', 'none');
      expect(typed.status).toBe(204);
    } finally {
      proxied.close();
    }
  });
});
