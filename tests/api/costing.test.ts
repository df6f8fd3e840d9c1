import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import Papa from 'papaparse';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertFloorOrder, scan, stationId } from '../support/scan-fixtures';
import { orders } from '../../server/db/schema/orders';
import type { RoutingStep, StationKind } from '@shared/domain/vocabulary';
import type { CostingReport, OrderCosting } from '@shared/schemas/order-costing';
import { DEFAULT_COSTING_SETTINGS as S } from '@shared/schemas/costing';

// Quoted against actual. A small order is driven through every step by scans with known times
// (the factory works 08:00-16:00 UTC every day, so working minutes are easy to count), and its
// actual cost is checked against figures worked out by hand from the demo rates below.

const MIN = 60_000;
const T0 = Math.floor(Date.now() / MIN) * MIN;
const D0 = Math.floor((T0 - 3 * 24 * 60 * MIN) / (24 * 60 * MIN)) * 24 * 60 * MIN;
const at = (minutes: number) => D0 + minutes * MIN;

const step = (seq: number, name: string, stationKind: StationKind, cureMinutes?: number): RoutingStep => ({
  seq,
  name,
  stationKind,
  trayMinutes: 10,
  pieceMinutes: 0.2,
  cureMinutes: cureMinutes ?? null,
  colour: null,
});
const ROUTING: RoutingStep[] = [
  step(1, 'Die striking', 'strike'),
  step(2, 'Colour 1 of 1: fill', 'fill'),
  step(3, 'Colour 1 of 1: cure', 'cure', 120),
  step(4, 'Plating', 'plate'),
  step(5, 'Final inspection', 'inspect'),
  step(6, 'Packing', 'pack'),
  step(7, 'Dispatch', 'dispatch'),
];

type Agent = Awaited<ReturnType<TestApp['agentAs']>>;
let t: TestApp;
let manager: Agent;
let operator: Agent;
let sales: Agent;
let small: ReturnType<typeof insertFloorOrder>;
let customerId: string;

beforeAll(async () => {
  t = makeTestApp({ log: (await import('pino')).pino({ level: process.env.COSTING_LOG ?? 'error' }) });
  t.setNow(T0);
  const ST = Object.fromEntries(['STR-1', 'FIL-1', 'OVN-1', 'PLT-1', 'INS-1', 'PCK-1', 'DSP-1'].map((c) => [c, stationId(t.deps, c)]));
  manager = await t.agentAs('manager');
  operator = await t.agentAs('operator');
  sales = await t.agentAs('sales');
  const admin = await t.agentAs('admin');
  const day = [{ start: '08:00', end: '16:00' }];
  const cal = await admin
    .put('/api/calendar')
    .send({ timeZone: 'UTC', week: { mon: day, tue: day, wed: day, thu: day, fri: day, sat: day, sun: day }, daysOff: [], stations: [] });
  expect(cal.status, JSON.stringify(cal.body)).toBe(200);
  small = insertFloorOrder(t.deps, { trays: 2, quantity: 100, releasedAt: at(480), routing: ROUTING });
  customerId = t.deps.db.select().from(orders).where(eq(orders.id, small.orderId)).get()!.customerId;
  const [A, B] = small.trays;
  const post = async (events: unknown[]) => {
    const res = await operator.post('/api/scans').send({ events });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    for (const r of res.body.results) expect(r.status, JSON.stringify(r)).toBe('accepted');
  };
  // tray A: strike 540-600 (2 misstruck), fill 630-690, oven 700-820, plating 900-960 (3 scrapped),
  // inspection 1000-1030, packing 1950-1980, dispatch 2000-2010
  // tray B: strike 560-620, fill 700-750, oven 760-880, plating 910-970, inspection 1040-1070
  // (1 scrapped), packing 1960-1990, dispatch 2005-2020
  await post([scan(A.code, ST['STR-1'], 'start', at(540)), scan(B.code, ST['STR-1'], 'start', at(560))]);
  await post([scan(A.code, ST['STR-1'], 'finish', at(600), { goodQty: 98, scrapQty: 2, scrapReason: 'misstrike' })]);
  await post([
    scan(B.code, ST['STR-1'], 'finish', at(620), { goodQty: 100, scrapQty: 0 }),
    scan(A.code, ST['FIL-1'], 'start', at(630)),
    scan(A.code, ST['FIL-1'], 'finish', at(690), { goodQty: 98, scrapQty: 0 }),
    scan(A.code, ST['OVN-1'], 'start', at(700)),
  ]);
  await post([
    scan(B.code, ST['FIL-1'], 'start', at(700)),
    scan(B.code, ST['FIL-1'], 'finish', at(750), { goodQty: 100, scrapQty: 0 }),
    scan(B.code, ST['OVN-1'], 'start', at(760)),
    scan(A.code, ST['PLT-1'], 'start', at(900)),
    scan(B.code, ST['PLT-1'], 'start', at(910)),
    scan(A.code, ST['PLT-1'], 'finish', at(960), { goodQty: 95, scrapQty: 3, scrapReason: 'plating_defect' }),
    scan(B.code, ST['PLT-1'], 'finish', at(970), { goodQty: 100, scrapQty: 0 }),
    scan(A.code, ST['INS-1'], 'start', at(1000)),
    scan(A.code, ST['INS-1'], 'finish', at(1030), { goodQty: 95, scrapQty: 0 }),
    scan(B.code, ST['INS-1'], 'start', at(1040)),
    scan(B.code, ST['INS-1'], 'finish', at(1070), { goodQty: 99, scrapQty: 1, scrapReason: 'scratch' }),
    scan(A.code, ST['PCK-1'], 'start', at(1950)),
    scan(B.code, ST['PCK-1'], 'start', at(1960)),
    scan(A.code, ST['PCK-1'], 'finish', at(1980), { goodQty: 95, scrapQty: 0 }),
    scan(B.code, ST['PCK-1'], 'finish', at(1990), { goodQty: 99, scrapQty: 0 }),
    scan(A.code, ST['DSP-1'], 'start', at(2000)),
    scan(B.code, ST['DSP-1'], 'start', at(2005)),
    scan(A.code, ST['DSP-1'], 'finish', at(2010), { goodQty: 95, scrapQty: 0 }),
    scan(B.code, ST['DSP-1'], 'finish', at(2020), { goodQty: 99, scrapQty: 0 }),
  ]);
});
afterAll(() => t.close());

// Hand-worked actual labour at the demo rates (per hour: strike 7, fill 5.5, cure 4, plate 8,
// inspect 5, pack 4, dispatch 5): strike 120 min → 14; fill 60 + 50 min → 10.0833; cure handling
// (10 + 0.2 × 98) + (10 + 0.2 × 100) = 59.6 min → 3.9733; plating 60 min and 50 (tray B's last
// ten minutes, 16:00-16:10, fall after the shift) → 14.6667; inspection ran 16:40-17:10 and
// 17:20-17:50, after the shift, so no working minutes → 0; packing 60 min → 4; dispatch 10 + 15
// min → 2.0833; total 48.8067, plus the office set-up 2 h × 15 = 30 → 78.81. Oven: both trays were in at once (700-820 and 760-880), one cycle of
// 120 min: 4 kWh × 2 h × 0.12 = 0.96. Scrap: 6 pieces of iron, each 25 × 25 mm × 0.7854 × 1.5 mm
// = 0.7363 cm³ × 7.874 g/cm³ = 5.798 g, with the 35 % striking loss 7.827 g at 1.20/kg = 0.00939
// → 0.06.
describe('an order priced at the standard rates against its scans', () => {
  it('shows each step quoted and actual, the cure cycles and the scrap', async () => {
    expect(S.labourRatePerHour).toMatchObject({ strike: 7, fill: 5.5, cure: 4, plate: 8, inspect: 5, pack: 4, dispatch: 5 });
    const res = await manager.get(`/api/orders/${small.orderId}/costing`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const c = res.body as OrderCosting;
    expect(c).toMatchObject({
      number: small.number,
      basis: 'standard',
      quoteNumber: null,
      currency: 'USD',
      quantity: 200,
      colours: 2,
      complete: true,
      scrapPieces: 6,
    });
    expect(c.steps.map((s) => [s.seq, s.stationKind, s.actualMinutes, s.scrap])).toEqual([
      [1, 'strike', 120, 2],
      [2, 'fill', 110, 0],
      [3, 'cure', 59.6, 0],
      [4, 'plate', 110, 3],
      [5, 'inspect', 0, 1],
      [6, 'pack', 60, 0],
      [7, 'dispatch', 25, 0],
    ]);
    // quoted minutes per step for 200 pieces with the 5 % overrun: 2.1 trays × 10 + 210 × 0.2 = 63
    for (const s of c.steps) expect(s.quotedMinutes).toBe(63);
    expect(c.cureCycles.actual).toBe(1);
    expect(c.actualParts.labour).toBeCloseTo(78.81, 2);
    expect(c.actualParts.oven).toBeCloseTo(0.96, 2);
    expect(c.actualParts.scrap).toBeCloseTo(0.06, 2);
    expect(c.variance).toBeCloseTo(c.actual - c.quoted, 2);
    expect(c.steps.reduce((sum, s) => sum + s.variance, 0)).toBeCloseTo(c.variance, 1);
    // strike: 120 min at 7/h = 14 against 63 min = 7.35, plus two pieces of metal 0.019
    const strike = c.steps[0];
    expect(strike.actualCost).toBeCloseTo(14.02, 2);
    expect(strike.variance).toBeCloseTo(14.02 - 7.35, 2);
  });

  it('is for managers: sales and planners are refused, an unknown order is not found', async () => {
    expect((await sales.get(`/api/orders/${small.orderId}/costing`)).status).toBe(403);
    expect((await (await t.agentAs('planner')).get(`/api/orders/${small.orderId}/costing`)).status).toBe(403);
    expect((await request(t.app).get(`/api/orders/${small.orderId}/costing`)).status).toBe(401);
    const missing = await manager.get('/api/orders/no-such-order/costing');
    expect(missing.status).toBe(404);
  });
});

describe('the report across orders', () => {
  const q = () => ({ from: new Date(D0).toISOString(), to: new Date(T0).toISOString(), customerId });

  it('sums shipped orders by process and colour count', async () => {
    const res = await manager.get('/api/reports/costing').query(q());
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const r = res.body as CostingReport;
    const one = (await manager.get(`/api/orders/${small.orderId}/costing`)).body as OrderCosting;
    expect(r.currency).toBe('USD');
    expect(r.orders).toEqual([
      expect.objectContaining({
        number: small.number,
        process: 'hard_enamel',
        colours: 2,
        quantity: 200,
        basis: 'standard',
        quoted: one.quoted,
        actual: one.actual,
      }),
    ]);
    expect(r.rows).toEqual([
      { process: 'hard_enamel', colours: 2, orders: 1, quoted: one.quoted, actual: one.actual, variance: one.variance, variancePct: one.variancePct },
    ]);
    // a window before the order shipped has none
    const early = await manager.get('/api/reports/costing').query({ from: new Date(D0 - 10 * 24 * 60 * MIN).toISOString(), to: new Date(D0).toISOString() });
    expect(early.body.rows).toEqual([]);
  });

  it('downloads as CSV with the same figures', async () => {
    const res = await manager.get('/api/reports/costing.csv').query(q());
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toContain('text/csv');
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="costing-/);
    const one = (await manager.get(`/api/orders/${small.orderId}/costing`)).body as OrderCosting;
    const parsed = Papa.parse<string[]>(res.text.replace(/^\uFEFF/, '').trim());
    expect(parsed.data[0]).toEqual(['process', 'colours', 'orders', 'quoted_USD', 'actual_USD', 'variance_USD', 'variance_pct']);
    expect(parsed.data[1]).toEqual(['hard_enamel', '2', '1', String(one.quoted), String(one.actual), String(one.variance), String(one.variancePct)]);
  });

  it('refuses a bad window with a clear error', async () => {
    const res = await manager.get('/api/reports/costing').query({ from: 'yesterday' });
    expect(res.status).toBe(400);
    expect((await sales.get('/api/reports/costing')).status).toBe(403);
  });
});

describe('an order made from an accepted quote', () => {
  it('is compared with the quote line the customer accepted, at the quote’s rates', async () => {
    const created = await sales.post('/api/quotes').send({
      customer: 'Invented Kestrel Choir',
      contactEmail: 'orders@kestrel-choir.example',
      spec: {
        title: 'Choir jubilee pin',
        process: 'hard_enamel',
        material: 'iron',
        sizeMm: 30,
        heightMm: 24,
        thicknessMm: 1.6,
        colours: [{ name: 'Gold leaf' }, { name: 'Crimson' }, { name: 'Ivory' }],
        plating: 'gold',
        backing: { type: 'butterfly_clutch', count: 1 },
        packaging: 'individual_bag',
      },
      quantities: [250, 500],
      validUntil: new Date(T0 + 20 * 24 * 60 * MIN).toISOString().slice(0, 10),
    });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const quote = created.body;
    const sent = await sales.post(`/api/quotes/${quote.id}/send`).send({});
    expect(sent.status).toBe(200);
    const token = (sent.body.url as string).split('/quote/')[1];
    const acc = await request(t.app)
      .post(`/api/public/quotes/${token}/accept`)
      .set('X-Forwarded-For', '10.77.0.1')
      .send({ quantity: 500, name: 'Nell Garrow' });
    expect(acc.status, JSON.stringify(acc.body)).toBe(201);
    const res = await manager.get(`/api/orders/${acc.body.orderId}/costing`);
    expect(res.status).toBe(200);
    const c = res.body as OrderCosting;
    const line = quote.lines[1];
    expect(c).toMatchObject({ basis: 'quote', quoteNumber: quote.number, quantity: 500, colours: 3, complete: false, scrapPieces: 0 });
    expect(c.quoted).toBeCloseTo(line.unitCost * 500, 1);
    expect(c.cureCycles).toEqual({ quoted: 3, actual: 0 });
    expect(c.steps.map((s) => s.seq)).toEqual(line.steps.map((s: { seq: number }) => s.seq));
    expect(c.steps.every((s) => s.actualMinutes === 0)).toBe(true);
  });
});
