import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import crypto from 'node:crypto';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
import { PNG } from 'pngjs';
import PDFDocument from 'pdfkit';
import { makeTestApp, type TestApp } from '../support/test-app';
import { verifyTravellerCode } from '@shared/domain/traveller-code';
import { releasedQuantity } from '@shared/domain/trays';
import type { OrderSpecInput } from '@shared/schemas/orders';

type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let planner: Agent;
let manager: Agent;
let sales: Agent;
let admin: Agent;

beforeAll(async () => {
  t = makeTestApp();
  planner = await t.agentAs('planner');
  manager = await t.agentAs('manager');
  sales = await t.agentAs('sales');
  admin = await t.agentAs('admin');
});
afterAll(() => t.close());

function png(): Buffer {
  const img = new PNG({ width: 8, height: 8 });
  img.data.fill(200);
  return PNG.sync.write(img);
}
// a real one-page PDF (uploads are parsed with pdf.js before they are kept)
let PDF: Buffer;
beforeAll(async () => {
  PDF = await new Promise<Buffer>((resolve) => {
    const doc = new PDFDocument({ size: 'A6' });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.text('Proof');
    doc.end();
  });
});

// due two months from now, so no order of these tests is late
const DUE = new Date(Date.now() + 60 * 86_400_000).toISOString().slice(0, 10);

const spec = (over: Partial<OrderSpecInput> = {}): OrderSpecInput => ({
  customer: 'Harbour Rowing Club',
  title: 'Club crest 25 mm',
  process: 'hard_enamel',
  material: 'iron',
  sizeMm: 25,
  quantity: 1000,
  colours: [
    { name: 'Navy', hex: '#1b2a4a' },
    { name: 'White', hex: '#ffffff' },
  ],
  plating: 'gold',
  backing: { type: 'butterfly_clutch', count: 1 },
  packaging: 'individual_bag',
  dueDate: DUE,
  ...over,
});

async function createOrder(over: Partial<OrderSpecInput> = {}) {
  const res = await planner.post('/api/orders').send(spec(over));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; number: string; status: string; routing: { stationKind: string; name: string }[] };
}

async function readyOrder(over: Partial<OrderSpecInput> = {}) {
  const order = await createOrder(over);
  expect((await planner.post(`/api/orders/${order.id}/payment`).send({ amount: 1250, reference: 'BT-0001' })).status).toBe(201);
  const up = await planner.post(`/api/orders/${order.id}/proofs`).attach('file', png(), { filename: 'proof.png', contentType: 'image/png' });
  expect(up.status).toBe(201);
  expect((await planner.post(`/api/orders/${order.id}/proofs/${up.body.revision}/approve`).send({})).status).toBe(200);
  return order;
}

const detail = async (id: string) => (await planner.get(`/api/orders/${id}`)).body;
const storedFiles = () => {
  const dir = path.join(t.dataDir, 'files');
  return fs.existsSync(dir) ? fs.readdirSync(dir, { recursive: true }).filter((f) => !fs.statSync(path.join(dir, String(f))).isDirectory()).length : 0;
};

describe('orders: entry', () => {
  it('creates an order with a number, a routing made from the spec and the first gate', async () => {
    const order = await createOrder({ sizeMm: 120 });
    expect(order.number).toMatch(/^\d+$/);
    expect(order.status).toBe('awaiting_payment');
    const d = await detail(order.id);
    expect(d.spec.overrunPct).toBe(5);
    expect(d.openGates).toEqual(['payment_missing', 'proof_not_approved']);
    expect(d.routing.filter((s: { stationKind: string }) => s.stationKind === 'fill')).toHaveLength(2);
    expect(d.routing.filter((s: { stationKind: string }) => s.stationKind === 'cure')).toHaveLength(2);
    // 120 mm is outside the usual 10–100 mm for a pin: a warning, not a refusal
    expect(d.warnings.map((w: { code: string }) => w.code)).toContain('size_unusual');
    expect(d.history[0].text).toMatch(/entered/);
    // the line's numbers beside its English text, for screens in any language
    expect(d.history[0]).toMatchObject({ action: 'order.create', params: { variant: 'new', number: d.number } });
  });

  it('reuses a customer of the same name and lists the order for sales too', async () => {
    const a = await createOrder({ customer: 'Lantern Society' });
    const b = await createOrder({ customer: 'lantern society' });
    expect((await detail(a.id)).customer.id).toBe((await detail(b.id)).customer.id);
    const list = await sales.get('/api/orders');
    expect(list.status).toBe(200);
    const row = list.body.find((o: { id: string }) => o.id === a.id);
    expect(row).toMatchObject({ number: a.number, customer: 'Lantern Society', quantity: 1000, status: 'awaiting_payment', dueDate: DUE, late: false });
    expect(row).toHaveProperty('projectedShipAt');
  });

  it('an order past its due date and not shipped is late', async () => {
    const past = await createOrder({ dueDate: '2024-01-31' });
    const row = (await planner.get('/api/orders')).body.find((o: { id: string }) => o.id === past.id);
    expect(row.late).toBe(true);
    expect((await detail(past.id)).late).toBe(true);
  });

  it('refuses unknown fields, bad dates and an unknown customer id, creating nothing', async () => {
    const before = (await planner.get('/api/orders')).body.length;
    const r1 = await planner.post('/api/orders').send({ ...spec(), colour: 'red' });
    expect(r1.status).toBe(400);
    expect(r1.body.error.issues[0].code).toBe('unrecognized_keys');
    const r2 = await planner.post('/api/orders').send(spec({ dueDate: '2026-02-30' }));
    expect(r2.status).toBe(400);
    expect(r2.body.error.issues[0].path).toEqual(['dueDate']);
    const { customer: _c, ...noName } = spec();
    void _c;
    const r3 = await planner.post('/api/orders').send({ ...noName, customerId: 'no-such-customer' });
    expect(r3.status).toBe(400);
    expect(r3.body.error.code).toBe('unknown_customer');
    expect((await planner.get('/api/orders')).body.length).toBe(before);
  });

  it('refuses contradictory specs with 400 and an issue on the field that contradicts, creating and changing nothing', async () => {
    const before = (await planner.get('/api/orders')).body.length;
    const cases: [Partial<OrderSpecInput>, string][] = [
      [{ process: 'die_struck', material: 'brass' }, 'colours'],
      [{ process: 'hard_enamel', colours: [] }, 'colours'],
      [{ process: 'soft_enamel', colours: [] }, 'colours'],
      [{ plating: 'gold', secondPlating: 'gold' }, 'secondPlating'],
      [{ process: 'printed', backLogo: true }, 'backLogo'],
      [{ process: 'printed', sandblast: true }, 'sandblast'],
      [{ process: 'printed', secondPlating: 'nickel' }, 'secondPlating'],
    ];
    for (const [over, field] of cases) {
      const res = await planner.post('/api/orders').send(spec(over));
      expect(res.status, JSON.stringify(over)).toBe(400);
      expect(res.body.error.issues.map((i: { path: string[] }) => i.path.join('.'))).toEqual([field]);
      expect(res.body.error.issues[0].message.length).toBeGreaterThan(10);
    }
    expect((await planner.get('/api/orders')).body.length).toBe(before);
    // a change that makes an entered order contradictory is refused the same way and leaves it as it was
    const order = await createOrder();
    const res = await planner.patch(`/api/orders/${order.id}`).send({ process: 'die_struck' });
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string[] }) => i.path.join('.'))).toEqual(['colours']);
    expect((await detail(order.id)).spec.process).toBe('hard_enamel');
  });

  it('a hard enamel order with an epoxy dome is entered with a warning on the epoxy field', async () => {
    const order = await createOrder({ epoxy: true });
    const d = await detail(order.id);
    expect(d.warnings).toEqual([expect.objectContaining({ field: 'epoxy', code: 'epoxy_on_hard_enamel' })]);
    expect(d.routing.map((s: { stationKind: string }) => s.stationKind)).toContain('epoxy');
  });

  it('the routing follows the finish, the texture and the backing; a printed order gets a cutting die', async () => {
    const d = await detail(
      (
        await createOrder({
          process: 'die_struck',
          material: 'brass',
          colours: [],
          plating: 'antique_bronze',
          secondPlating: 'black_nickel',
          sandblast: true,
          backing: { type: 'safety_pin', count: 1 },
        })
      ).id,
    );
    expect(d.spec).toMatchObject({ plating: 'antique_bronze', secondPlating: 'black_nickel', sandblast: true });
    const kinds = d.routing.map((s: { stationKind: string }) => s.stationKind);
    expect(kinds).toEqual(['strike', 'trim', 'solder', 'polish', 'sandblast', 'plate', 'plate', 'antique', 'inspect', 'bag', 'pack', 'dispatch']);
    // a change to the finish makes the routing again
    const changed = await planner.patch(`/api/orders/${d.id}`).send({ secondPlating: null, plating: 'gold' });
    expect(changed.status).toBe(200);
    expect(changed.body.routing.map((s: { stationKind: string }) => s.stationKind)).toEqual([
      'strike',
      'trim',
      'solder',
      'polish',
      'sandblast',
      'plate',
      'inspect',
      'bag',
      'pack',
      'dispatch',
    ]);
    const update = (changed.body.history as { action: string; params: unknown }[]).findLast((h) => h.action === 'order.update');
    expect(update?.params).toMatchObject({ variant: 'remade' });
    expect([...(update?.params as { fields: string[] }).fields].sort()).toEqual(['plating', 'secondPlating']);

    const printed = await readyOrder({ process: 'printed', colours: [{ name: 'Navy' }], epoxy: false });
    const pd = await detail(printed.id);
    expect(pd.routing.map((s: { stationKind: string }) => s.stationKind)).not.toContain('epoxy');
    expect(pd.mouldPlan).toEqual([{ side: 'front', tool: 'cutting_die', reuse: false, mouldNumber: null }]);
    expect((await planner.post(`/api/orders/${printed.id}/release`).send({ traySize: 500 })).status).toBe(201);
    const after = await detail(printed.id);
    expect(after.mouldRouting.map((s: { name: string }) => s.name)).toEqual(['Make cutting die', 'Check cutting die']);
    expect(after.moulds[0]).toMatchObject({ tool: 'cutting_die', stepName: 'Make cutting die' });
  });

  it("the back mould's traveller is engraved and checked as the back mould", async () => {
    const order = await readyOrder({ backLogo: true, quantity: 100, title: 'Two-sided crest' });
    expect((await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 })).status).toBe(201);
    const d = await detail(order.id);
    const back = d.moulds.find((m: { side: string }) => m.side === 'back');
    const front = d.moulds.find((m: { side: string }) => m.side === 'front');
    expect(back).toMatchObject({ tool: 'back_mould', stepName: 'Engrave back mould' });
    expect(front).toMatchObject({ tool: 'front_mould', stepName: 'Engrave front mould' });
    const tray = (await planner.get(`/api/trays/${back.id}`)).body;
    expect(tray.routing.map((s: { name: string }) => s.name)).toEqual(['Engrave back mould', 'Check back mould']);
    expect(tray.nextStep.name).toBe('Engrave back mould');
  });

  it('an unknown order is 404', async () => {
    for (const res of [
      await planner.get('/api/orders/no-such-order'),
      await planner.post('/api/orders/no-such-order/payment').send({ amount: 1, reference: 'x' }),
      await planner.post('/api/orders/no-such-order/proofs').attach('file', png(), 'proof.png'),
      await planner.post('/api/orders/no-such-order/release').send({ traySize: 100 }),
      await planner.get('/api/orders/no-such-order/travellers.pdf'),
    ]) {
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
  });
});

describe('hold and cancel before release', () => {
  it('an order on hold cannot be released until the hold is lifted; a cancelled one never', async () => {
    const order = await readyOrder({ quantity: 100 });
    const held = await planner.post(`/api/orders/${order.id}/hold`).send({ reason: 'Customer checks the colours again' });
    expect(held.status).toBe(200);
    expect(held.body).toMatchObject({ status: 'on_hold', holdReason: 'Customer checks the colours again' });
    const refused = await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('order_on_hold');
    expect((await planner.post(`/api/orders/${order.id}/resume`).send({})).body.status).toBe('draft');
    expect((await planner.post(`/api/orders/${order.id}/resume`).send({})).status).toBe(409);

    const other = await createOrder();
    expect((await planner.post(`/api/orders/${other.id}/cancel`).send({ reason: 'x' })).status).toBe(400);
    expect((await planner.post(`/api/orders/${other.id}/cancel`).send({ reason: 'Customer withdrew' })).body.status).toBe('cancelled');
    expect((await planner.post(`/api/orders/${other.id}/payment`).send({ amount: 5, reference: 'late' })).body.error.code).toBe('order_cancelled');
    expect((await planner.post(`/api/orders/${other.id}/release`).send({ traySize: 100 })).body.error.code).toBe('order_cancelled');

    await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 });
    expect((await planner.post(`/api/orders/${order.id}/cancel`).send({ reason: 'Too late now' })).body.error.code).toBe('already_released');
    expect((await planner.post(`/api/orders/${order.id}/hold`).send({ reason: 'Too late now' })).body.error.code).toBe('already_released');
  });
});

describe('gates: payment and proof approval before release', () => {
  it('refuses release while a gate is open and says what is missing, changing nothing', async () => {
    const order = await createOrder();
    const r1 = await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 });
    expect(r1.status).toBe(409);
    expect(r1.body.error.code).toBe('payment_missing');
    expect(r1.body.error.missing).toEqual(['payment_missing', 'proof_not_approved']);

    expect((await planner.post(`/api/orders/${order.id}/payment`).send({ amount: 980.5, reference: 'BT-2231' })).status).toBe(201);
    expect((await detail(order.id)).status).toBe('awaiting_proof');
    const r2 = await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 });
    expect(r2.status).toBe(409);
    expect(r2.body.error.code).toBe('proof_not_approved');

    const up = await planner.post(`/api/orders/${order.id}/proofs`).attach('file', PDF, { filename: 'proof-rev1.pdf', contentType: 'application/pdf' });
    expect(up.status).toBe(201);
    expect(up.body).toEqual({ revision: 1 });
    const r3 = await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 });
    expect(r3.status).toBe(409);
    expect(r3.body.error.code).toBe('proof_not_approved');
    const d = await detail(order.id);
    expect(d.trays).toEqual([]);
    expect(d.moulds).toEqual([]);
    expect(d.releasedAt).toBeNull();

    const ok = await planner.post(`/api/orders/${order.id}/proofs/1/approve`).send({ approvedOn: '2026-01-15', note: 'by e-mail' });
    expect(ok.status).toBe(200);
    expect(ok.body.proofs[0].approvedAt).toBe('2026-01-15T12:00:00.000Z');
    expect(ok.body.openGates).toEqual([]);
    expect((await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 })).status).toBe(201);
  });

  it('a newer proof revision reopens the proof gate until it is approved', async () => {
    const order = await readyOrder();
    const up = await planner.post(`/api/orders/${order.id}/proofs`).attach('file', PDF, 'proof-rev2.pdf');
    expect(up.body.revision).toBe(2);
    expect((await detail(order.id)).openGates).toEqual(['proof_not_approved']);
    const old = await planner.post(`/api/orders/${order.id}/proofs/1/approve`).send({});
    expect(old.status).toBe(409);
    expect(old.body.error.code).toBe('already_approved');
    expect((await planner.post(`/api/orders/${order.id}/proofs/2/approve`).send({})).status).toBe(200);
    expect((await planner.post(`/api/orders/${order.id}/proofs/2/approve`).send({})).body.error.code).toBe('already_approved');
  });

  it('approval: unknown revision 404, a future date 400', async () => {
    const order = await createOrder();
    expect((await planner.post(`/api/orders/${order.id}/proofs/7/approve`).send({})).status).toBe(404);
    await planner.post(`/api/orders/${order.id}/proofs`).attach('file', png(), 'art.png');
    const future = await planner.post(`/api/orders/${order.id}/proofs/1/approve`).send({ approvedOn: '2999-01-01' });
    expect(future.status).toBe(400);
    expect((await detail(order.id)).proofs[0].approvedAt).toBeNull();
  });

  it('approval: the factory’s today counts, not the UTC date (07:30 in Shanghai is still yesterday in UTC)', async () => {
    const DAY = 86_400_000;
    // 23:30 UTC yesterday = 07:30 today in the factory (Asia/Shanghai, UTC+8 all year: IANA time zone database)
    const at = Math.floor(Date.now() / DAY) * DAY - 30 * 60_000;
    const factoryDay = new Date(at + DAY).toISOString().slice(0, 10);
    t.setNow(at);
    try {
      const order = await createOrder();
      await planner.post(`/api/orders/${order.id}/proofs`).attach('file', png(), 'art.png');
      const tomorrow = await planner.post(`/api/orders/${order.id}/proofs/1/approve`).send({ approvedOn: new Date(at + 2 * DAY).toISOString().slice(0, 10) });
      expect(tomorrow.status).toBe(400);
      const ok = await planner.post(`/api/orders/${order.id}/proofs/1/approve`).send({ approvedOn: factoryDay });
      expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    } finally {
      t.setNow(null);
    }
  });

  it('only a manager may let an order go without payment, and it is recorded', async () => {
    const order = await createOrder();
    const refused = await planner.post(`/api/orders/${order.id}/payment`).send({ exception: true, reason: 'Pays on delivery as agreed' });
    expect(refused.status).toBe(403);
    expect((await detail(order.id)).payments).toEqual([]);
    const ok = await manager.post(`/api/orders/${order.id}/payment`).send({ exception: true, reason: 'Pays on delivery as agreed' });
    expect(ok.status).toBe(201);
    expect(ok.body.payments[0]).toMatchObject({ isException: true, note: 'Pays on delivery as agreed' });
    expect(ok.body.openGates).toEqual(['proof_not_approved']);
  });

  it('payment input is checked', async () => {
    const order = await createOrder();
    for (const body of [{ amount: -5, reference: 'x' }, { amount: 10 }, { amount: 10, reference: 'x', extra: 1 }, { exception: true, reason: '' }]) {
      const res = await planner.post(`/api/orders/${order.id}/payment`).send(body);
      expect(res.status).toBe(400);
    }
    expect((await detail(order.id)).payments).toEqual([]);
  });
});

describe('proof uploads: checked by content, size, name (each refusal stores nothing)', () => {
  let orderId: string;
  beforeAll(async () => {
    orderId = (await createOrder()).id;
  });

  async function refused(res: { status: number; body: { error: { code: string; message: string } } }, status: number, code: string) {
    expect(res.status).toBe(status);
    expect(res.body.error.code).toBe(code);
    expect(res.body.error.message.length).toBeGreaterThan(10);
    expect((await detail(orderId)).proofs).toEqual([]);
  }

  it('a text file disguised by its name and type is refused', async () => {
    const files = storedFiles();
    const res = await planner
      .post(`/api/orders/${orderId}/proofs`)
      .attach('file', Buffer.from('MZ this is not an image at all'), { filename: 'proof.png', contentType: 'image/png' });
    await refused(res, 400, 'bad_file_type');
    expect(storedFiles()).toBe(files);
  });

  it('an SVG (could carry script) is refused though it calls itself an image', async () => {
    const res = await planner
      .post(`/api/orders/${orderId}/proofs`)
      .attach('file', Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), {
        filename: 'proof.jpg',
        contentType: 'image/jpeg',
      });
    await refused(res, 400, 'bad_file_type');
  });

  it('a file over the size limit is refused with 413', async () => {
    const big = Buffer.concat([PDF, Buffer.alloc(21 * 1024 * 1024, 0x20)]);
    const res = await planner.post(`/api/orders/${orderId}/proofs`).attach('file', big, 'big.pdf');
    await refused(res, 413, 'too_large');
  });

  it('an empty file is refused', async () => {
    const res = await planner.post(`/api/orders/${orderId}/proofs`).attach('file', Buffer.alloc(0), 'empty.pdf');
    await refused(res, 400, 'empty_file');
  });

  it('a path-like file name is refused', async () => {
    for (const filename of ['../../etc/passwd.png', '..\\..\\boot.png', 'art/../../x.pdf', 'C:\\proofs\\a.png']) {
      // filepath: the multipart writer would otherwise cut the name down to its last part
      const res = await planner
        .post(`/api/orders/${orderId}/proofs`)
        .attach('file', png(), { filepath: filename, contentType: 'image/png' } as unknown as { filename: string });
      await refused(res, 400, 'bad_file_name');
    }
  });

  it('no file at all is refused', async () => {
    const res = await planner.post(`/api/orders/${orderId}/proofs`).field('note', 'x');
    await refused(res, 400, 'file_missing');
  });

  it('a real PNG is stored by content hash and served back with its sniffed type', async () => {
    const content = png();
    const res = await planner
      .post(`/api/orders/${orderId}/proofs`)
      .attach('file', content, { filename: 'crest final.png', contentType: 'application/octet-stream' });
    expect(res.status).toBe(201);
    const d = await detail(orderId);
    expect(d.proofs[0]).toMatchObject({ revision: 1, mime: 'image/png', originalName: 'crest final.png', sizeBytes: content.length });
    const file = await sales.get(`/api/orders/${orderId}/proofs/1/file`).buffer(true);
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toMatch(/image\/png/);
    expect(Buffer.compare(file.body as Buffer, content)).toBe(0);
    // stored under the data folder by its sha-256, not by the name sent
    const hash = crypto.createHash('sha256').update(content).digest('hex');
    expect(fs.existsSync(path.join(t.dataDir, 'files', hash.slice(0, 2), hash))).toBe(true);
  });
});

describe('release: trays, moulds, codes', () => {
  it('splits quantity + overrun into trays, the last taking the remainder, with signed codes and first states', async () => {
    const order = await readyOrder({ quantity: 1000, overrunPct: 5 });
    const res = await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 });
    expect(res.status).toBe(201);
    const { trays, moulds } = res.body;
    expect(releasedQuantity(1000, 5)).toBe(1050);
    expect(trays.map((x: { quantity: number }) => x.quantity)).toEqual([...Array(10).fill(100), 50]);
    expect(trays[0].number).toBe(`${order.number}-01`);
    for (const tr of [...trays, ...moulds]) {
      expect(verifyTravellerCode(tr.code, t.deps.keys.traveller, 1)).toMatchObject({ status: 'ok', number: tr.number });
    }
    expect(moulds).toHaveLength(1);
    expect(moulds[0].number).toBe(`${order.number}-MF`);
    const d = await detail(order.id);
    expect(d.status).toBe('released');
    expect(d.trays.every((x: { phase: string; stepSeq: number }) => x.phase === 'waiting' && x.stepSeq === 1)).toBe(true);
    expect(d.moulds[0]).toMatchObject({ side: 'front', reused: false, stepSeq: 1, stationKind: 'engrave' });
    expect(d.history.at(-1).text).toMatch(/Released 1050 pieces in 11 trays/);
    // a released order gets a projected ship date after now (the shared projection)
    expect(Date.parse(d.projectedShipAt)).toBeGreaterThan(Date.now());
    const tray = await planner.get(`/api/trays/${trays[0].id}`);
    expect(tray.body).toMatchObject({
      id: trays[0].id,
      number: trays[0].number,
      code: trays[0].code,
      kind: 'tray',
      orderId: order.id,
      quantity: 100,
      status: 'waiting',
      nextStep: { seq: 1, stationKind: 'strike' },
    });
    expect(tray.body.routing.length).toBe(d.routing.length);
  });

  it('a back logo adds a back mould traveller', async () => {
    const order = await readyOrder({ backLogo: true, quantity: 300 });
    const res = await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 150 });
    expect(res.body.moulds.map((m: { number: string }) => m.number).sort()).toEqual([`${order.number}-MB`, `${order.number}-MF`]);
    expect(res.body.trays.map((x: { quantity: number }) => x.quantity)).toEqual([150, 150, 15]);
  });

  it('a release twice is refused and changes nothing', async () => {
    const order = await readyOrder({ quantity: 200 });
    expect((await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 })).status).toBe(201);
    const before = await detail(order.id);
    const again = await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 50 });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_released');
    const after = await detail(order.id);
    expect(after.trays.length).toBe(before.trays.length);
    expect(after.traySize).toBe(100);
  });

  it('bad release input: tray size 0, too many trays, a time in the future or over 90 days back', async () => {
    const order = await readyOrder({ quantity: 1000 });
    const now = Date.now();
    for (const [body, code] of [
      [{ traySize: 0 }, 'bad_input'],
      [{ traySize: 1 }, 'too_many_trays'],
      [{ traySize: 100, releasedAt: new Date(now + 3_600_000).toISOString() }, 'bad_released_at'],
      [{ traySize: 100, releasedAt: new Date(now - 100 * 86_400_000).toISOString() }, 'bad_released_at'],
    ] as const) {
      const res = await planner.post(`/api/orders/${order.id}/release`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.code).toBe(code);
    }
    expect((await detail(order.id)).trays).toEqual([]);
  });

  it('an order already on the floor is entered with its past release time', async () => {
    const order = await readyOrder({ quantity: 100 });
    const at = new Date(Date.now() - 10 * 86_400_000).toISOString();
    const res = await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100, releasedAt: at });
    expect(res.status).toBe(201);
    const d = await detail(order.id);
    expect(d.releasedAt).toBe(at);
    const tray = (await planner.get(`/api/trays/${res.body.trays[0].id}`)).body;
    expect(tray.releasedAt).toBe(at);
  });

  it('a reorder of the same design reuses its moulds and skips engraving', async () => {
    const first = await readyOrder({ backLogo: true, quantity: 100, title: 'Anniversary badge' });
    await planner.post(`/api/orders/${first.id}/release`).send({ traySize: 100 });
    const repeat = await readyOrder({ backLogo: true, quantity: 400, title: 'Anniversary badge (repeat)', reorderOf: first.id });
    const plan = (await detail(repeat.id)).mouldPlan;
    expect(plan).toEqual([
      { side: 'front', tool: 'front_mould', reuse: true, mouldNumber: `${first.number}-MF` },
      { side: 'back', tool: 'back_mould', reuse: true, mouldNumber: `${first.number}-MB` },
    ]);
    const res = await planner.post(`/api/orders/${repeat.id}/release`).send({ traySize: 200 });
    expect(res.status).toBe(201);
    const d = await detail(repeat.id);
    expect(d.reorderOf).toEqual({ id: first.id, number: first.number });
    expect(d.mouldRouting.map((s: { stationKind: string }) => s.stationKind)).toEqual(['mould_check']);
    expect(d.moulds.every((m: { reused: boolean; stationKind: string }) => m.reused && m.stationKind === 'mould_check')).toBe(true);
    const library = (await planner.get('/api/moulds')).body;
    const front = library.find((m: { number: string }) => m.number === `${first.number}-MF`);
    expect(front.useCount).toBe(2);
    expect(library.filter((m: { designKey: string }) => m.designKey === front.designKey)).toHaveLength(2);
  });
});

describe('routing edits before release only', () => {
  it('the planner reorders, removes and retimes steps; bad routings are refused', async () => {
    const order = await createOrder();
    const d = await detail(order.id);
    const steps = d.routing.map(({ seq: _s, standardMinutes: _m, ...rest }: Record<string, unknown>) => rest);
    const edited = [steps[1], steps[0], ...steps.slice(2).filter((s: { stationKind: string }) => s.stationKind !== 'clutch')].map((s, i) =>
      i === 0 ? { ...s, trayMinutes: 7.5 } : s,
    );
    const res = await planner.put(`/api/orders/${order.id}/routing`).send({ steps: edited });
    expect(res.status).toBe(200);
    expect(res.body.routing.map((s: { seq: number }) => s.seq)).toEqual(edited.map((_, i) => i + 1));
    expect(res.body.routing[0]).toMatchObject({ name: 'Trim', trayMinutes: 7.5 });
    expect(res.body.routing.some((s: { stationKind: string }) => s.stationKind === 'clutch')).toBe(false);

    const noCure = edited.map((s) => (s.stationKind === 'cure' ? { ...s, cureMinutes: null } : s));
    const bad = await planner.put(`/api/orders/${order.id}/routing`).send({ steps: noCure });
    expect(bad.status).toBe(400);
    expect((await planner.put(`/api/orders/${order.id}/routing`).send({ steps: [] })).status).toBe(400);
    expect((await detail(order.id)).routing.length).toBe(edited.length);

    const reset = await planner.post(`/api/orders/${order.id}/routing/reset`).send({});
    expect(reset.body.routing.length).toBe(steps.length);
  });

  it('a routing edit after release is refused and changes nothing', async () => {
    const order = await readyOrder({ quantity: 100 });
    await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 });
    const d = await detail(order.id);
    const steps = d.routing.map(({ seq: _s, standardMinutes: _m, ...rest }: Record<string, unknown>) => rest);
    const res = await planner.put(`/api/orders/${order.id}/routing`).send({ steps: steps.slice(1) });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('already_released');
    expect((await planner.post(`/api/orders/${order.id}/routing/reset`).send({})).status).toBe(409);
    expect((await planner.patch(`/api/orders/${order.id}`).send({ quantity: 5000 })).body.error.code).toBe('already_released');
    const after = await detail(order.id);
    expect(after.routing).toEqual(d.routing);
    expect(after.spec.quantity).toBe(100);
  });

  it('a spec change that shapes the routing makes it again; admins edit templates for new orders', async () => {
    const order = await createOrder();
    const changed = await planner.patch(`/api/orders/${order.id}`).send({ colours: [{ name: 'Red' }, { name: 'Blue' }, { name: 'Gold' }] });
    expect(changed.status).toBe(200);
    expect(changed.body.routing.filter((s: { stationKind: string }) => s.stationKind === 'fill')).toHaveLength(3);

    const templates = (await admin.get('/api/routing-templates')).body;
    const hard = templates.find((x: { process: string }) => x.process === 'hard_enamel').template;
    hard.steps = hard.steps.map((e: { type: string; cureStep?: object }) =>
      e.type === 'colours' ? { ...e, cureStep: { ...e.cureStep, cureMinutes: 180 } } : e,
    );
    expect((await planner.put('/api/routing-templates/hard_enamel').send(hard)).status).toBe(403);
    expect((await admin.put('/api/routing-templates/hard_enamel').send(hard)).status).toBe(200);
    const next = await createOrder();
    expect(
      (await detail(next.id)).routing.filter((s: { stationKind: string }) => s.stationKind === 'cure').map((s: { cureMinutes: number }) => s.cureMinutes),
    ).toEqual([180, 180]);
    expect((await admin.put('/api/routing-templates/hard_enamel').send({ ...hard, process: 'printed' })).status).toBe(400);
  });
});

describe('trays after release: reprint, split, merge, travellers', () => {
  let orderId: string;
  let trays: { id: string; number: string; code: string; quantity: number }[];
  beforeAll(async () => {
    const order = await readyOrder({ quantity: 300, overrunPct: 0 });
    orderId = order.id;
    trays = (await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 })).body.trays;
  });

  it('a reprint voids the old code and names the current revision', async () => {
    const res = await planner.post(`/api/trays/${trays[0].id}/reprint`).send({});
    expect(res.status).toBe(200);
    expect(res.body.revision).toBe(2);
    expect(res.body.code).not.toBe(trays[0].code);
    expect(verifyTravellerCode(trays[0].code, t.deps.keys.traveller, 2)).toMatchObject({ status: 'void_traveller', currentRevision: 2 });
    expect(verifyTravellerCode(res.body.code, t.deps.keys.traveller, 2).status).toBe('ok');
    // the tray page finds the tray by its typed number too
    expect((await planner.get(`/api/trays/${trays[0].number}`)).body.code).toBe(res.body.code);
  });

  it('a split conserves pieces and keeps the genealogy; a too-large split is refused', async () => {
    const tooMany = await planner.post(`/api/trays/${trays[1].id}/split`).send({ parts: [{ quantity: 100 }] });
    expect(tooMany.status).toBe(409);
    expect(tooMany.body.error.code).toBe('nothing_left');
    const res = await planner.post(`/api/trays/${trays[1].id}/split`).send({ parts: [{ quantity: 30 }, { quantity: 5 }], note: 'second finish' });
    expect(res.status).toBe(201);
    expect(res.body.tray.quantity).toBe(65);
    expect(res.body.children.map((c: { number: string }) => c.number)).toEqual([`${trays[1].number}.1`, `${trays[1].number}.2`]);
    const parent = (await planner.get(`/api/trays/${trays[1].id}`)).body;
    expect(parent.quantity + parent.children.reduce((a: number, c: { quantity: number }) => a + c.quantity, 0)).toBe(100);
    expect(parent.events.at(-1)).toMatchObject({ type: 'split', qtyIn: 100 });
    const child = (await planner.get(`/api/trays/${res.body.children[0].id}`)).body;
    expect(child.parent).toMatchObject({ id: trays[1].id, number: trays[1].number });
    expect(child.nextStep.seq).toBe(1);
  });

  it('trays of the same order at the same step merge; other orders do not', async () => {
    const res = await planner.post('/api/trays/merge').send({ trayIds: [trays[2].id, trays[1].id] });
    expect(res.status).toBe(200);
    expect(res.body.tray.quantity).toBe(165);
    const merged = (await planner.get(`/api/trays/${trays[1].id}`)).body;
    expect(merged).toMatchObject({ status: 'merged', quantity: 0, mergedInto: { id: trays[2].id } });
    const target = (await planner.get(`/api/trays/${trays[2].id}`)).body;
    expect(target.mergedFrom).toEqual([{ id: trays[1].id, number: trays[1].number, quantity: 65 }]);

    const other = await readyOrder({ quantity: 50 });
    const otherTray = (await planner.post(`/api/orders/${other.id}/release`).send({ traySize: 50 })).body.trays[0];
    const refused = await planner.post('/api/trays/merge').send({ trayIds: [trays[0].id, otherTray.id] });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('different_orders');
    expect((await planner.post('/api/trays/merge').send({ trayIds: [trays[0].id, trays[0].id] })).status).toBe(400);
  });

  it('builds the travellers PDF of the order, one A6 page per traveller (merged ones left out)', async () => {
    const res = await planner.get(`/api/orders/${orderId}/travellers.pdf`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const file = path.join(t.dataDir, 'order.pdf');
    fs.writeFileSync(file, pdf);
    const info = execFileSync('pdfinfo', [file]).toString();
    const d = await detail(orderId);
    const live = [...d.trays, ...d.moulds].filter((x: { phase: string }) => x.phase !== 'merged').length;
    expect(info).toMatch(new RegExp(`Pages:\\s+${live}\\b`));
    const four = await planner.get(`/api/orders/${orderId}/travellers.pdf?layout=a4x4`).buffer(true);
    fs.writeFileSync(file, four.body as Buffer);
    expect(execFileSync('pdfinfo', [file]).toString()).toMatch(new RegExp(`Pages:\\s+${Math.ceil(live / 4)}\\b`));
    const one = await planner.get(`/api/trays/${trays[0].id}/traveller.pdf`).buffer(true);
    expect(one.status).toBe(200);
    fs.writeFileSync(file, one.body as Buffer);
    expect(execFileSync('pdftotext', [file, '-']).toString()).toContain(trays[0].number);
    expect((await planner.get(`/api/orders/${orderId}/travellers.pdf?layout=a3`)).status).toBe(400);
    expect((await planner.get(`/api/orders/${orderId}/travellers.pdf?ids=not-one-of-ours`)).status).toBe(404);
  });

  it('an order not released has nothing to print', async () => {
    const order = await createOrder();
    const res = await planner.get(`/api/orders/${order.id}/travellers.pdf`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('no_travellers');
  });

  it('the mould library records the storage place', async () => {
    const library = (await planner.get('/api/moulds')).body;
    expect(library.length).toBeGreaterThan(0);
    const m = library[0];
    const res = await planner.patch(`/api/moulds/${m.id}`).send({ storageLocation: 'Shelf B-4' });
    expect(res.status).toBe(200);
    expect(res.body.storageLocation).toBe('Shelf B-4');
    expect((await planner.patch(`/api/moulds/${m.id}`).send({})).status).toBe(400);
    expect((await planner.patch('/api/moulds/no-such-mould').send({ storageLocation: 'x' })).status).toBe(404);
  });
});

describe('CSV import', () => {
  const header = 'customer,title,process,material,sizeMm,quantity,colours,plating,backingType,packaging,dueDate';
  const good = 'Quarry Choir,Choir pin,soft_enamel,iron,20,250,Red #c8102e; Gold,silver,butterfly_clutch,bulk,2026-10-01';
  const bad = 'Quarry Choir,Choir pin,glass,iron,20,lots,Red,silver,butterfly_clutch,bulk,2026-10-01';

  it('previews with an error per bad row and cell, then imports only the valid rows', async () => {
    const before = (await planner.get('/api/orders')).body.length;
    const csv = [header, good, bad].join('\n');
    const preview = await planner.post('/api/orders/import/preview').send({ csv });
    expect(preview.status).toBe(200);
    expect(preview.body.validCount).toBe(1);
    expect(preview.body.rows[1].errors.map((e: { column: string }) => e.column).sort()).toEqual(['process', 'quantity']);
    expect((await planner.get('/api/orders')).body.length).toBe(before);
    const res = await planner.post('/api/orders/import').send({ csv });
    expect(res.status).toBe(201);
    expect(res.body.created).toHaveLength(1);
    expect(res.body.skipped).toEqual([3]);
    expect((await planner.get('/api/orders')).body.length).toBe(before + 1);
  });

  it('an uploaded file is previewed too; a file that is not CSV, too large, or without a valid row changes nothing', async () => {
    const before = (await planner.get('/api/orders')).body.length;
    const up = await planner.post('/api/orders/import/preview').attach('file', Buffer.from([header, good].join('\n')), 'orders.csv');
    expect(up.status).toBe(200);
    expect(up.body.validCount).toBe(1);
    const notCsv = await planner.post('/api/orders/import/preview').attach('file', png(), 'orders.csv');
    expect(notCsv.status).toBe(400);
    expect(notCsv.body.error.code).toBe('not_csv');
    const tooBig = await planner.post('/api/orders/import/preview').attach('file', Buffer.alloc(1024 * 1024 + 10, 0x41), 'orders.csv');
    expect(tooBig.status).toBe(413);
    const none = await planner.post('/api/orders/import').send({ csv: [header, bad].join('\n') });
    expect(none.status).toBe(400);
    expect(none.body.error.code).toBe('nothing_to_import');
    expect((await planner.post('/api/orders/import').send({ csv: 'x'.repeat(1024 * 1024 + 1) })).status).toBe(413);
    expect((await planner.get('/api/orders')).body.length).toBe(before);
  });
});

describe('moulds gate the strike: trays wait until their mould travellers finish', () => {
  it('new mould: engraved and checked; reorder: checked only; then striking may start', async () => {
    const operator = await t.agentAs('operator');
    const stations: { id: string; kind: string }[] = (await planner.get('/api/stations')).body;
    const at = (kind: string) => stations.find((s) => s.kind === kind)!.id;
    const scan = async (code: string, kind: string, type: 'start' | 'finish', extra: Record<string, unknown> = {}) => {
      const res = await operator
        .post('/api/scans')
        .send({ events: [{ id: crypto.randomUUID(), code, stationId: at(kind), type, occurredAt: new Date().toISOString(), ...extra }] });
      expect(res.status).toBe(200);
      return res.body.results[0];
    };

    const first = await readyOrder({ quantity: 100, overrunPct: 0 });
    const released = (await planner.post(`/api/orders/${first.id}/release`).send({ traySize: 100 })).body;
    const tray = released.trays[0];
    const mould = released.moulds[0];
    expect(await scan(tray.code, 'strike', 'start')).toMatchObject({ status: 'rejected', code: 'mould_not_ready' });
    for (const kind of ['engrave', 'mould_check']) {
      expect((await scan(mould.code, kind, 'start')).status).toBe('accepted');
      expect((await scan(mould.code, kind, 'finish', { goodQty: 1, scrapQty: 0 })).status).toBe('accepted');
    }
    expect((await planner.get('/api/moulds')).body.find((m: { number: string }) => m.number === mould.number).status).toBe('ready');
    expect((await scan(tray.code, 'strike', 'start')).status).toBe('accepted');

    const repeat = await readyOrder({ quantity: 100, overrunPct: 0, reorderOf: first.id });
    const again = (await planner.post(`/api/orders/${repeat.id}/release`).send({ traySize: 100 })).body;
    expect(await scan(again.trays[0].code, 'strike', 'start')).toMatchObject({ status: 'rejected', code: 'mould_not_ready' });
    // a stored mould is not engraved again: its traveller waits at the check
    expect((await scan(again.moulds[0].code, 'engrave', 'start')).status).toBe('rejected');
    expect((await scan(again.moulds[0].code, 'mould_check', 'start')).status).toBe('accepted');
    expect((await scan(again.moulds[0].code, 'mould_check', 'finish', { goodQty: 1, scrapQty: 0 })).status).toBe('accepted');
    expect((await scan(again.trays[0].code, 'strike', 'start')).status).toBe('accepted');
  });
});
