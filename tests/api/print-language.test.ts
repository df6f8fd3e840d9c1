// The factory's print language: an admin's setting (en or zh-CN, English by default) that the
// travellers and packing lists print their labels in. Read back with poppler's pdftotext, a tool
// independent of the library that wrote the PDFs.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertShippingOrder, SEQ } from '../support/shipping-fixtures';
import { getPdf, pdfToText } from '../support/pdf';

type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let admin: Agent;
let supervisor: Agent;

beforeAll(async () => {
  t = makeTestApp();
  admin = await t.agentAs('admin');
  supervisor = await t.agentAs('supervisor');
});
afterAll(() => t.close());

async function pdfText(agent: Agent, url: string, name: string): Promise<string> {
  const res = await getPdf(agent, url);
  expect(res.status).toBe(200);
  return pdfToText(res.body as Buffer, path.join(t.dataDir, name));
}

async function printouts(tag: string) {
  const o = insertShippingOrder(t.deps, { customer: `星河徽章俱乐部 ${tag}`, title: 'Harbour crest', trays: [{ quantity: 60, at: SEQ.dispatch }] });
  const ship = await supervisor
    .post(`/api/orders/${o.orderId}/shipments`)
    .send({ carrier: 'Invented Parcel Co', trackingNumber: `IPC-${tag}`, cartons: [{ count: 1, piecesPerCarton: 60, weightKg: 1.5 }] });
  expect(ship.status).toBe(201);
  return {
    traveller: await pdfText(supervisor, `/api/orders/${o.orderId}/travellers.pdf?layout=a6`, `travellers-${tag}.pdf`),
    packing: await pdfText(supervisor, `/api/orders/${o.orderId}/shipments/${ship.body.id}/packing-list.pdf`, `packing-${tag}.pdf`),
  };
}

describe('the factory’s print language', () => {
  it('is English until an admin chooses Chinese; only an admin may change it, and only to en or zh-CN', async () => {
    expect((await admin.get('/api/admin/factory-language')).body).toEqual({ language: 'en' });
    expect((await supervisor.put('/api/admin/factory-language').send({ language: 'zh-CN' })).status).toBe(403);
    const bad = await admin.put('/api/admin/factory-language').send({ language: 'fr' });
    expect(bad.status).toBe(400);
    expect((await admin.put('/api/admin/factory-language').send({ language: 'zh-CN', extra: 1 })).status).toBe(400);
    // the app's write rule: same origin, JSON only
    expect((await admin.put('/api/admin/factory-language').set('Origin', 'http://elsewhere.test').send({ language: 'zh-CN' })).status).toBe(403);
    expect((await admin.put('/api/admin/factory-language').set('Content-Type', 'text/plain').send('{"language":"zh-CN"}')).status).toBe(415);
    expect((await admin.get('/api/admin/factory-language')).body).toEqual({ language: 'en' });
  });

  it('prints the traveller and the packing list labels in English, then in Chinese once set to zh-CN', async () => {
    const en = await printouts('en');
    for (const s of ['TRAY TRAVELLER', 'Plating', 'Due']) expect(en.traveller).toContain(s);
    for (const s of ['Packing list', 'Tracking number', 'Pieces per carton']) expect(en.packing).toContain(s);
    expect(en.traveller).not.toContain('流程卡');

    const set = await admin.put('/api/admin/factory-language').send({ language: 'zh-CN' });
    expect(set.status).toBe(200);
    expect(set.body).toEqual({ language: 'zh-CN' });
    const zh = await printouts('zh');
    // trade words as a Chinese badge factory writes them (common practice)
    for (const s of ['托盘流程卡', '电镀', '交期', '星河徽章俱乐部']) expect(zh.traveller).toContain(s);
    for (const s of ['装箱单', '运单号', '每箱件数', '星河徽章俱乐部']) expect(zh.packing).toContain(s);
    expect(zh.traveller).not.toContain('TRAY TRAVELLER');
    expect(zh.packing).not.toContain('Tracking number');
    // what the customer wrote stays as written
    expect(zh.traveller).toContain('Harbour crest');

    expect((await admin.put('/api/admin/factory-language').send({ language: 'en' })).status).toBe(200);
  });
});
