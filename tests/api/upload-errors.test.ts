// Broken multipart bodies, empty or disguised QC photos, a made-up operator, a full disk and
// file modes: each answers with the documented error shape and leaves nothing behind.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertFloorOrder } from '../support/scan-fixtures';
import { attachments } from '../../server/db/schema/scans';
import { scanPhotosService } from '../../server/services/scan-photos.service';
import { adminService } from '../../server/services/admin.service';
import { boot } from '../../server/boot';
import { loadEnv } from '../../server/env';

type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let planner: Agent;
let operator: Agent;
let code: string;
let orderId: string;
let jpeg: Buffer;

beforeAll(async () => {
  t = makeTestApp();
  planner = await t.agentAs('planner');
  operator = await t.agentAs('operator');
  const o = insertFloorOrder(t.deps, { trays: 1, quantity: 50, releasedAt: Date.now() });
  code = o.trays[0].code;
  orderId = o.orderId;
  jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#778899' } })
    .jpeg()
    .toBuffer();
});
afterAll(() => t.close());

const photos = () => t.deps.db.select().from(attachments).all().length;

function shape(res: { status: number; body: { error?: { code?: string; message?: string } }; text: string }, status: number) {
  expect(res.status, res.text).toBe(status);
  expect(typeof res.body.error?.code).toBe('string');
  expect(res.body.error!.message!.length).toBeGreaterThan(10);
  expect(res.text).not.toMatch(/at \S+ \(|node_modules/);
}

describe('broken multipart bodies answer 400', () => {
  const B = 'trayceBoundary42';
  it('a NUL byte in the file name', async () => {
    const body = Buffer.concat([
      Buffer.from(`--${B}\r\nContent-Disposition: form-data; name="file"; filename="proof\u0000.png"\r\nContent-Type: image/png\r\n\r\n`),
      jpeg,
      Buffer.from(`\r\n--${B}--\r\n`),
    ]);
    const res = await planner.post(`/api/orders/${orderId}/proofs`).set('Content-Type', `multipart/form-data; boundary=${B}`).send(body);
    shape(res, 400);
  });

  it('a body cut off in the middle of the file', async () => {
    const body = Buffer.concat([
      Buffer.from(`--${B}\r\nContent-Disposition: form-data; name="file"; filename="proof.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`),
      jpeg.subarray(0, 100),
    ]);
    const res = await planner.post(`/api/orders/${orderId}/proofs`).set('Content-Type', `multipart/form-data; boundary=${B}`).send(body);
    shape(res, 400);
    expect(res.body.error.code).toBe('bad_upload');
  });
});

describe('QC photos are checked like proofs', () => {
  it('refuses a 0-byte photo', async () => {
    const before = photos();
    const res = await operator.post('/api/scans/photos').field('code', code).attach('file', Buffer.alloc(0), { filename: 'qc.jpg', contentType: 'image/jpeg' });
    shape(res, 400);
    expect(res.body.error.code).toBe('empty_file');
    expect(photos()).toBe(before);
  });

  it('reads the type from the content, not from what the client declares', async () => {
    const before = photos();
    const html = await operator
      .post('/api/scans/photos')
      .field('code', code)
      .attach('file', Buffer.from('<html><script>alert(1)</script></html>'), { filename: 'qc.jpg', contentType: 'image/jpeg' });
    shape(html, 400);
    expect(html.body.error.code).toBe('bad_file_type');
    const cut = await operator
      .post('/api/scans/photos')
      .field('code', code)
      .attach('file', jpeg.subarray(0, 200), { filename: 'qc.jpg', contentType: 'image/jpeg' });
    shape(cut, 400);
    expect(cut.body.error.code).toBe('bad_file_content');
    expect(photos()).toBe(before);
    // a real PNG declared as JPEG is kept as what it is
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#fff' } })
      .png()
      .toBuffer();
    const ok = await operator.post('/api/scans/photos').field('code', code).attach('file', png, { filename: 'qc.jpg', contentType: 'image/jpeg' });
    expect(ok.status, ok.text).toBe(201);
    expect(
      t.deps.db
        .select()
        .from(attachments)
        .all()
        .find((a) => a.id === ok.body.id)!.mime,
    ).toBe('image/png');
  });

  it('refuses an operatorId that is not an active user', async () => {
    const before = photos();
    const res = await operator
      .post('/api/scans/photos')
      .field('code', code)
      .field('operatorId', 'no-such-user')
      .attach('file', jpeg, { filename: 'qc.jpg', contentType: 'image/jpeg' });
    // a signed-in operator is recorded as themselves; the check matters when nobody is signed in
    expect([201, 400]).toContain(res.status);
    await expect(
      scanPhotosService.addPhoto(t.deps, { code, file: { buffer: jpeg, size: jpeg.length, originalname: 'qc.jpg' }, operatorId: 'no-such-user' }, null),
    ).rejects.toMatchObject({
      status: 400,
      code: 'unknown_operator',
    });
    expect(photos()).toBe(before + (res.status === 201 ? 1 : 0));
  });
});

describe('a full disk', () => {
  it('answers 507 with a message a supervisor can act on, and keeps nothing', async () => {
    for (const [errCode, errno] of [
      ['ENOSPC', 'no space left on device'],
      ['SQLITE_FULL', 'database or disk is full'],
    ]) {
      const spy = vi.spyOn(fs, 'writeFileSync').mockImplementationOnce(() => {
        throw Object.assign(new Error(errno), { code: errCode });
      });
      // a picture not stored yet, so the store has to write it
      const fresh = await sharp({ create: { width: 20, height: 20, channels: 3, background: errCode === 'ENOSPC' ? '#102030' : '#302010' } })
        .jpeg()
        .toBuffer();
      const before = photos();
      const res = await operator
        .post('/api/scans/photos')
        .field('code', code)
        .attach('file', fresh, { filename: `full-${errCode}.jpg`, contentType: 'image/jpeg' });
      spy.mockRestore();
      shape(res, 507);
      expect(res.body.error.code).toBe('disk_full');
      expect(res.body.error.message).toMatch(/disk|space/i);
      expect(photos()).toBe(before);
    }
  });
});

describe('file modes', () => {
  it('keeps the database, keys, stored files and backups private to the server user (0600 files, 0700 folders)', async () => {
    const up = await operator
      .post('/api/scans/photos')
      .field('code', code)
      .attach(
        'file',
        await sharp({ create: { width: 9, height: 9, channels: 3, background: '#123456' } })
          .jpeg()
          .toBuffer(),
        { filename: 'qc.jpg', contentType: 'image/jpeg' },
      );
    expect(up.status).toBe(201);
    const file = path.join(t.dataDir, 'files', up.body.hash.slice(0, 2), up.body.hash);
    expect(fs.statSync(file).mode & 0o777).toBe(0o600);
    expect(fs.statSync(path.dirname(file)).mode & 0o777).toBe(0o700);
    expect(fs.statSync(path.join(t.dataDir, 'files')).mode & 0o777).toBe(0o700);
    expect(fs.statSync(path.join(t.dataDir, 'trayce.db')).mode & 0o777).toBe(0o600);
    const admin = await t.agentAs('admin');
    const backup = await adminService.makeBackup(t.deps, admin.user.id);
    expect(fs.statSync(path.join(t.dataDir, 'backups')).mode & 0o777).toBe(0o700);
    expect(fs.statSync(path.join(t.dataDir, 'backups', backup.file)).mode & 0o777).toBe(0o600);
  });

  it('a first start makes the data folder 0700 and the database and keys 0600', async () => {
    const dataDir = path.join(path.dirname(t.dataDir), `boot-${Date.now()}-${process.pid}`);
    const deps = await boot(
      loadEnv({
        TRAYCE_DATA_DIR: dataDir,
        TRAYCE_SEED: 'none',
        TRAYCE_ADMIN_EMAIL: 'first.admin@example.test',
        TRAYCE_ADMIN_PASSWORD: 'a-long-first-password',
        NODE_ENV: 'test',
        LOG_LEVEL: 'silent',
      }),
    );
    try {
      expect(fs.statSync(dataDir).mode & 0o777).toBe(0o700);
      expect(fs.statSync(path.join(dataDir, 'trayce.db')).mode & 0o777).toBe(0o600);
      expect(fs.statSync(path.join(dataDir, 'keys')).mode & 0o777).toBe(0o700);
      for (const k of ['session', 'traveller']) expect(fs.statSync(path.join(dataDir, 'keys', `${k}.key`)).mode & 0o777).toBe(0o600);
    } finally {
      deps.db.$client.close();
    }
  });
});
