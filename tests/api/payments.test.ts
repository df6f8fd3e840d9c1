import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import Stripe from 'stripe';
import { PNG } from 'pngjs';
import { makeTestApp, type TestApp } from '../support/test-app';
import { startPayments, type StartedPayments } from '../../server/services/payments.service';
import { insertShippingOrder, SEQ } from '../support/shipping-fixtures';
import { attachments } from '../../server/db/schema/scans';
import { putFile } from '../../server/lib/file-store';
import type { OrderSpecInput } from '@shared/schemas/orders';

// The path from an order awaiting payment to release, as far as payments and the customer's page
// reach: checkout on the local fake (its Pay form posted as a browser would), the signed webhook
// verified by the real SDK, the payment recorded once, the proof approved on the customer's page,
// release. And every way it must refuse: forged signatures, replays, withdrawn and expired links.
type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let server: http.Server;
let base: string;
let payments: StartedPayments;
let planner: Agent;
let sales: Agent;
let admin: Agent;

beforeAll(async () => {
  t = makeTestApp();
  server = http.createServer(t.app);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  payments = await startPayments(t.deps, () => `${base}/api/payments/webhook`);
  planner = await t.agentAs('planner');
  sales = await t.agentAs('sales');
  admin = await t.agentAs('admin');
});
afterAll(async () => {
  await payments.stop();
  await new Promise<void>((r) => server.close(() => r()));
  t.close();
});

const DUE = new Date(Date.now() + 60 * 86_400_000).toISOString().slice(0, 10);
const INTERNAL_NOTE = 'Internal: ask Dorrin about the spare navy, margin thin';

const spec = (over: Partial<OrderSpecInput> = {}): OrderSpecInput => ({
  customer: 'Invented Lantern Society',
  title: 'Lantern walk pin 30 mm',
  process: 'hard_enamel',
  material: 'iron',
  sizeMm: 30,
  quantity: 500,
  colours: [
    { name: 'Ember', hex: '#c8502a' },
    { name: 'Night', hex: '#1b2a4a' },
  ],
  plating: 'gold',
  backing: { type: 'butterfly_clutch', count: 1 },
  packaging: 'individual_bag',
  dueDate: DUE,
  notes: INTERNAL_NOTE,
  priceTotal: 1250,
  currency: 'EUR',
  ...over,
});

function png(): Buffer {
  const img = new PNG({ width: 16, height: 16 });
  img.data.fill(180);
  return PNG.sync.write(img);
}

async function orderAwaitingPayment(over: Partial<OrderSpecInput> = {}) {
  const res = await planner.post('/api/orders').send(spec(over));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  expect(res.body.status).toBe('awaiting_payment');
  const up = await planner.post(`/api/orders/${res.body.id}/proofs`).attach('file', png(), { filename: 'proof.png', contentType: 'image/png' });
  expect(up.status).toBe(201);
  const link = await sales.post(`/api/orders/${res.body.id}/share`).send({});
  expect(link.status).toBe(201);
  return { id: res.body.id as string, number: res.body.number as string, token: link.body.token as string };
}

/** Every public request from its own address, so the rate limits only bite where a test wants it. */
let ip = 1;
const from = () => `10.9.${Math.floor(ip / 250)}.${(ip++ % 250) + 1}`;
const pubGet = (path: string) => request(t.app).get(path).set('X-Forwarded-For', from());
const pubPost = (path: string) => request(t.app).post(path).set('X-Forwarded-For', from());

const detail = async (id: string) => (await planner.get(`/api/orders/${id}`)).body;

/** A digest of every row of every table: a refused request changed nothing. */
function dbDigest(): string {
  const sqlite = t.deps.db.$client;
  const tables = sqlite.prepare(`SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name`).all() as { name: string }[];
  const hash = crypto.createHash('sha256');
  for (const { name } of tables) {
    for (const row of sqlite.prepare(`SELECT * FROM "${name}"`).all() as Record<string, unknown>[]) {
      if (name === 'sessions') delete row.last_seen_at;
      if (name === 'share_links') delete row.last_opened_at;
      hash.update(name + JSON.stringify(row));
    }
  }
  return hash.digest('hex');
}

/** What a browser does with the fake's page: read it, find the one form and post it. */
async function payOnFake(url: string): Promise<Response> {
  const page = await fetch(url);
  expect(page.status).toBe(200);
  const html = await page.text();
  expect(html.match(/<form method="post">/g)).toHaveLength(1);
  expect(html).toMatch(/<button type="submit">Pay<\/button>/);
  return fetch(url, { method: 'POST', headers: { 'Content-Type': 'application/x-www-form-urlencoded' }, body: '', redirect: 'manual' });
}

const webhook = (payload: string | Buffer, signature: string) =>
  request(t.app)
    .post('/api/payments/webhook')
    .set('Content-Type', 'application/json; charset=utf-8')
    .set('Stripe-Signature', signature)
    .send(typeof payload === 'string' ? payload : payload.toString('utf8'));

describe('from awaiting payment to release through the customer page', () => {
  let order: Awaited<ReturnType<typeof orderAwaitingPayment>>;

  it('shows the customer what is due and her proof, and nothing else of the factory', async () => {
    order = await orderAwaitingPayment();
    const res = await pubGet(`/api/public/orders/${order.token}`);
    expect(res.status).toBe(200);
    expect(res.headers['x-robots-tag']).toMatch(/noindex/);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.body).toMatchObject({
      number: order.number,
      status: 'awaiting_payment',
      amountDue: 1250,
      currency: 'EUR',
      paidTotal: 0,
      depositPct: 100,
      canPay: true,
    });
    expect(res.body.proofs).toEqual([expect.objectContaining({ revision: 1, fileUrl: `/api/public/orders/${order.token}/proofs/1/file`, latest: true })]);
    expect(res.body.proofs[0].approvedAt).toBeUndefined();
    const text = JSON.stringify(res.body);
    // no people, no internal notes, no user ids
    expect(text).not.toContain(INTERNAL_NOTE);
    expect(text).not.toContain('Test planner');
    expect(text).not.toContain('Test sales');
    expect(text).not.toContain(planner.user.id);
    const file = await pubGet(res.body.proofs[0].fileUrl);
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toBe('image/png');
  });

  it('pays on the local fake: the webhook records the payment once and opens the payment gate', async () => {
    const checkout = await pubPost(`/api/public/orders/${order.token}/checkout`).send({});
    expect(checkout.status, JSON.stringify(checkout.body)).toBe(200);
    const url = checkout.body.url as string;
    expect(url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/pay\/cs_test_/);
    // a second tap gets the same open session
    expect((await pubPost(`/api/public/orders/${order.token}/checkout`).send({})).body.url).toBe(url);

    const paid = await payOnFake(url);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`${t.deps.env.publicUrl}/status/${order.token}?paid=1`);
    expect(payments.fake!.sent).toHaveLength(1);
    expect(payments.fake!.sent[0]!.status).toBe(200);

    const d = await detail(order.id);
    expect(d.payments).toEqual([
      expect.objectContaining({ amount: 1250, currency: 'EUR', source: 'checkout', reference: expect.stringMatching(/^pi_test_/), at: expect.any(String) }),
    ]);
    expect(d.paidTotal).toBe(1250);
    expect(d.openGates).toEqual(['proof_not_approved']);
    expect(d.status).toBe('awaiting_proof');
    // the customer's page says so
    const pub = (await pubGet(`/api/public/orders/${order.token}`)).body;
    expect(pub).toMatchObject({ status: 'awaiting_proof', amountDue: 0, paidTotal: 1250, canPay: false });
    // and a second payment is not offered
    const again = await pubPost(`/api/public/orders/${order.token}/checkout`).send({});
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('nothing_due');
  });

  it('a replayed event records nothing more', async () => {
    const before = dbDigest();
    const { payload, signature } = payments.fake!.sent[0]!;
    const res = await webhook(payload, signature);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ received: true, recorded: false });
    // the same event freshly signed (a redelivery by the service) records nothing either
    const resigned = Stripe.webhooks.generateTestHeaderString({ payload, secret: t.deps.payments!.webhookSecret });
    expect((await webhook(payload, resigned)).body).toEqual({ received: true, recorded: false });
    expect(dbDigest()).toBe(before);
    expect((await detail(order.id)).payments).toHaveLength(1);
  });

  it('a forged signature is refused with 400 and changes nothing', async () => {
    const before = dbDigest();
    const { payload, signature } = payments.fake!.sent[0]!;
    // the body changed after signing: a new event id and a bigger amount
    const event = JSON.parse(payload);
    event.id = 'evt_forged_1';
    event.data.object.amount_total = 999_999;
    const tampered = JSON.stringify(event);
    const r1 = await webhook(tampered, signature);
    expect(r1.status).toBe(400);
    expect(r1.body.error.code).toBe('bad_signature');
    // signed with some other secret (HMAC-SHA256 over "t.payload", as the service documents)
    const t0 = Math.floor(Date.now() / 1000);
    const wrong = crypto.createHmac('sha256', 'whsec_not_ours').update(`${t0}.${tampered}`).digest('hex');
    const r2 = await webhook(tampered, `t=${t0},v1=${wrong}`);
    expect(r2.status).toBe(400);
    expect(r2.body.error.code).toBe('bad_signature');
    // no header at all
    const r3 = await request(t.app).post('/api/payments/webhook').set('Content-Type', 'application/json').send(tampered);
    expect(r3.status).toBe(400);
    // an old signature replayed after the tolerance window (the SDK's default, 300 s)
    const old = Stripe.webhooks.generateTestHeaderString({ payload: tampered, secret: t.deps.payments!.webhookSecret, timestamp: t0 - 3600 });
    expect((await webhook(tampered, old)).status).toBe(400);
    expect(dbDigest()).toBe(before);
  });

  it('the webhook alone is let through from another origin, and only its signature lets it change anything', async () => {
    const before = dbDigest();
    const { payload } = payments.fake!.sent[0]!;
    const cross = await request(t.app)
      .post('/api/payments/webhook')
      .set('Origin', 'https://payments.example')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', 't=1,v1=00')
      .send(payload);
    expect(cross.status).toBe(400);
    expect(cross.body.error.code).toBe('bad_signature');
    // the customer's own writes keep the same-origin rule
    const forged = await pubPost(`/api/public/orders/${order.token}/proofs/1/approve`).set('Origin', 'https://evil.example').send({ name: 'Mallory' });
    expect(forged.status).toBe(403);
    expect(forged.body.error.code).toBe('cross_origin');
    expect(t.api.routes.filter((r) => r.signed).map((r) => `${r.method} ${r.path}`)).toEqual(['post /payments/webhook']);
    expect(dbDigest()).toBe(before);
  });

  it('the customer approves the proof with her name: recorded with who and when, the gate opens, release goes through', async () => {
    const res = await pubPost(`/api/public/orders/${order.token}/proofs/1/approve`).set('Origin', t.deps.env.publicUrl).send({ name: 'Mira Quell' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.proofs[0]).toMatchObject({ revision: 1, approvedAt: expect.any(String), approvedByName: 'Mira Quell' });
    const d = await detail(order.id);
    expect(d.openGates).toEqual([]);
    expect(d.proofs[0]).toMatchObject({ approvedBy: 'Mira Quell (on the order page)', approvedAt: expect.any(String) });
    expect(d.history.map((h: { text: string }) => h.text)).toEqual(
      expect.arrayContaining([expect.stringMatching(/^Mira Quell approved proof revision 1 on the order page/)]),
    );
    // approving twice is refused and changes nothing
    const before = dbDigest();
    const twice = await pubPost(`/api/public/orders/${order.token}/proofs/1/approve`).send({ name: 'Mira Quell' });
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe('already_approved');
    expect(dbDigest()).toBe(before);

    const release = await planner.post(`/api/orders/${order.id}/release`).send({ traySize: 100 });
    expect(release.status, JSON.stringify(release.body)).toBe(201);
    expect(release.body.trays.length).toBe(6); // 500 + 5 % overrun = 525 pieces in trays of 100
    const pub = (await pubGet(`/api/public/orders/${order.token}`)).body;
    expect(pub.status).toBe('in_production');
    expect(pub.story[0]).toMatchObject({ stage: 'artwork_moulds', at: expect.any(String) });
  });
});

describe('links that no longer work', () => {
  it('a withdrawn link answers 404 for reads and writes and changes nothing', async () => {
    const o = await orderAwaitingPayment();
    expect((await sales.delete(`/api/orders/${o.id}/share`)).status).toBe(204);
    const before = dbDigest();
    for (const res of [
      await pubGet(`/api/public/orders/${o.token}`),
      await pubPost(`/api/public/orders/${o.token}/checkout`).send({}),
      await pubPost(`/api/public/orders/${o.token}/proofs/1/approve`).send({ name: 'Mira Quell' }),
      await pubPost(`/api/public/orders/${o.token}/proofs/1/changes`).send({ comment: 'Make the ember darker' }),
      await pubGet(`/api/public/orders/${o.token}/proofs/1/file`),
    ]) {
      expect(res.status).toBe(404);
      expect(res.body.error.message).toMatch(/withdrawn/);
    }
    expect(dbDigest()).toBe(before);
  });

  it('an expired link answers 410 link_expired and changes nothing', async () => {
    const o = await orderAwaitingPayment();
    const short = await sales.post(`/api/orders/${o.id}/share`).send({ validDays: 1 });
    expect(short.status).toBe(201);
    expect((await pubGet(`/api/public/orders/${short.body.token}`)).status).toBe(200);
    t.setNow(Date.now() + 2 * 86_400_000);
    try {
      const before = dbDigest();
      for (const res of [
        await pubGet(`/api/public/orders/${short.body.token}`),
        await pubPost(`/api/public/orders/${short.body.token}/checkout`).send({}),
        await pubPost(`/api/public/orders/${short.body.token}/proofs/1/approve`).send({ name: 'Mira Quell' }),
      ]) {
        expect(res.status).toBe(410);
        expect(res.body.error).toEqual({ code: 'link_expired', message: expect.stringMatching(/ended on \d{4}-\d{2}-\d{2}/) });
      }
      expect(dbDigest()).toBe(before);
      // the order's other link, without an end date, still works
      expect((await pubGet(`/api/public/orders/${o.token}`)).status).toBe(200);
    } finally {
      t.setNow(null);
    }
  });

  it('a guessed token is not found', async () => {
    const guess = crypto.randomBytes(32).toString('base64url');
    expect((await pubGet(`/api/public/orders/${guess}`)).status).toBe(404);
  });
});

describe('deposit share and payments typed in by sales', () => {
  it('with a 30 % deposit, a bank transfer typed in by sales opens the same gate', async () => {
    const set = await admin.put('/api/admin/payment-settings').send({ depositPct: 30, currency: 'EUR' });
    expect(set.status).toBe(200);
    try {
      const o = await orderAwaitingPayment({ priceTotal: 1234.57 });
      const pub = (await pubGet(`/api/public/orders/${o.token}`)).body;
      // worked by hand: 1234.57 × 30 % = 370.371 → 370.37
      expect(pub).toMatchObject({ amountDue: 370.37, depositPct: 30, priceTotal: 1234.57 });
      const part = await sales.post(`/api/orders/${o.id}/payment`).send({ amount: 300, reference: 'BANK-77110' });
      expect(part.status, JSON.stringify(part.body)).toBe(201);
      expect(part.body.openGates).toContain('payment_missing');
      expect(part.body.payment.amountDue).toBe(70.37);
      const rest = await sales.post(`/api/orders/${o.id}/payment`).send({ amount: 70.37, reference: 'BANK-77111' });
      expect(rest.body.openGates).toEqual(['proof_not_approved']);
      expect(rest.body.payments.map((p: { source: string; currency: string }) => [p.source, p.currency])).toEqual([
        ['manual', 'EUR'],
        ['manual', 'EUR'],
      ]);
      expect(rest.body.paidTotal).toBe(370.37);
      // a payment in another currency cannot count towards the order
      const before = dbDigest();
      const usd = await sales.post(`/api/orders/${o.id}/payment`).send({ amount: 5, currency: 'USD', reference: 'BANK-1' });
      expect(usd.status).toBe(409);
      expect(usd.body.error.code).toBe('currency_mismatch');
      expect(dbDigest()).toBe(before);
      // the customer's checkout for the deposit is for exactly what is due
      const o2 = await orderAwaitingPayment({ priceTotal: 1000 });
      const c = await pubPost(`/api/public/orders/${o2.token}/checkout`).send({});
      const session = await t.deps.payments!.stripe.checkout.sessions.retrieve(c.body.url.split('/pay/')[1]);
      expect([session.amount_total, session.currency]).toEqual([30000, 'eur']);
    } finally {
      await admin.put('/api/admin/payment-settings').send({ depositPct: 100, currency: 'USD' });
    }
  });

  it('an order without an agreed price cannot be paid online and says why', async () => {
    const o = await orderAwaitingPayment({ priceTotal: undefined, currency: undefined });
    const res = await pubPost(`/api/public/orders/${o.token}/checkout`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('no_price');
    expect((await pubGet(`/api/public/orders/${o.token}`)).body).toMatchObject({ amountDue: null, canPay: false });
  });
});

describe('changes asked for on the customer page', () => {
  it('records the comment, tells the planners by mail and keeps the gate shut', async () => {
    const o = await orderAwaitingPayment();
    const res = await pubPost(`/api/public/orders/${o.token}/proofs/1/changes`).send({ comment: 'Please make the ember colour darker' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.proofs[0]).toMatchObject({ changesRequestedAt: expect.any(String), changesComment: 'Please make the ember colour darker' });
    const d = await detail(o.id);
    expect(d.proofs[0]).toMatchObject({ changesComment: 'Please make the ember colour darker', approvedAt: null });
    expect(d.openGates).toContain('proof_not_approved');
    const mails = t.deps.db.$client.prepare(`SELECT "to", subject, text FROM mail_queue WHERE kind = 'proof_changes' AND order_id = ?`).all(o.id) as {
      to: string;
      subject: string;
      text: string;
    }[];
    expect(mails.map((m) => m.to)).toContain(planner.user.email);
    expect(mails[0]!.text).toContain('Please make the ember colour darker');
    // an empty comment is refused and changes nothing
    const before = dbDigest();
    const empty = await pubPost(`/api/public/orders/${o.token}/proofs/1/changes`).send({ comment: '' });
    expect(empty.status).toBe(400);
    expect(dbDigest()).toBe(before);
  });
});

describe('QC photos on the customer page', () => {
  it('shows only the photos a supervisor shared, of her own order only', async () => {
    const supervisor = await t.agentAs('supervisor');
    const mine = insertShippingOrder(t.deps, { customer: 'Invented Quay Rowers', title: 'Quay regatta pin', trays: [{ quantity: 100, at: SEQ.polish }] });
    const other = insertShippingOrder(t.deps, { customer: 'Invented Moor Walkers', title: 'Moor walk pin', trays: [{ quantity: 100, at: SEQ.polish }] });
    const photoOf = (trayId: string) => {
      const { hash, sizeBytes } = putFile(t.dataDir, png());
      const id = crypto.randomUUID();
      t.deps.db.insert(attachments).values({ id, trayId, fileHash: hash, mime: 'image/png', sizeBytes, createdAt: Date.now() }).run();
      return id;
    };
    const p1 = photoOf(mine.trays[0]!.id);
    const p2 = photoOf(mine.trays[0]!.id);
    const foreign = photoOf(other.trays[0]!.id);
    const token = (await sales.post(`/api/orders/${mine.orderId}/share`).send({})).body.token as string;
    const photosOnPage = async () => ((await pubGet(`/api/public/status/${token}`)).body.story ?? []).flatMap((s: { photos: string[] }) => s.photos);

    // none is shown until a supervisor says so
    expect(await photosOnPage()).toEqual([]);
    expect((await pubGet(`/api/public/status/${token}/photos/${p1}`)).status).toBe(404);
    const list = await supervisor.get(`/api/trays/${mine.trays[0]!.id}/photos`);
    expect(list.body.map((p: { id: string; shareable: boolean }) => [p.id, p.shareable]).sort()).toEqual(
      [
        [p1, false],
        [p2, false],
      ].sort(),
    );

    // sales may not decide it; the supervisor may
    expect((await sales.patch(`/api/photos/${p1}`).send({ shareable: true })).status).toBe(403);
    const shared = await supervisor.patch(`/api/photos/${p1}`).send({ shareable: true });
    expect(shared.status).toBe(200);
    expect(shared.body).toMatchObject({ id: p1, shareable: true, sharedAt: expect.any(String) });
    await supervisor.patch(`/api/photos/${foreign}`).send({ shareable: true });

    expect(await photosOnPage()).toEqual([`/api/public/status/${token}/photos/${p1}`]);
    const img = await pubGet(`/api/public/status/${token}/photos/${p1}`);
    expect(img.status).toBe(200);
    expect(img.headers['content-type']).toBe('image/png');
    // another order's photo, even shared, is not reachable with her link; nor is an unshared one of hers
    expect((await pubGet(`/api/public/status/${token}/photos/${foreign}`)).status).toBe(404);
    expect((await pubGet(`/api/public/status/${token}/photos/${p2}`)).status).toBe(404);

    await supervisor.patch(`/api/photos/${p1}`).send({ shareable: false });
    expect(await photosOnPage()).toEqual([]);
  });
});
