import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { sha256 } from '@noble/hashes/sha2';
import { bytesToHex } from '@noble/hashes/utils';
import { makeTestApp, type TestApp } from '../support/test-app';
import { finishDispatch, insertShippingOrder, SEQ, type ShippingOrderFixture } from '../support/shipping-fixtures';
import { shareLinks } from '../../server/db/schema/shipping';
import { PUBLIC_STATUS_PER_MINUTE } from '../../server/routes/sales.routes';

type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let sales: Agent;
let a: ShippingOrderFixture;
let b: ShippingOrderFixture;

// The public answer: exactly these fields (api.md, "Sales and customers").
// `process` is ours: it picks the plain-words story of how her pins are made; `contact` too: the
// factory's order mail address, where she writes about the order.
const DOCUMENTED = [
  'factory',
  'number',
  'title',
  'customer',
  'quantity',
  'process',
  'stage',
  'stages',
  'story',
  'projectedShipAt',
  'updatedAt',
  'contact',
  'shippedAt',
  'carrier',
  'trackingNumber',
  'trackingUrl',
];

beforeAll(async () => {
  t = makeTestApp();
  sales = await t.agentAs('sales');
  a = insertShippingOrder(t.deps, {
    customer: 'Invented Kite Club',
    title: 'Kite festival pin',
    trays: [
      { quantity: 100, at: SEQ.fill },
      { quantity: 100, at: SEQ.polish },
    ],
  });
  b = insertShippingOrder(t.deps, { customer: 'Invented Choir Guild', title: 'Choir anniversary coin', trays: [{ quantity: 50, at: SEQ.inspect }] });
});
afterAll(() => t.close());

/** Every request from its own address, so the rate limit only bites where a test wants it. */
let ip = 1;
const pub = (path: string) =>
  request(t.app)
    .get(path)
    .set('X-Forwarded-For', `10.0.${Math.floor(ip / 250)}.${(ip++ % 250) + 1}`);

describe('customer status link', () => {
  it('gives a token of at least 128 bits, stored only as its hash', async () => {
    const res = await sales.post(`/api/orders/${a.orderId}/share`).send({});
    expect(res.status).toBe(201);
    const { token, url } = res.body as { token: string; url: string };
    expect(Buffer.from(token, 'base64url').length * 8).toBeGreaterThanOrEqual(128);
    expect(url.endsWith(`/status/${token}`)).toBe(true);
    const rows = t.deps.db.select().from(shareLinks).all();
    expect(JSON.stringify(rows)).not.toContain(token);
    // SHA-256 cross-checked with an independent implementation (@noble/hashes; FIPS 180-4).
    expect(rows.map((r) => r.tokenHash)).toContain(bytesToHex(sha256(new TextEncoder().encode(token))));
  });

  it('shows exactly the documented fields, and only its own order', async () => {
    const ta = (await sales.post(`/api/orders/${a.orderId}/share`).send({})).body.token as string;
    const tb = (await sales.post(`/api/orders/${b.orderId}/share`).send({})).body.token as string;
    const ra = await pub(`/api/public/status/${ta}`);
    const rb = await pub(`/api/public/status/${tb}`);
    expect(ra.status).toBe(200);
    expect(rb.status).toBe(200);
    for (const key of Object.keys(ra.body)) expect(DOCUMENTED).toContain(key);
    expect(Object.keys(ra.body).sort()).toEqual([
      'contact',
      'customer',
      'factory',
      'number',
      'process',
      'projectedShipAt',
      'quantity',
      'stage',
      'stages',
      'story',
      'title',
      'updatedAt',
    ]);
    // the page's header facts: the factory, the order's number and quantity, when it last changed, whom to write to
    expect(ra.body).toMatchObject({ factory: expect.any(String), number: a.number, quantity: expect.any(Number), contact: expect.stringMatching(/^orders@/) });
    expect(Number.isFinite(Date.parse(ra.body.updatedAt))).toBe(true);
    expect(ra.body).toMatchObject({ title: 'Kite festival pin', customer: 'Invented Kite Club', stage: 'Colour' });
    expect(rb.body).toMatchObject({ title: 'Choir anniversary coin', customer: 'Invented Choir Guild', stage: 'Inspection' });
    const textA = JSON.stringify(ra.body);
    expect(textA).not.toContain('Choir');
    expect(textA).not.toContain(b.number);
    // its own number, but no notes or ids
    expect(ra.body.number).toBe(a.number);
    expect(textA).not.toContain('internal');
    expect(textA).not.toContain(a.orderId);
    expect(textA).not.toContain(a.orderId);
    // the fixture's trays stand at their steps without scans, so no stage has a date yet
    expect(ra.body.stages).toEqual([
      { key: 'artwork_moulds', name: 'Artwork and moulds', done: true },
      { key: 'metal_forming', name: 'Metal forming', done: true },
      { key: 'colour', name: 'Colour', done: false },
      { key: 'finishing_plating', name: 'Finishing and plating', done: false },
      { key: 'inspection', name: 'Inspection', done: false },
      { key: 'packing', name: 'Packing', done: false },
      { key: 'shipped', name: 'Shipped', done: false },
    ]);
    expect(Number.isNaN(Date.parse(ra.body.projectedShipAt))).toBe(false);
    expect(Date.parse(ra.body.projectedShipAt)).toBeGreaterThan(Date.now());
  });

  it('answers noindex and no-store', async () => {
    const token = (await sales.post(`/api/orders/${a.orderId}/share`).send({})).body.token as string;
    const res = await pub(`/api/public/status/${token}`);
    expect(res.headers['x-robots-tag']).toMatch(/noindex/);
    expect(res.headers['cache-control']).toMatch(/no-store/);
  });

  it('answers 404 for an unknown, malformed or revoked token', async () => {
    const unknown = Buffer.alloc(32, 7).toString('base64url');
    expect((await pub(`/api/public/status/${unknown}`)).status).toBe(404);
    expect((await pub('/api/public/status/short')).status).toBe(404);
    expect((await pub('/api/public/status/..%2F..%2Fetc')).status).toBe(404);
    const token = (await sales.post(`/api/orders/${b.orderId}/share`).send({})).body.token as string;
    expect((await pub(`/api/public/status/${token}`)).status).toBe(200);
    expect((await sales.delete(`/api/orders/${b.orderId}/share`)).status).toBe(204);
    const gone = await pub(`/api/public/status/${token}`);
    expect(gone.status).toBe(404);
    expect(gone.body.error.code).toBe('not_found');
    // revoking b's links leaves a's alone
    const ta = (await sales.post(`/api/orders/${a.orderId}/share`).send({})).body.token as string;
    expect((await pub(`/api/public/status/${ta}`)).status).toBe(200);
  });

  it('adds the ship date, carrier and tracking number once shipped', async () => {
    const c = insertShippingOrder(t.deps, { trays: [{ quantity: 40, at: SEQ.dispatch }], contactEmail: null });
    const ship = await sales
      .post(`/api/orders/${c.orderId}/shipments`)
      .send({ carrier: 'Invented Parcel Co', trackingNumber: 'IPC-2288-0041', cartons: [{ count: 1, piecesPerCarton: 40, weightKg: 1.2 }] });
    expect(ship.status).toBe(201);
    const at = Date.parse('2025-03-05T14:02:00.000Z');
    finishDispatch(t.deps, c.trays[0].id, at);
    const token = (await sales.post(`/api/orders/${c.orderId}/share`).send({})).body.token as string;
    const res = await pub(`/api/public/status/${token}`);
    expect(res.status).toBe(200);
    expect(Object.keys(res.body).sort()).toEqual(DOCUMENTED.filter((k) => k !== 'trackingUrl').sort());
    expect(res.body).toMatchObject({
      stage: 'Shipped',
      shippedAt: '2025-03-05T14:02:00.000Z',
      carrier: 'Invented Parcel Co',
      trackingNumber: 'IPC-2288-0041',
      projectedShipAt: null,
    });
    expect(res.body.stages.every((s: { done: boolean }) => s.done)).toBe(true);
  });

  it('links the tracking number to the carrier’s own tracking page when the carrier is on the factory’s list', async () => {
    t.deps.db.$client
      .prepare("insert into settings (key, value) values ('carriers', ?) on conflict(key) do update set value = excluded.value")
      .run(JSON.stringify([{ name: 'Swiftlane', trackingUrl: 'https://track.swiftlane.example/parcel/{number}' }]));
    const d = insertShippingOrder(t.deps, { trays: [{ quantity: 30, at: SEQ.dispatch }], contactEmail: null });
    expect(
      (
        await sales
          .post(`/api/orders/${d.orderId}/shipments`)
          .send({ carrier: 'Swiftlane Couriers', trackingNumber: 'SL1234567890', cartons: [{ count: 1, piecesPerCarton: 30, weightKg: 1 }] })
      ).status,
    ).toBe(201);
    finishDispatch(t.deps, d.trays[0].id, Date.parse('2025-03-06T09:00:00.000Z'));
    const token = (await sales.post(`/api/orders/${d.orderId}/share`).send({})).body.token as string;
    const res = await pub(`/api/public/status/${token}`);
    expect(Object.keys(res.body).sort()).toEqual([...DOCUMENTED].sort());
    expect(res.body.trackingUrl).toBe('https://track.swiftlane.example/parcel/SL1234567890');
  });

  it('is for sales and planners; an operator or a visitor cannot make one', async () => {
    const op = await t.agentAs('operator');
    expect((await op.post(`/api/orders/${a.orderId}/share`).send({})).status).toBe(403);
    expect((await request(t.app).post(`/api/orders/${a.orderId}/share`).send({})).status).toBe(401);
    const planner = await t.agentAs('planner');
    expect((await planner.post(`/api/orders/${a.orderId}/share`).send({})).status).toBe(201);
    expect((await sales.post('/api/orders/no-such-order/share').send({})).status).toBe(404);
  });

  it('is rate-limited per address', async () => {
    const token = (await sales.post(`/api/orders/${a.orderId}/share`).send({})).body.token as string;
    const from = (n: number) =>
      request(t.app)
        .get(`/api/public/status/${n % 2 ? token : 'x'.repeat(43)}`)
        .set('X-Forwarded-For', '10.9.9.9');
    for (let i = 0; i < PUBLIC_STATUS_PER_MINUTE; i++) expect((await from(i)).status).not.toBe(429);
    const res = await from(1);
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe('throttled');
  });
});
