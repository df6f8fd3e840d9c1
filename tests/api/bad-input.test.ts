import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let admin: Awaited<ReturnType<TestApp['agentAs']>>;
beforeAll(async () => {
  t = makeTestApp();
  admin = await t.agentAs('admin');
});
afterAll(() => t.close());

const userCount = async () => (await admin.get('/api/users')).body.length;
const shape = { error: { code: expect.any(String), message: expect.any(String) } };

describe('bad input gets a clear error of the documented shape and changes nothing', () => {
  it('malformed JSON', async () => {
    const before = await userCount();
    const res = await admin.post('/api/users').set('Content-Type', 'application/json').send('{"name": "x",');
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject(shape);
    expect(res.body.error.code).toBe('bad_json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(ts|js):\d+/);
    expect(await userCount()).toBe(before);
  });

  it('unknown fields', async () => {
    const before = await userCount();
    const res = await admin.post('/api/users').send({ name: 'A', email: 'a@test.trayce.local', role: 'sales', password: 'password-1', isRoot: true });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_input');
    expect(res.body.error.issues[0].code).toBe('unrecognized_keys');
    expect(await userCount()).toBe(before);
  });

  it('wrong types', async () => {
    const res = await admin.post('/api/users').send({ name: 12, email: 'b@test.trayce.local', role: 'chief', password: 'password-1' });
    expect(res.status).toBe(400);
    const paths = res.body.error.issues.map((i: { path: string[] }) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['name', 'role']));
  });

  it('an oversized body', async () => {
    const before = await userCount();
    const res = await admin.post('/api/users').send({ name: 'x'.repeat(2_000_000), email: 'c@test.trayce.local', role: 'sales', password: 'password-1' });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
    expect(await userCount()).toBe(before);
  });

  it('an unknown API path', async () => {
    const res = await admin.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body).toMatchObject(shape);
  });

  it('a duplicate e-mail', async () => {
    const body = { name: 'D', email: 'd@test.trayce.local', role: 'sales', password: 'password-1' };
    expect((await admin.post('/api/users').send(body)).status).toBe(201);
    const again = await admin.post('/api/users').send(body);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('email_taken');
  });

  it('answers health without sign-in', async () => {
    const res = await (await import('supertest')).default(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });
});
