import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertDemoFloor } from '../support/scan-fixtures';
import type { WhatIfResult } from '@shared/schemas/projections';

// A quote's break dates are the what-if's answer for the same spec and quantity: the open
// floor (the demo catalogue's order mix, released at different steps) projected with the order
// added, with the same clock, model and seeds.
const NOW = Math.floor(Date.now() / 60_000) * 60_000; // sessions are checked against the real clock
let t: TestApp;
let sales: Awaited<ReturnType<TestApp['agentAs']>>;

const spec = {
  title: 'Regatta crest',
  process: 'hard_enamel',
  material: 'iron',
  sizeMm: 25,
  colours: [{ name: 'Navy', hex: '#1b2a4a' }, { name: 'White' }],
  plating: 'gold',
  backing: { type: 'butterfly_clutch', count: 1 },
  packaging: 'individual_bag',
};
type Line = { quantity: number; shipDates: { expectedAt: string | null; p85At: string | null } };

beforeAll(async () => {
  t = makeTestApp();
  t.setNow(NOW);
  sales = await t.agentAs('sales');
  insertDemoFloor(t.deps, NOW, 'quote');
});
afterAll(() => t.close());

describe('quote ship dates', { timeout: 120_000 }, () => {
  it('each break has the what-if dates of the same spec and quantity; a larger break ships no earlier', async () => {
    const res = await sales.post('/api/quotes').send({
      customer: 'Invented Harbour Rowing Club',
      contactEmail: 'crew@harbour-rowing.example',
      spec: { ...spec, heightMm: 22, thicknessMm: 1.5 },
      quantities: [100, 3000],
      validUntil: new Date(NOW + 30 * 86_400_000).toISOString().slice(0, 10),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.shipDateBasis).toMatch(/whole open floor with this order added/);
    const lines = res.body.lines as Line[];
    for (const l of lines) {
      // without a due date the quoted order queues behind the open orders' latest due date (the fixture's 2099-01-01)
      const w = await sales
        .post('/api/projections/what-if')
        .send({ ...spec, customer: 'Invented Harbour Rowing Club', quantity: l.quantity, dueDate: '2099-01-01' });
      expect(w.status, JSON.stringify(w.body)).toBe(200);
      const answer = w.body as WhatIfResult;
      expect(answer.expectedAt).not.toBeNull();
      expect(l.shipDates).toEqual({ expectedAt: answer.expectedAt, p85At: answer.p85At });
    }
    const [small, large] = lines;
    expect(Date.parse(large.shipDates.expectedAt!)).toBeGreaterThanOrEqual(Date.parse(small.shipDates.expectedAt!));
    expect(Date.parse(large.shipDates.p85At!)).toBeGreaterThanOrEqual(Date.parse(small.shipDates.p85At!));
    // 3000 pieces is several trays more work at every step than 100: it ships strictly later
    expect(Date.parse(large.shipDates.expectedAt!)).toBeGreaterThan(Date.parse(small.shipDates.expectedAt!));
  });
});
