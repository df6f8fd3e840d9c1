import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, type TestApp } from '../support/test-app';
import { ROLES, type Role } from '@shared/domain/vocabulary';

// Every API route states who may use it; this walks the registry so a new route cannot slip past.
let t: TestApp;
const agents = new Map<Role, Awaited<ReturnType<TestApp['agentAs']>>>();

beforeAll(async () => {
  t = makeTestApp();
  for (const role of ROLES) agents.set(role, await t.agentAs(role));
});
afterAll(() => t.close());

const concrete = (path: string) => `/api${path.replace(/:[A-Za-z]+/g, 'no-such-id')}`;
// a write carries the body kind its route declares (file routes take a multipart form)
type Call = ReturnType<ReturnType<typeof request>['get']>;
const withBody = (call: Call, route: TestApp['api']['routes'][number]) => (route.bodyKind === 'file' ? call.field('note', 'x') : call.send({}));

describe('role enforcement on every registered route', () => {
  it('registers every route on the API router through the one mechanism', () => {
    const layers = (t.api.router as unknown as { stack: { route?: { path: string } }[] }).stack;
    expect(layers.filter((l) => l.route).length).toBe(t.api.routes.length);
    expect(t.api.routes.length).toBeGreaterThan(10);
  });

  it('answers 401 without a session and 403 to every role not allowed', async () => {
    const checked: string[] = [];
    for (const route of t.api.routes) {
      if (route.access === 'public') continue;
      const url = concrete(route.path);
      const anonymous = await withBody(request(t.app)[route.method](url), route);
      expect(anonymous.status, `${route.method.toUpperCase()} ${route.path} without a session`).toBe(401);
      expect(anonymous.body.error.code).toBe('not_signed_in');
      for (const role of ROLES) {
        if (route.access.roles.includes(role)) continue;
        const res = await withBody(agents.get(role)![route.method](url), route);
        expect(res.status, `${route.method.toUpperCase()} ${route.path} as ${role}`).toBe(403);
        expect(res.body.error.code).toBe('forbidden');
      }
      checked.push(`${route.method} ${route.path}`);
    }
    expect(checked.length).toBeGreaterThan(5);
  });

  it('lets an allowed role past the access check', async () => {
    const res = await agents.get('admin')!.get('/api/users');
    expect(res.status).toBe(200);
    expect(Array.isArray(res.body)).toBe(true);
  });
});
