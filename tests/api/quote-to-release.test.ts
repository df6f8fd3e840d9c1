import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { PNG } from 'pngjs';
import { makeTestApp, type TestApp } from '../support/test-app';
import { startMail } from '../../server/services/mail.service';
import { startPayments, type StartedPayments } from '../../server/services/payments.service';

// The whole front of a job in one pass, as the customer and the office meet it: sales prices and
// sends a quote (the mail is caught), the customer accepts one quantity through her link, the order
// waits for payment with the quote's spec and price, she pays on the local checkout fake, the
// signed webhook records the payment once, she approves the proof on her page, and the planner
// releases it. Along the way every refusal (a second accept, a replayed and a forged event, a
// withdrawn link, an accept after valid-until) answers a clear error and changes nothing.
type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let server: http.Server;
let payments: StartedPayments;
let mail: Awaited<ReturnType<typeof startMail>>;
let sales: Agent;
let planner: Agent;
let admin: Agent;

beforeAll(async () => {
  t = makeTestApp({ log: (await import('pino')).pino({ level: process.env.QUOTE_PATH_LOG ?? 'silent' }) });
  server = http.createServer(t.app);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  payments = await startPayments(t.deps, () => `${base}/api/payments/webhook`);
  mail = await startMail(t.deps, { intervalMs: 100 });
  sales = await t.agentAs('sales');
  planner = await t.agentAs('planner');
  admin = await t.agentAs('admin');
});
afterAll(async () => {
  await mail.stop();
  await payments.stop();
  await new Promise<void>((r) => server.close(() => r()));
  t.close();
});

let ip = 1;
const from = () => `10.31.${Math.floor(ip / 250)}.${(ip++ % 250) + 1}`;
const pubGet = (p: string) => request(t.app).get(p).set('X-Forwarded-For', from());
const pubPost = (p: string, body: object = {}) => request(t.app).post(p).set('X-Forwarded-For', from()).send(body);
const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

/** A digest of every row of every table: a refused request changed nothing. */
function dbDigest(): string {
  const sqlite = t.deps.db.$client;
  const tables = sqlite.prepare(`SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name`).all() as { name: string }[];
  const hash = crypto.createHash('sha256');
  for (const { name } of tables) {
    // reading a link stamps when it was last opened, and sessions when they were last seen; the mail outbox moves on its own
    if (name === 'mail_outbox') continue;
    for (const row of sqlite.prepare(`SELECT * FROM "${name}"`).all() as Record<string, unknown>[]) {
      if (name === 'sessions') delete row.last_seen_at;
      if (name === 'share_links') delete row.last_opened_at;
      hash.update(name + JSON.stringify(row));
    }
  }
  return hash.digest('hex');
}

async function caught(subjectPart: string) {
  const until = Date.now() + 15_000;
  for (;;) {
    const list = (await admin.get('/api/mail')).body as { to: string; subject: string; text: string }[];
    const m = list.find((x) => x.subject.includes(subjectPart));
    if (m) return m;
    if (Date.now() > until) throw new Error(`no mail about ${subjectPart}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

function png(): Buffer {
  const img = new PNG({ width: 16, height: 16 });
  img.data.fill(200);
  return PNG.sync.write(img);
}

const quoteBody = (over: Record<string, unknown> = {}) => ({
  customer: 'Invented Fenland Skating Club',
  contactName: 'Petra Holm',
  contactEmail: 'petra@fenland-skating.example',
  spec: {
    title: 'Fen skate 28 mm',
    process: 'hard_enamel',
    material: 'iron',
    sizeMm: 28,
    heightMm: 24,
    thicknessMm: 1.5,
    colours: [{ name: 'Ice blue' }, { name: 'Peat' }],
    plating: 'silver',
    backing: { type: 'rubber_clutch', count: 2 },
    packaging: 'backing_card',
  },
  quantities: [200, 500, 1000],
  validUntil: day(20),
  notes: 'Two clutches per pin.',
  ...over,
});

describe('quote → accept → pay → approve → release', () => {
  const s: {
    quote?: { id: string; number: string; lines: { quantity: number; total: number }[] };
    token?: string;
    orderId?: string;
    statusToken?: string;
    checkoutUrl?: string;
  } = {};

  it('sales prices and sends the quote; the mail carrying the link is caught', async () => {
    const created = await sales.post('/api/quotes').send(quoteBody());
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    s.quote = created.body;
    const sent = await sales.post(`/api/quotes/${s.quote!.id}/send`).send({});
    expect(sent.status).toBe(200);
    const url = sent.body.url as string;
    s.token = url.split('/quote/')[1];
    const m = await caught(s.quote!.number);
    expect(m.to).toContain('petra@fenland-skating.example');
    expect(m.text).toContain(url);
  });

  it('the customer accepts 500 through her link: an order awaiting payment with the quote’s spec and price', async () => {
    const acc = await pubPost(`/api/public/quotes/${s.token}/accept`, { quantity: 500, name: 'Petra Holm' });
    expect(acc.status, JSON.stringify(acc.body)).toBe(201);
    s.orderId = acc.body.orderId;
    s.statusToken = acc.body.statusToken;
    const order = (await planner.get(`/api/orders/${s.orderId}`)).body;
    expect(order.status).toBe('awaiting_payment');
    expect(order.spec).toMatchObject({
      title: 'Fen skate 28 mm',
      quantity: 500,
      process: 'hard_enamel',
      material: 'iron',
      sizeMm: 28,
      plating: 'silver',
      backing: { type: 'rubber_clutch', count: 2 },
      packaging: 'backing_card',
      colours: [{ name: 'Ice blue' }, { name: 'Peat' }],
      priceTotal: s.quote!.lines[1]!.total,
      currency: 'USD',
    });
    expect(order.openGates).toEqual(expect.arrayContaining(['payment_missing']));
  });

  it('a second accept is refused and changes nothing', async () => {
    const before = dbDigest();
    const again = await pubPost(`/api/public/quotes/${s.token}/accept`, { quantity: 1000, name: 'Petra Holm' });
    expect(again.status).toBe(409);
    expect(again.body.error).toMatchObject({ code: 'quote_accepted', message: expect.any(String) });
    expect(dbDigest()).toBe(before);
  });

  it('she pays on the local checkout fake; the signed webhook records the payment once', async () => {
    const up = await planner.post(`/api/orders/${s.orderId}/proofs`).attach('file', png(), { filename: 'proof.png', contentType: 'image/png' });
    expect(up.status).toBe(201);
    const checkout = await pubPost(`/api/public/orders/${s.statusToken}/checkout`);
    expect(checkout.status, JSON.stringify(checkout.body)).toBe(200);
    s.checkoutUrl = checkout.body.url;
    const page = await fetch(s.checkoutUrl!);
    expect(page.status).toBe(200);
    const paid = await fetch(s.checkoutUrl!, {
      method: 'POST',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: '',
      redirect: 'manual',
    });
    expect(paid.status).toBe(303);
    expect(payments.fake!.sent.at(-1)!.status).toBe(200);
    const order = (await planner.get(`/api/orders/${s.orderId}`)).body;
    expect(order.payments).toEqual([
      expect.objectContaining({ source: 'checkout', amount: s.quote!.lines[1]!.total, currency: 'USD', reference: expect.stringMatching(/^pi_test_/) }),
    ]);
    expect(order.openGates).toEqual(['proof_not_approved']);
  });

  it('a replayed event and a forged signature change nothing', async () => {
    const before = dbDigest();
    const { payload, signature } = payments.fake!.sent.at(-1)!;
    const replay = await request(t.app).post('/api/payments/webhook').set('Content-Type', 'application/json').set('Stripe-Signature', signature).send(payload);
    expect(replay.status).toBe(200);
    expect(replay.body).toEqual({ received: true, recorded: false });
    const forged = JSON.parse(payload);
    forged.id = 'evt_forged_quote_path';
    const bad = await request(t.app)
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', signature)
      .send(JSON.stringify(forged));
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('bad_signature');
    expect(dbDigest()).toBe(before);
    expect((await planner.get(`/api/orders/${s.orderId}`)).body.payments).toHaveLength(1);
  });

  it('she approves the proof on her page; the planner releases the order', async () => {
    const ok = await pubPost(`/api/public/orders/${s.statusToken}/proofs/1/approve`, { name: 'Petra Holm' });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    const order = (await planner.get(`/api/orders/${s.orderId}`)).body;
    expect(order.openGates).toEqual([]);
    expect(order.proofs[0]).toMatchObject({ approvedBy: 'Petra Holm (on the order page)', approvedAt: expect.any(String) });
    const release = await planner.post(`/api/orders/${s.orderId}/release`).send({ traySize: 100 });
    expect(release.status, JSON.stringify(release.body)).toBe(201);
    const pub = (await pubGet(`/api/public/orders/${s.statusToken}`)).body;
    expect(pub.status).toBe('in_production');
  });
});

describe('links that may not accept', () => {
  it('a withdrawn link and an accept after valid-until are refused and change nothing', async () => {
    const q = (await sales.post('/api/quotes').send(quoteBody({ validUntil: day(2) }))).body;
    const token = ((await sales.post(`/api/quotes/${q.id}/send`).send({})).body.url as string).split('/quote/')[1];
    const before = dbDigest();
    t.setNow(Date.now() + 5 * 86_400_000);
    const late = await pubPost(`/api/public/quotes/${token}/accept`, { quantity: 200, name: 'Petra Holm' });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('quote_expired');
    t.setNow(null);
    expect(dbDigest()).toBe(before);
    sales = await t.agentAs('sales');
    expect((await sales.delete(`/api/quotes/${q.id}/share`)).status).toBe(204);
    const afterWithdraw = dbDigest();
    const gone = await pubPost(`/api/public/quotes/${token}/accept`, { quantity: 200, name: 'Petra Holm' });
    expect(gone.status).toBe(404);
    expect(gone.body.error).toMatchObject({ code: expect.any(String), message: expect.any(String) });
    expect(dbDigest()).toBe(afterWithdraw);
  });
});
