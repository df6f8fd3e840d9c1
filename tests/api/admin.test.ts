import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import { makeTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let admin: Awaited<ReturnType<TestApp['agentAs']>>;
beforeAll(async () => {
  t = makeTestApp();
  admin = await t.agentAs('admin');
});
afterAll(() => t.close());

describe('reason codes', () => {
  it('adds a reason in both languages, switches it off, and never deletes it', async () => {
    const created = await admin.post('/api/admin/reason-codes').send({ code: 'pin_missing', name: 'Post missing', nameZh: '缺针', kind: 'scrap', stationKind: 'post' });
    expect(created.status).toBe(201);
    expect((await admin.get('/api/reason-codes')).body.map((r: { code: string }) => r.code)).toContain('pin_missing');
    expect((await admin.patch('/api/admin/reason-codes/pin_missing').send({ active: false })).status).toBe(200);
    expect((await admin.get('/api/reason-codes')).body.map((r: { code: string }) => r.code)).not.toContain('pin_missing');
    expect((await admin.get('/api/admin/reason-codes')).body.find((r: { code: string }) => r.code === 'pin_missing').active).toBe(false);
  });
  it('refuses a duplicate code and a malformed one, changing nothing', async () => {
    const before = (await admin.get('/api/admin/reason-codes')).body.length;
    expect((await admin.post('/api/admin/reason-codes').send({ code: 'scratch', name: 'x', nameZh: 'x', kind: 'scrap' })).status).toBe(409);
    expect((await admin.post('/api/admin/reason-codes').send({ code: '../Bad Code', name: 'x', nameZh: 'x', kind: 'scrap' })).status).toBe(400);
    expect((await admin.get('/api/admin/reason-codes')).body.length).toBe(before);
  });
});

describe('backups from the admin screen', () => {
  it('writes an online backup into the data folder and lists it', async () => {
    const made = await admin.post('/api/admin/backups');
    expect(made.status).toBe(201);
    expect(fs.existsSync(path.join(t.dataDir, 'backups', made.body.file))).toBe(true);
    expect((await admin.get('/api/admin/backups')).body[0].file).toBe(made.body.file);
  });
});
