import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { sha256 } from '@noble/hashes/sha2';
import { bytesToHex } from '@noble/hashes/utils';
import { makeTestApp, type TestApp } from '../support/test-app';
import { startMail } from '../../server/services/mail.service';
import { quotesService } from '../../server/services/quotes.service';
import { orders } from '../../server/db/schema/orders';
import { quotes, quoteVersions } from '../../server/db/schema/quotes';
import { shareLinks } from '../../server/db/schema/shipping';
import { getPdf, pdfToText } from '../support/pdf';

type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let mail: Awaited<ReturnType<typeof startMail>>;
let sales: Agent;
let admin: Agent;
let manager: Agent;

let ip = 1;
const from = () => `10.9.${Math.floor(ip / 250)}.${(ip++ % 250) + 1}`;
const pubGet = (p: string) => request(t.app).get(p).set('X-Forwarded-For', from());
const pubPost = (p: string, body: object) => request(t.app).post(p).set('X-Forwarded-For', from()).send(body);

const day = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);

function body(over: Record<string, unknown> = {}) {
  return {
    customer: 'Invented Lantern Society',
    contactName: 'Ida Marlow',
    contactEmail: 'ida@lantern-society.example',
    spec: {
      title: 'Lantern walk pin',
      process: 'hard_enamel',
      material: 'iron',
      sizeMm: 25,
      heightMm: 22,
      thicknessMm: 1.5,
      colours: [{ name: 'Amber' }, { name: 'Night blue', ref: 'NB-2' }, { name: 'White' }],
      plating: 'gold',
      backing: { type: 'butterfly_clutch', count: 1 },
      packaging: 'individual_bag',
    },
    quantities: [100, 250, 500, 1000],
    validUntil: day(30),
    notes: 'Prices include the overrun.',
    ...over,
  };
}

async function caughtUntil(predicate: (list: { to: string; subject: string; text: string; id: string }[]) => boolean) {
  const until = Date.now() + 15_000;
  for (;;) {
    const res = await admin.get('/api/mail');
    if (predicate(res.body)) return res.body as { to: string; subject: string; text: string }[];
    if (Date.now() > until) throw new Error('mail did not arrive');
    await new Promise((r) => setTimeout(r, 100));
  }
}

const counts = () => ({
  orders: t.deps.db.select().from(orders).all().length,
  quotes: JSON.stringify(t.deps.db.select().from(quotes).all()),
});

beforeAll(async () => {
  t = makeTestApp();
  mail = await startMail(t.deps, { intervalMs: 100 });
  sales = await t.agentAs('sales');
  admin = await t.agentAs('admin');
  manager = await t.agentAs('manager');
});
afterAll(async () => {
  await mail.stop();
  t.close();
});

describe('quotes', () => {
  it('prices every break from the routing: falling unit price, moulds once, breakdown per piece', async () => {
    const res = await sales.post('/api/quotes').send(body());
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ number: 'Q-2001', version: 1, status: 'draft', currency: 'USD' });
    const lines = res.body.lines as {
      quantity: number;
      unitPrice: number;
      total: number;
      breakdown: Record<string, number>;
      shipDates: { expectedAt: string | null; p85At: string | null };
    }[];
    expect(lines.map((l) => l.quantity)).toEqual([100, 250, 500, 1000]);
    for (let i = 1; i < lines.length; i++) expect(lines[i].unitPrice).toBeLessThan(lines[i - 1].unitPrice);
    for (const l of lines) {
      expect(Object.keys(l.breakdown).sort()).toEqual(['fittings', 'labour', 'margin', 'material', 'materialGrams', 'moulds', 'oven', 'packaging', 'plating']);
      expect(l.breakdown.moulds).toBe(res.body.mouldCharge);
      expect(l.shipDates.expectedAt).not.toBeNull();
      expect(Date.parse(l.shipDates.p85At!)).toBeGreaterThanOrEqual(Date.parse(l.shipDates.expectedAt!));
    }
    expect(res.body.mouldCharge).toBeGreaterThan(0);
  });

  it('refuses bad input with a clear error and stores nothing', async () => {
    const before = counts();
    for (const bad of [
      body({ quantities: [500, 100] }),
      body({ quantities: [1, 2, 3, 4, 5, 6, 7] }),
      body({ validUntil: day(-2) }),
      body({ spec: { ...body().spec, heightMm: 40 } }),
      body({ spec: { ...body().spec, quantity: 100 } }),
      body({ contactEmail: 'not-an-address' }),
    ]) {
      const res = await sales.post('/api/quotes').send(bad);
      expect(res.status).toBe(400);
      expect(res.body.error.message).toBeTruthy();
    }
    expect(counts()).toEqual(before);
  });

  it('a change is a new version and the old one is kept', async () => {
    const created = (await sales.post('/api/quotes').send(body())).body;
    const res = await sales.put(`/api/quotes/${created.id}`).send(body({ quantities: [500, 1000, 2000] }));
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(2);
    expect(res.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    const rows = t.deps.db
      .select()
      .from(quoteVersions)
      .all()
      .filter((v) => v.quoteId === created.id);
    expect(rows.map((r) => r.quantities)).toEqual(
      expect.arrayContaining([
        [100, 250, 500, 1000],
        [500, 1000, 2000],
      ]),
    );
    const list = (await sales.get('/api/quotes')).body as { id: string; version: number }[];
    expect(list.find((q) => q.id === created.id)?.version).toBe(2);
  });

  it('a reorder reusing its stored mould pays no mould charge', async () => {
    // an earlier order with a front mould in the library
    const order = (
      await (
        await t.agentAs('planner')
      )
        .post('/api/orders')
        .send({ ...body().spec, heightMm: undefined, thicknessMm: undefined, customer: 'Invented Lantern Society', quantity: 200, dueDate: day(40) })
    ).body;
    const { moulds } = await import('../../server/db/schema/moulds');
    t.deps.db
      .insert(moulds)
      .values({
        id: 'm-lantern',
        number: 'M-LANTERN-F',
        designKey: t.deps.db
          .select()
          .from(orders)
          .all()
          .find((o) => o.id === order.id)!.designKey,
        side: 'front',
        firstOrderId: order.id,
        status: 'stored',
        storageLocation: 'Shelf 3',
        createdAt: Date.now(),
        updatedAt: Date.now(),
      } as never)
      .run();
    const res = await sales.post('/api/quotes').send(body({ spec: { ...body().spec, reorderOf: order.id } }));
    expect(res.status).toBe(201);
    expect(res.body.mouldCharge).toBe(0);
    expect(res.body.moulds).toEqual([{ side: 'front', reuse: true, hours: 0, charge: 0 }]);
  });

  it('the PDF names the factory and carries both languages', async () => {
    const q = (await sales.post('/api/quotes').send(body())).body;
    const res = await getPdf(sales, `/api/quotes/${q.id}/quote.pdf`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    // poppler's pdftotext reads the text back independently of pdfkit
    const text = pdfToText(res.body as Buffer, path.join(os.tmpdir(), `quote-${q.id}.pdf`));
    expect(text).toContain('Trayce factory');
    expect(text).toContain(q.number);
    expect(text).toContain('Unit price');
    expect(text).toContain('单价');
    expect(text).toContain('1,000');
  });

  it('send mails the portal link to the contact; the customer accepts one break and gets an order awaiting payment', async () => {
    const q = (await sales.post('/api/quotes').send(body())).body;
    const sent = await sales.post(`/api/quotes/${q.id}/send`).send({});
    expect(sent.status).toBe(200);
    const url = sent.body.url as string;
    const token = url.split('/quote/')[1];
    expect(Buffer.from(token, 'base64url').length * 8).toBeGreaterThanOrEqual(128);
    const links = t.deps.db.select().from(shareLinks).all();
    expect(JSON.stringify(links)).not.toContain(token);
    expect(links.map((l) => l.tokenHash)).toContain(bytesToHex(sha256(new TextEncoder().encode(token))));
    const caught = await caughtUntil((l) => l.some((m) => m.subject.includes(q.number)));
    const m = caught.find((x) => x.subject.includes(q.number))!;
    expect(m.to).toContain('ida@lantern-society.example');
    expect(m.text).toContain(url);

    const view = await pubGet(`/api/public/quotes/${token}`);
    expect(view.status).toBe(200);
    expect(view.headers['x-robots-tag']).toContain('noindex');
    expect(view.body.factory).toBe('Trayce factory');
    expect(JSON.stringify(view.body)).not.toContain('breakdown');
    expect(JSON.stringify(view.body)).not.toContain('labour');
    expect(view.body.lines[0]).toEqual({
      quantity: 100,
      unitPrice: q.lines[0].unitPrice,
      goodsTotal: q.lines[0].goodsTotal,
      mouldCharge: q.mouldCharge,
      total: q.lines[0].total,
      expectedShipAt: expect.any(String),
      p85ShipAt: expect.any(String),
    });

    const acc = await pubPost(`/api/public/quotes/${token}/accept`, { quantity: 500, name: 'Ida Marlow' });
    expect(acc.status).toBe(201);
    expect(Object.keys(acc.body).sort()).toEqual(['number', 'orderId', 'statusToken']);
    const order = (await manager.get(`/api/orders/${acc.body.orderId}`)).body;
    expect(order.status).toBe('awaiting_payment');
    // the price agreed is what the order's payment gate asks for
    expect(order.spec.priceTotal).toBe(q.lines[2].total);
    expect(order.spec).toMatchObject({ title: 'Lantern walk pin', process: 'hard_enamel', quantity: 500, plating: 'gold', colours: body().spec.colours });
    expect(order.routing.filter((s: { stationKind: string }) => s.stationKind === 'fill')).toHaveLength(3);
    // the status token is an ordinary customer link of the order
    const status = await pubGet(`/api/public/status/${acc.body.statusToken}`);
    expect(status.status).toBe(200);
    expect(status.body.title).toBe('Lantern walk pin');
    const portal = await pubGet(`/api/public/orders/${acc.body.statusToken}`);
    expect(portal.status).toBe(200);
    expect(portal.body).toMatchObject({ amountDue: q.lines[2].total, currency: 'USD' });
    const after = (await sales.get(`/api/quotes/${q.id}`)).body;
    expect(after.status).toBe('accepted');
    expect(after.accepted).toMatchObject({ quantity: 500, name: 'Ida Marlow', orderNumber: acc.body.number });

    // a second accept is refused and changes nothing
    const before = counts();
    const again = await pubPost(`/api/public/quotes/${token}/accept`, { quantity: 1000, name: 'Ida Marlow' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('quote_accepted');
    expect(counts()).toEqual(before);
    // nor can the accepted quote change
    expect((await sales.put(`/api/quotes/${q.id}`).send(body())).status).toBe(409);
  });

  it('refuses a quantity not quoted, a withdrawn link, an unknown token and an accept after valid-until; nothing changes', async () => {
    const q = (await sales.post('/api/quotes').send(body({ validUntil: day(3) }))).body;
    const token = ((await sales.post(`/api/quotes/${q.id}/send`).send({})).body.url as string).split('/quote/')[1];
    const before = counts();
    const odd = await pubPost(`/api/public/quotes/${token}/accept`, { quantity: 333, name: 'Ida Marlow' });
    expect(odd.status).toBe(400);
    expect(odd.body.error.code).toBe('quantity_not_quoted');
    expect((await pubPost(`/api/public/quotes/${'x'.repeat(43)}/accept`, { quantity: 100, name: 'Ida Marlow' })).status).toBe(404);
    // after valid-until
    t.setNow(Date.now() + 10 * 86_400_000);
    const late = await pubPost(`/api/public/quotes/${token}/accept`, { quantity: 100, name: 'Ida Marlow' });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('quote_expired');
    expect(late.body.error.message).toContain(day(3));
    // (sessions lapse over ten days, so the staff side is asked through the service)
    expect(quotesService.get(t.deps, q.id).status).toBe('expired');
    await expect(quotesService.send(t.deps, q.id, sales.user.id)).rejects.toMatchObject({ status: 409, code: 'quote_expired' });
    t.setNow(null);
    sales = await t.agentAs('sales');
    admin = await t.agentAs('admin');
    // withdrawn
    expect((await sales.delete(`/api/quotes/${q.id}/share`)).status).toBe(204);
    expect((await pubGet(`/api/public/quotes/${token}`)).status).toBe(404);
    const revoked = await pubPost(`/api/public/quotes/${token}/accept`, { quantity: 100, name: 'Ida Marlow' });
    expect(revoked.status).toBe(404);
    expect(counts()).toEqual(before);
  });

  it('the costing rates are admin settings: a changed rate changes the next price', async () => {
    const s = (await admin.get('/api/admin/costing')).body;
    expect(s.densities.iron).toBe(7.874);
    expect((await sales.get('/api/admin/costing')).status).toBe(403);
    expect((await admin.put('/api/admin/costing').send({ marginPct: -5 })).status).toBe(400);
    const first = (await sales.post('/api/quotes').send(body())).body.lines[0].unitPrice as number;
    const saved = await admin.put('/api/admin/costing').send({ labourRatePerHour: { fill: 20 } });
    expect(saved.status).toBe(200);
    expect(saved.body.labourRatePerHour.fill).toBe(20);
    expect(saved.body.labourRatePerHour.strike).toBe(s.labourRatePerHour.strike);
    const second = (await sales.post('/api/quotes').send(body())).body.lines[0].unitPrice as number;
    expect(second).toBeGreaterThan(first);
    await admin.put('/api/admin/costing').send({ labourRatePerHour: { fill: s.labourRatePerHour.fill } });
  });
});
