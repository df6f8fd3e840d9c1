import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from '../support/test-app';
import { finishDispatch, insertShippingOrder, moveTray, SEQ } from '../support/shipping-fixtures';
import { orders } from '../../server/db/schema/orders';
import { syncOrderStatus } from '../../server/services/shipping.service';
import { insertBadgeUser, pairTablet, scan, tabletAgent } from '../support/scan-fixtures';
import { getPdf, pdfToText } from '../support/pdf';

type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let sales: Agent;
let supervisor: Agent;

beforeAll(async () => {
  t = makeTestApp();
  sales = await t.agentAs('sales');
  supervisor = await t.agentAs('supervisor');
});
afterAll(() => t.close());

const carton = (count: number, piecesPerCarton: number, weightKg = 2.5) => ({ count, piecesPerCarton, weightKg });

describe('packing', () => {
  it('shows what is packed and what is still on the floor of a partly packed order', async () => {
    const o = insertShippingOrder(t.deps, {
      quantity: 300,
      trays: [
        { quantity: 100, at: SEQ.dispatch },
        { quantity: 100, at: SEQ.pack },
        { quantity: 105, at: SEQ.polish },
      ],
    });
    const res = await supervisor.get(`/api/orders/${o.orderId}/packing`);
    expect(res.status).toBe(200);
    expect(res.body.packedTrays.map((x: { number: string }) => x.number)).toEqual([o.trays[0].number]);
    expect(res.body.onFloor.map((x: { number: string; stationKind: string }) => [x.number, x.stationKind])).toEqual([
      [o.trays[1].number, 'pack'],
      [o.trays[2].number, 'polish'],
    ]);
    // finished = pieces at packing or beyond (trays 1 and 2); on the floor = tray 3
    expect(res.body.quantities).toMatchObject({ ordered: 300, finished: 200, onFloor: 105, reachable: 305, availableToShip: 200, verdict: 'ok' });
  });

  it('records cartons, and refuses more pieces in cartons than are finished', async () => {
    const o = insertShippingOrder(t.deps, {
      quantity: 200,
      trays: [
        { quantity: 120, at: SEQ.pack },
        { quantity: 90, at: SEQ.inspect },
      ],
    });
    const ok = await supervisor.post(`/api/orders/${o.orderId}/cartons`).send({ cartons: [carton(1, 100), carton(1, 20, 0.6)] });
    expect(ok.status).toBe(201);
    expect(ok.body.cartons).toHaveLength(2);
    expect(ok.body.quantities.inCartons).toBe(120);
    const more = await supervisor.post(`/api/orders/${o.orderId}/cartons`).send({ cartons: [carton(1, 1)] });
    expect(more.status).toBe(409);
    expect(more.body.error.code).toBe('more_than_made');
    // taking a carton apart frees its pieces
    const back = await supervisor.delete(`/api/orders/${o.orderId}/cartons/${ok.body.cartons[1].id}`);
    expect(back.status).toBe(200);
    expect(back.body.quantities.inCartons).toBe(100);
  });
});

describe('shipments', () => {
  it('records carrier, normalised tracking number and carton arithmetic; partial shipments allowed', async () => {
    const o = insertShippingOrder(t.deps, {
      quantity: 400,
      trays: [
        { quantity: 210, at: SEQ.dispatch },
        { quantity: 210, at: SEQ.polish },
      ],
    });
    const packed = await supervisor.post(`/api/orders/${o.orderId}/cartons`).send({ cartons: [carton(1, 100, 3.1), carton(1, 100, 3.1)] });
    const packedIds = packed.body.cartons.map((c: { id: string }) => c.id);
    // a hand scanner sends a symbology prefix and a line end; people type lower case
    const res = await sales.post(`/api/orders/${o.orderId}/shipments`).send({
      carrier: 'Invented Parcel Co',
      trackingNumber: ']C1ipc 7781 0042\r',
      cartons: [{ cartonId: packedIds[0] }, carton(1, 10, 0.4)],
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ number: 1, carrier: 'Invented Parcel Co', trackingNumber: 'IPC77810042', pieces: 110, cartonCount: 2, weightKg: 3.5 });
    const view = await supervisor.get(`/api/orders/${o.orderId}/packing`);
    expect(view.body.cartons.map((c: { id: string }) => c.id)).toEqual([packedIds[1]]);
    expect(view.body.quantities).toMatchObject({ shipped: 110, availableToShip: 100, inCartons: 100 });
    const second = await sales
      .post(`/api/orders/${o.orderId}/shipments`)
      .send({ carrier: 'Invented Parcel Co', trackingNumber: 'IPC77810043', cartons: [{ cartonId: packedIds[1] }] });
    expect(second.status).toBe(201);
    expect(second.body.number).toBe(2);
  });

  it('refuses shipping more than was made', async () => {
    const o = insertShippingOrder(t.deps, {
      quantity: 200,
      trays: [
        { quantity: 100, at: SEQ.dispatch },
        { quantity: 100, at: SEQ.fill },
      ],
    });
    const res = await sales.post(`/api/orders/${o.orderId}/shipments`).send({ carrier: 'X Freight', trackingNumber: 'XF00001', cartons: [carton(1, 101)] });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: 'more_than_made', pieces: 101, available: 100 });
    expect((await supervisor.get(`/api/orders/${o.orderId}/packing`)).body.shipments).toEqual([]);
  });

  it('warns about a tracking number already on another order, and records it when confirmed', async () => {
    const one = insertShippingOrder(t.deps, { trays: [{ quantity: 50, at: SEQ.dispatch }] });
    const two = insertShippingOrder(t.deps, { trays: [{ quantity: 60, at: SEQ.dispatch }] });
    const body = { carrier: 'X Freight', trackingNumber: 'XF-555-0101', cartons: [carton(1, 50)] };
    expect((await sales.post(`/api/orders/${one.orderId}/shipments`).send(body)).status).toBe(201);
    const dup = await sales.post(`/api/orders/${two.orderId}/shipments`).send({ ...body, cartons: [carton(1, 60)] });
    expect(dup.status).toBe(409);
    expect(dup.body.error).toMatchObject({ code: 'duplicate_tracking', orders: [one.number] });
    const confirmed = await sales.post(`/api/orders/${two.orderId}/shipments`).send({ ...body, cartons: [carton(1, 60)], confirmDuplicate: true });
    expect(confirmed.status).toBe(201);
    expect(confirmed.body.sharedWith).toEqual([one.number]);
    // the same number twice on one order is a double scan
    const again = await sales.post(`/api/orders/${two.orderId}/shipments`).send({ ...body, cartons: [carton(1, 1)], confirmDuplicate: true });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('tracking_already_recorded');
  });

  it('flags an under-quantity order for a decision before it ships', async () => {
    // 300 ordered; 20 scrapped along the way leave 280 made (short by 20)
    const o = insertShippingOrder(t.deps, {
      quantity: 300,
      trays: [
        { quantity: 140, at: SEQ.dispatch },
        { quantity: 140, at: SEQ.dispatch },
        { quantity: 20, at: 'scrapped' },
      ],
    });
    const view = await sales.get(`/api/orders/${o.orderId}/packing`);
    expect(view.body.quantities).toMatchObject({ verdict: 'under', shortBy: 20, needsDecision: true });
    const body = { carrier: 'X Freight', trackingNumber: 'XF-SHORT-1', cartons: [carton(2, 140)] };
    const refused = await sales.post(`/api/orders/${o.orderId}/shipments`).send(body);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({ code: 'short_quantity', shortBy: 20 });
    const decided = await sales.post(`/api/orders/${o.orderId}/shipments`).send({ ...body, acceptShort: true, note: 'Customer agreed by phone' });
    expect(decided.status).toBe(201);
    expect(decided.body.shortAccepted).toBe(true);
    const after = await sales.get(`/api/orders/${o.orderId}/packing`);
    expect(after.body.quantities).toMatchObject({ needsDecision: false, shortAccepted: true });
  });

  it('refuses bad input: unknown order, no cartons, a bad tracking number, fractional counts', async () => {
    const o = insertShippingOrder(t.deps, { trays: [{ quantity: 10, at: SEQ.dispatch }] });
    expect((await sales.post('/api/orders/nope/shipments').send({ carrier: 'X', trackingNumber: 'ABCD1', cartons: [carton(1, 1)] })).status).toBe(404);
    for (const bad of [
      { carrier: 'X', trackingNumber: 'ABCD1', cartons: [] },
      { carrier: 'X', trackingNumber: 'AB/CD', cartons: [carton(1, 1)] },
      { carrier: '', trackingNumber: 'ABCD1', cartons: [carton(1, 1)] },
      { carrier: 'X', trackingNumber: 'ABCD1', cartons: [carton(1.5, 1)] },
    ]) {
      const res = await sales.post(`/api/orders/${o.orderId}/shipments`).send(bad);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('bad_input');
    }
    const op = await t.agentAs('operator');
    expect((await op.post(`/api/orders/${o.orderId}/shipments`).send({ carrier: 'X', trackingNumber: 'ABCD1', cartons: [carton(1, 1)] })).status).toBe(403);
  });

  it('refuses a cancelled or unreleased order', async () => {
    const c = insertShippingOrder(t.deps, { status: 'cancelled', trays: [{ quantity: 10, at: SEQ.dispatch }] });
    const d = insertShippingOrder(t.deps, { status: 'awaiting_proof', trays: [] });
    const body = { carrier: 'X', trackingNumber: 'ABCD12', cartons: [carton(1, 1)] };
    expect((await sales.post(`/api/orders/${c.orderId}/shipments`).send(body)).body.error.code).toBe('order_cancelled');
    expect((await sales.post(`/api/orders/${d.orderId}/shipments`).send(body)).body.error.code).toBe('not_released');
  });

  it('prints a packing list PDF with the order, carrier, tracking number and cartons', async () => {
    const o = insertShippingOrder(t.deps, { title: 'Harbour lights enamel pin', trays: [{ quantity: 425, at: SEQ.dispatch }] });
    const ship = await sales
      .post(`/api/orders/${o.orderId}/shipments`)
      .send({ carrier: 'Invented Parcel Co', trackingNumber: 'IPC-PL-0425', cartons: [carton(4, 100, 2.35), carton(1, 25, 0.7)] });
    expect(ship.status).toBe(201);
    const res = await getPdf(sales, `/api/orders/${o.orderId}/shipments/${ship.body.id}/packing-list.pdf`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    // Read back with an independent tool (poppler's pdftotext), not with the library that wrote it.
    const file = path.join(t.dataDir, 'packing-list.pdf');
    const text = pdfToText(pdf, file);
    for (const s of [o.number, 'Harbour lights enamel pin', 'Invented Parcel Co', 'IPC-PL-0425', '425', '10.1 kg']) expect(text).toContain(s);
    const fonts = execFileSync('pdffonts', [file], { encoding: 'utf8' });
    expect(fonts).toMatch(/Atkinson/i);
    expect((await sales.get(`/api/orders/${o.orderId}/shipments/not-a-shipment/packing-list.pdf`)).status).toBe(404);
  });
});

describe('packing list in Chinese', () => {
  it('prints a Chinese customer, contact and title (read back by pdftotext) with an embedded CJK face', async () => {
    const o = insertShippingOrder(t.deps, {
      customer: '星河徽章俱乐部',
      contactName: '李明',
      title: '深蓝星河徽章',
      trays: [{ quantity: 120, at: SEQ.dispatch }],
    });
    const ship = await sales
      .post(`/api/orders/${o.orderId}/shipments`)
      .send({ carrier: '顺达快运', trackingNumber: 'SD-0001-CN', cartons: [carton(1, 120, 1.2)] });
    expect(ship.status).toBe(201);
    const res = await getPdf(sales, `/api/orders/${o.orderId}/shipments/${ship.body.id}/packing-list.pdf`);
    expect(res.status).toBe(200);
    const file = path.join(t.dataDir, 'packing-list-zh.pdf');
    const text = pdfToText(res.body as Buffer, file);
    for (const s of ['星河徽章俱乐部', '李明', '深蓝星河徽章', '顺达快运', 'SD-0001-CN', o.number]) expect(text).toContain(s);
    expect(execFileSync('pdffonts', [file], { encoding: 'utf8' })).toMatch(/NotoSansHans/);
  });
});

describe('when an order counts as shipped', () => {
  it('ships when the dispatch step of its last tray finishes; a written-off tray counts as done', async () => {
    const o = insertShippingOrder(t.deps, {
      quantity: 200,
      trays: [
        { quantity: 100, at: SEQ.dispatch },
        { quantity: 95, at: SEQ.dispatch },
        { quantity: 5, at: 'scrapped' },
      ],
    });
    const t1 = Date.parse('2025-05-06T09:30:00.000Z');
    const t2 = Date.parse('2025-05-07T15:45:00.000Z');
    finishDispatch(t.deps, o.trays[0].id, t1);
    // both live trays are past packing: packed, not shipped
    expect(syncOrderStatus(t.deps.db, o.orderId, Date.now())).toBe('packed');
    let detail = await sales.get(`/api/sales/orders/${o.orderId}`);
    expect(detail.body).toMatchObject({ status: 'packed', shippedAt: null, stage: 'Packing' });
    // beside each English line, its code and numbers for screens in any language
    expect(detail.body.stageTextCode).toMatchObject({ code: 'in_stage', params: { stage: 'packing', orderOnHold: false } });
    expect(detail.body.projectionNoteCode).toHaveProperty('code');
    const history = detail.body.history as { code: string; what: string; params: object }[];
    expect(history.find((h) => h.code === 'entered')).toMatchObject({ what: 'Order entered', params: {} });
    expect(history.every((h) => typeof h.code === 'string' && typeof h.what === 'string')).toBe(true);
    finishDispatch(t.deps, o.trays[1].id, t2);
    expect(syncOrderStatus(t.deps.db, o.orderId, Date.now())).toBe('shipped');
    const row = t.deps.db.select().from(orders).where(eq(orders.id, o.orderId)).get()!;
    expect(row.status).toBe('shipped');
    expect(row.shippedAt).toBe(t2);
    detail = await sales.get(`/api/sales/orders/${o.orderId}`);
    expect(detail.body).toMatchObject({ status: 'shipped', shippedAt: '2025-05-07T15:45:00.000Z', stage: 'Shipped' });
    expect(detail.body.stageTextCode).toEqual({ code: 'shipped' });
    expect((detail.body.history as { code: string }[]).find((h) => h.code === 'shipped')).toMatchObject({
      what: 'Shipped: the last tray left dispatch',
      at: '2025-05-07T15:45:00.000Z',
    });
  });

  it('marks the order packed once every tray has finished packing', async () => {
    const o = insertShippingOrder(t.deps, {
      trays: [
        { quantity: 10, at: SEQ.dispatch },
        { quantity: 10, at: SEQ.pack },
      ],
    });
    expect(syncOrderStatus(t.deps.db, o.orderId, Date.now())).toBeNull();
    moveTray(t.deps, o.trays[1].id, SEQ.dispatch);
    expect(syncOrderStatus(t.deps.db, o.orderId, Date.now())).toBe('packed');
  });
});

describe('through the station tablets', () => {
  it('the dispatch finish scan of the last tray ships the order, at that scan’s time', async () => {
    const o = insertShippingOrder(t.deps, {
      trays: [
        { quantity: 30, at: SEQ.dispatch },
        { quantity: 30, at: SEQ.dispatch },
      ],
    });
    const tablet = pairTablet(t, 'DSP-1');
    const person = await insertBadgeUser(t, 'operator', `B-9${Math.floor(Math.random() * 900 + 100)}`, '4711');
    const agent = await tabletAgent(t, tablet.token, person);
    const base = Date.now() - 10 * 60_000;
    const events = [
      scan(o.trays[0].number, tablet.stationId, 'start', base),
      scan(o.trays[0].number, tablet.stationId, 'finish', base + 60_000, { goodQty: 30, scrapQty: 0 }),
      scan(o.trays[1].number, tablet.stationId, 'start', base + 120_000),
    ];
    const first = await agent.post('/api/scans').send({ events });
    expect(first.status).toBe(200);
    expect(first.body.results.map((r: { status: string }) => r.status)).toEqual(['accepted', 'accepted', 'accepted']);
    let row = t.deps.db.select().from(orders).where(eq(orders.id, o.orderId)).get()!;
    expect(row.status).not.toBe('shipped');
    const lastAt = base + 180_000;
    const last = await agent.post('/api/scans').send({ events: [scan(o.trays[1].number, tablet.stationId, 'finish', lastAt, { goodQty: 30, scrapQty: 0 })] });
    expect(last.body.results[0].status).toBe('accepted');
    row = t.deps.db.select().from(orders).where(eq(orders.id, o.orderId)).get()!;
    expect(row.status).toBe('shipped');
    expect(row.shippedAt).toBe(lastAt);
  });
});
