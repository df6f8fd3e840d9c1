import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import { makeTestApp, type TestApp } from '../support/test-app';
import { stationQueueService } from '../../server/services/station-queue.service';

let t: TestApp;
let admin: Awaited<ReturnType<TestApp['agentAs']>>;
beforeAll(async () => {
  t = makeTestApp();
  admin = await t.agentAs('admin');
});
afterAll(() => t.close());

describe('reason codes', () => {
  it('adds a reason in both languages, switches it off, and never deletes it', async () => {
    const created = await admin
      .post('/api/admin/reason-codes')
      .send({ code: 'pin_missing', name: 'Post missing', nameZh: '缺针', kind: 'scrap', stationKind: 'post' });
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

describe('stations in two languages', () => {
  it('lists the seeded stations with their Chinese name, instructions and safety notes', async () => {
    const list = (await admin.get('/api/stations')).body as { code: string; name: string; nameZh: string; instructionsZh: string; safetyNotesZh: string }[];
    const oven = list.find((s) => s.code === 'OVN-1')!;
    expect(oven.nameZh).toBe('烤炉');
    expect(oven.instructionsZh).toMatch(/托盘/);
    // the general line about local rules is kept in Chinese too
    expect(oven.safetyNotesZh).toMatch(/当地法规/);
    expect(list.every((s) => s.nameZh.length > 0)).toBe(true);
  });
  it('an admin edits the Chinese texts; the tablet queue returns them; too long a text changes nothing', async () => {
    const id = (await admin.get('/api/stations')).body.find((s: { code: string }) => s.code === 'FIL-2').id;
    const saved = await admin.patch(`/api/stations/${id}`).send({ nameZh: '填色二号台', instructionsZh: '只填写明的颜色。', safetyNotesZh: '戴手套。' });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ nameZh: '填色二号台', instructionsZh: '只填写明的颜色。', safetyNotesZh: '戴手套。' });
    expect(stationQueueService.stationQueue(t.deps, id).station).toMatchObject({
      nameZh: '填色二号台',
      instructionsZh: '只填写明的颜色。',
      safetyNotesZh: '戴手套。',
    });
    const bad = await admin.patch(`/api/stations/${id}`).send({ nameZh: '长'.repeat(81) });
    expect(bad.status).toBe(400);
    expect((await admin.get('/api/stations')).body.find((s: { id: string }) => s.id === id).nameZh).toBe('填色二号台');
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
