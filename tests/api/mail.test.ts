import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { simpleParser } from 'mailparser';
import { PNG } from 'pngjs';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertProof, insertShippingOrder, SEQ } from '../support/shipping-fixtures';
import { mailQueue } from '../../server/db/schema/shipping';
import { mailDir } from '../../server/lib/mail-catcher';
import { MAX_ATTEMPTS, RETRY_PAUSES_MS, processMailQueue, queueLateDigest, startMail } from '../../server/services/mail.service';

type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let mail: Awaited<ReturnType<typeof startMail>>;
let admin: Agent;
let sales: Agent;
let planner: Agent;

beforeAll(async () => {
  t = makeTestApp();
  // SMTP_URL is unset in tests: the local catcher starts on a loopback port, as it does with the app.
  mail = await startMail(t.deps, { intervalMs: 100 });
  admin = await t.agentAs('admin');
  sales = await t.agentAs('sales');
  planner = await t.agentAs('planner');
});
afterAll(async () => {
  await mail.stop();
  t.close();
});

async function caughtUntil(predicate: (list: { to: string; subject: string; id: string }[]) => boolean, timeoutMs = 10_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await admin.get('/api/mail');
    expect(res.status).toBe(200);
    if (predicate(res.body)) return res.body as { to: string; subject: string; text: string; sentAt: string; id: string }[];
    if (Date.now() > until) throw new Error(`mail did not arrive: ${JSON.stringify(res.body.map((m: { to: string; subject: string }) => [m.to, m.subject]))}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

const raw = (id: string) => fs.readFileSync(path.join(mailDir(t.dataDir), `${id}.eml`));

describe('mail through the local catcher', () => {
  it('listens on loopback only', () => {
    expect(mail.catcher).not.toBeNull();
    expect(mail.catcher!.host).toBe('127.0.0.1');
  });

  it('sends the shipped mail to the customer contact and the sales owner, with the tracking number and a working status link', async () => {
    const o = insertShippingOrder(t.deps, {
      title: 'Lighthouse keepers badge',
      contactEmail: 'buyer@lighthouse-keepers.example',
      contactName: 'Oona Ferris',
      salesOwnerId: sales.user.id,
      trays: [{ quantity: 60, at: SEQ.dispatch }],
    });
    const res = await sales
      .post(`/api/orders/${o.orderId}/shipments`)
      .send({ carrier: 'Invented Parcel Co', trackingNumber: 'IPC-4410-7788', cartons: [{ count: 1, piecesPerCarton: 60, weightKg: 1.9 }] });
    expect(res.status).toBe(201);
    expect(res.body.mail).toEqual({ queued: 2, missing: [] });

    const list = await caughtUntil((l) => l.filter((m) => m.subject.includes(o.number)).length >= 2);
    const toCustomer = list.find((m) => m.to.includes('buyer@lighthouse-keepers.example'))!;
    const toSales = list.find((m) => m.to.includes(sales.user.email))!;
    expect(toCustomer).toBeDefined();
    expect(toSales).toBeDefined();
    expect(Object.keys(toCustomer)).toEqual(expect.arrayContaining(['to', 'subject', 'text', 'sentAt']));

    // Parse the raw message as a mail client would (mailparser), not our own summary.
    const parsed = await simpleParser(raw(toCustomer.id));
    expect(parsed.text).toContain('IPC-4410-7788');
    expect(parsed.text).toContain('Oona Ferris');
    expect(typeof parsed.html).toBe('string');
    expect(parsed.html as string).toContain('IPC-4410-7788');
    const link = /(https?:\/\/\S+\/status\/([A-Za-z0-9_-]+))/.exec(parsed.text ?? '');
    expect(link).not.toBeNull();
    expect((parsed.html as string).includes(link![1])).toBe(true);
    const page = await request(t.app).get(`/api/public/status/${link![2]}`);
    expect(page.status).toBe(200);
    expect(page.body).toMatchObject({ title: 'Lighthouse keepers badge', carrier: 'Invented Parcel Co', trackingNumber: 'IPC-4410-7788' });
  });

  it('lists caught mail newest first, for admins only', async () => {
    const list = (await admin.get('/api/mail')).body as { sentAt: string }[];
    expect(list.length).toBeGreaterThan(0);
    const times = list.map((m) => Date.parse(m.sentAt));
    expect([...times].sort((a, b) => b - a)).toEqual(times);
    expect((await sales.get('/api/mail')).status).toBe(403);
    expect((await request(t.app).get('/api/mail')).status).toBe(401);
  });

  it('sends the proof for approval with the proof attached', async () => {
    const o = insertShippingOrder(t.deps, { status: 'awaiting_proof', contactEmail: 'art@choir-guild.example', trays: [] });
    const img = new PNG({ width: 16, height: 16 });
    img.data.fill(180);
    const proof = PNG.sync.write(img);
    insertProof(t.deps, o.orderId, 2, proof, 'image/png', planner.user.id);
    const res = await sales.post(`/api/orders/${o.orderId}/proofs/2/send`).send({});
    expect(res.status).toBe(202);
    const list = await caughtUntil((l) => l.some((m) => m.subject.includes(`order ${o.number}`) && m.to.includes('art@choir-guild.example')));
    const m = list.find((x) => x.to.includes('art@choir-guild.example'))!;
    const parsed = await simpleParser(raw(m.id));
    expect(parsed.attachments).toHaveLength(1);
    expect(parsed.attachments[0].contentType).toBe('image/png');
    expect(Buffer.compare(parsed.attachments[0].content, proof)).toBe(0);
    expect((await sales.post(`/api/orders/${o.orderId}/proofs/9/send`).send({})).status).toBe(404);
  });

  it('refuses a proof mail when the customer has no contact address, and a malformed address at entry', async () => {
    const o = insertShippingOrder(t.deps, { status: 'awaiting_proof', contactEmail: null, trays: [] });
    insertProof(t.deps, o.orderId, 1, Buffer.from('%PDF-1.4\n%%EOF\n'), 'application/pdf', planner.user.id);
    const res = await sales.post(`/api/orders/${o.orderId}/proofs/1/send`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('no_contact_email');
    for (const bad of ['not-an-address', 'two@@signs.example', 'spaces in@side.example', '']) {
      const put = await sales.put(`/api/orders/${o.orderId}/contact`).send({ contactEmail: bad });
      expect(put.status).toBe(400);
      expect(put.body.error.issues[0].path).toEqual(['contactEmail']);
    }
    const ok = await sales.put(`/api/orders/${o.orderId}/contact`).send({ contactEmail: ' art@choir-guild.example ', contactName: 'Pia Holm' });
    expect(ok.status).toBe(200);
    expect(ok.body.contact).toMatchObject({ contactEmail: 'art@choir-guild.example', contactName: 'Pia Holm' });
  });

  it('queues a daily late-risk digest to planners and sales, once per day', async () => {
    insertShippingOrder(t.deps, { title: 'Overdue regatta medal', dueDate: '2020-01-01', trays: [{ quantity: 10, at: SEQ.fill }] });
    const first = queueLateDigest(t.deps, '2031-02-03');
    expect(first.orders).toBeGreaterThanOrEqual(1);
    expect(first.queued).toBeGreaterThanOrEqual(2); // at least the planner and the sales person of this test
    expect(queueLateDigest(t.deps, '2031-02-03').queued).toBe(0);
    const list = await caughtUntil((l) => l.some((m) => m.subject.startsWith('Late risk on 2031-02-03') && m.to.includes(planner.user.email)));
    const digest = list.find((m) => m.to.includes(planner.user.email) && m.subject.startsWith('Late risk'))!;
    expect(digest.text).toContain('Overdue regatta medal');
    expect(digest.text).toContain('Due 2020-01-01');
  });
});

describe('the queue never lets a send fail the work', () => {
  it('records the shipment even when the mail server is down, and retries with growing pauses', async () => {
    const t2 = makeTestApp();
    try {
      let calls = 0;
      t2.deps.mail = {
        from: 'test@trayce.local',
        send: async () => {
          calls++;
          throw new Error('connect ECONNREFUSED 127.0.0.1:25');
        },
      };
      const s2 = await t2.agentAs('sales');
      const o = insertShippingOrder(t2.deps, { contactEmail: 'buyer@example.org', trays: [{ quantity: 5, at: SEQ.dispatch }] });
      const res = await s2
        .post(`/api/orders/${o.orderId}/shipments`)
        .send({ carrier: 'X', trackingNumber: 'RETRY-1', cartons: [{ count: 1, piecesPerCarton: 5, weightKg: 0.2 }] });
      expect(res.status).toBe(201);
      let now = Date.now();
      t2.setNow(now);
      expect(await processMailQueue(t2.deps)).toEqual({ sent: 0, retried: 1, failed: 0 });
      let row = t2.deps.db.select().from(mailQueue).where(eq(mailQueue.orderId, o.orderId)).get()!;
      expect(row).toMatchObject({ status: 'queued', attempts: 1, nextAttemptAt: now + RETRY_PAUSES_MS[0] });
      expect(row.lastError).toMatch(/ECONNREFUSED/);
      // not due yet: nothing is tried
      expect(await processMailQueue(t2.deps)).toEqual({ sent: 0, retried: 0, failed: 0 });
      for (let attempt = 2; attempt <= MAX_ATTEMPTS; attempt++) {
        now = row.nextAttemptAt;
        t2.setNow(now);
        await processMailQueue(t2.deps);
        row = t2.deps.db.select().from(mailQueue).where(eq(mailQueue.orderId, o.orderId)).get()!;
        expect(row.attempts).toBe(attempt);
      }
      expect(row.status).toBe('failed');
      expect(calls).toBe(MAX_ATTEMPTS);
      // an admin can send it again once the server is back
      let delivered = 0;
      t2.deps.mail = { from: 'test@trayce.local', send: async () => void delivered++ };
      const a2 = await t2.agentAs('admin');
      expect((await a2.post(`/api/mail/queue/${row.id}/retry`).send({})).status).toBe(204);
      expect(await processMailQueue(t2.deps)).toEqual({ sent: 1, retried: 0, failed: 0 });
      expect(delivered).toBe(1);
      const queue = await a2.get('/api/mail/queue');
      expect(queue.body[0]).toMatchObject({ status: 'sent', attempts: MAX_ATTEMPTS + 1 });
    } finally {
      t2.close();
    }
  });
});
