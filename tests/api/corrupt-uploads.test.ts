// Corrupt pictures and PDFs: refused at upload with a 400, and a damaged file that is already
// stored (kept before uploads were decoded) never fails or ends a traveller PDF.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import PDFDocument from 'pdfkit';
import sharp from 'sharp';
import { and, eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertProof } from '../support/shipping-fixtures';
import { proofs } from '../../server/db/schema/orders';

type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let planner: Agent;

// A 1×1 PNG whose zlib stream has a wrong Adler-32 checksum (RFC 1950, 2.2): libpng refuses it,
// pdfkit's asynchronous inflate used to throw outside any request.
const BAD_CHECKSUM_PNG = Buffer.from(
  '89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d4944415478da63f8cfc0f01f0005000201a5f9bd450000000049454e44ae426082',
  'hex',
);
// The PNG signature (PNG specification, 5.2) followed by HTML
const SIGNATURE_THEN_HTML = Buffer.concat([Buffer.from('89504e470d0a1a0a', 'hex'), Buffer.from('<html><body><script>alert(1)</script></body></html>')]);
let truncatedJpeg: Buffer;
let goodJpeg: Buffer;
let goodPdf: Buffer;

function pdf(): Promise<Buffer> {
  return new Promise((resolve) => {
    const doc = new PDFDocument({ size: 'A6' });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.rect(20, 20, 200, 200).fill('#1f4e9c');
    doc.end();
  });
}

beforeAll(async () => {
  t = makeTestApp();
  planner = await t.agentAs('planner');
  goodJpeg = await sharp({ create: { width: 120, height: 80, channels: 3, background: '#c0392b' } })
    .jpeg()
    .toBuffer();
  truncatedJpeg = goodJpeg.subarray(0, Math.floor(goodJpeg.length * 0.6));
  goodPdf = await pdf();
});
afterAll(() => t.close());

const DUE = new Date(Date.now() + 60 * 86_400_000).toISOString().slice(0, 10);

async function releasedOrder(): Promise<string> {
  const res = await planner.post('/api/orders').send({
    customer: 'Corrie Falls Cycling Club',
    title: 'Club badge 20 mm',
    process: 'hard_enamel',
    material: 'iron',
    sizeMm: 20,
    quantity: 100,
    overrunPct: 0,
    colours: [{ name: 'Red', hex: '#c0392b' }],
    plating: 'gold',
    backing: { type: 'butterfly_clutch', count: 1 },
    packaging: 'individual_bag',
    dueDate: DUE,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const id = res.body.id as string;
  expect((await planner.post(`/api/orders/${id}/payment`).send({ amount: 300, reference: 'BT-0042' })).status).toBe(201);
  const up = await planner.post(`/api/orders/${id}/proofs`).attach('file', goodJpeg, { filename: 'proof.jpg', contentType: 'image/jpeg' });
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  expect((await planner.post(`/api/orders/${id}/proofs/1/approve`).send({})).status).toBe(200);
  expect((await planner.post(`/api/orders/${id}/release`).send({ traySize: 50 })).status).toBe(201);
  return id;
}

describe('uploads are decoded before they are kept', () => {
  let orderId: string;
  beforeAll(async () => {
    orderId = await releasedOrder();
  });

  for (const [label, file, name, type] of [
    ['a PNG with a wrong zlib checksum', () => BAD_CHECKSUM_PNG, 'proof.png', 'image/png'],
    ['a PNG signature followed by HTML', () => SIGNATURE_THEN_HTML, 'proof.png', 'image/png'],
    ['a truncated JPEG', () => truncatedJpeg, 'proof.jpg', 'image/jpeg'],
    ['a PDF header with nothing behind it', () => Buffer.from('%PDF-1.7\n<html>not a pdf</html>'), 'proof.pdf', 'application/pdf'],
  ] as const) {
    it(`refuses ${label} with 400 and keeps nothing`, async () => {
      const before = (await planner.get(`/api/orders/${orderId}`)).body.proofs.length;
      const res = await planner.post(`/api/orders/${orderId}/proofs`).attach('file', file(), { filename: name, contentType: type });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('bad_file_content');
      expect(res.body.error.message).toMatch(/damaged/);
      expect((await planner.get(`/api/orders/${orderId}`)).body.proofs.length).toBe(before);
    });
  }

  it('keeps a PNG thumbnail of a good picture and prints it on the travellers', async () => {
    const [row] = t.deps.db.select().from(proofs).where(eq(proofs.orderId, orderId)).all();
    const thumb = path.join(t.dataDir, 'files', row.fileHash.slice(0, 2), `${row.fileHash}.thumb.png`);
    const meta = await sharp(fs.readFileSync(thumb)).metadata();
    expect(meta.format).toBe('png');
    expect(meta.hasAlpha).toBe(false);
    expect(Math.max(meta.width!, meta.height!)).toBeLessThanOrEqual(300);
    const res = await planner.get(`/api/orders/${orderId}/travellers.pdf`).buffer(true);
    expect(res.status).toBe(200);
    // an image XObject (ISO 32000-1, 8.9.5) is in the file: the thumbnail is on the cards
    expect((res.body as Buffer).toString('latin1')).toMatch(/\/Subtype \/Image/);
  });

  it('accepts a real PDF proof, and draws its first page to a thumbnail', async () => {
    const res = await planner.post(`/api/orders/${orderId}/proofs`).attach('file', goodPdf, { filename: 'proof.pdf', contentType: 'application/pdf' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const row = t.deps.db
      .select()
      .from(proofs)
      .where(eq(proofs.orderId, orderId))
      .all()
      .find((p) => p.revision === res.body.revision)!;
    const thumb = path.join(t.dataDir, 'files', row.fileHash.slice(0, 2), `${row.fileHash}.thumb.png`);
    const { data, info } = await sharp(fs.readFileSync(thumb)).raw().toBuffer({ resolveWithObject: true });
    // the page's blue square is in the picture (not a blank page)
    let blue = 0;
    for (let i = 0; i < data.length; i += info.channels) if (data[i + 2] > 120 && data[i] < 80) blue++;
    expect(blue).toBeGreaterThan(100);
  });

  for (const [label, file, mime] of [
    ['wrong-checksum PNG', () => BAD_CHECKSUM_PNG, 'image/png'],
    ['signature-then-HTML PNG', () => SIGNATURE_THEN_HTML, 'image/png'],
    ['truncated JPEG', () => truncatedJpeg, 'image/jpeg'],
  ] as const) {
    it(`a ${label} stored before uploads were decoded prints without artwork, and the server still answers`, async () => {
      const id = await releasedOrder();
      // approve a damaged revision put straight into the store, as an old upload would be
      insertProof(t.deps, id, 2, file(), mime, (await planner.get('/api/auth/me')).body.user.id);
      t.deps.db
        .update(proofs)
        .set({ approvedAt: Date.now() })
        .where(and(eq(proofs.orderId, id), eq(proofs.revision, 2)))
        .run();
      for (let i = 0; i < 2; i++) {
        const res = await planner.get(`/api/orders/${id}/travellers.pdf`).buffer(true);
        expect(res.status).toBe(200);
        expect((res.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
        expect((res.body as Buffer).toString('latin1')).not.toMatch(/\/Subtype \/Image/);
      }
      // let any late callback run, then ask again
      await new Promise((r) => setImmediate(r));
      expect((await planner.get('/api/health')).status).toBe(200);
    });
  }
});
