import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { COVERAGE_FILE } from '../../server/backtest/coverage';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertDemoFloor } from '../support/scan-fixtures';
import type { WhatIfResult } from '@shared/schemas/projections';

// "What if we take this order?" on a floor like the demo factory's: the demo catalogue's order
// mix (every process, its routings from the default templates, its tray sizes) released onto
// the floor at different steps. The answer is a simulation of that floor with and without the
// new order; it must store nothing.
const HOUR = 3_600_000;
const NOW = Math.floor(Date.now() / 60_000) * 60_000; // sessions are checked against the real clock
let t: TestApp;
let sales: Awaited<ReturnType<TestApp['agentAs']>>;
let planner: Awaited<ReturnType<TestApp['agentAs']>>;

const spec = {
  customer: 'Invented Harbour Rowing Club',
  title: 'Regatta crest',
  productType: 'pin',
  process: 'hard_enamel',
  material: 'iron',
  sizeMm: 25,
  quantity: 500,
  overrunPct: 5,
  colours: [{ name: 'Navy', hex: '#1b2a4a' }],
  plating: 'gold',
  backing: { type: 'butterfly_clutch', count: 1 },
  packaging: 'individual_bag',
  dueDate: '2026-03-20',
};
const colours = (n: number) => Array.from({ length: n }, (_, i) => ({ name: `Colour ${i + 1}` }));

function rowCounts(): Record<string, number> {
  const sqlite = t.deps.db.$client;
  const tables = sqlite.prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%'").all() as { name: string }[];
  return Object.fromEntries(tables.map(({ name }) => [name, (sqlite.prepare(`select count(*) as n from "${name}"`).get() as { n: number }).n]));
}

async function whatIf(body: object): Promise<WhatIfResult> {
  const res = await sales.post('/api/projections/what-if').send(body);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as WhatIfResult;
}

beforeAll(async () => {
  t = makeTestApp();
  t.setNow(NOW);
  sales = await t.agentAs('sales');
  planner = await t.agentAs('planner');
  insertDemoFloor(t.deps, NOW, 'what-if');
});
afterAll(() => t.close());

describe('POST /api/projections/what-if', { timeout: 90_000 }, () => {
  it('projects the new order and stores nothing', async () => {
    const before = rowCounts();
    expect(before.trays).toBeGreaterThan(20);
    const r = await whatIf(spec);
    expect(Date.parse(r.expectedAt!)).toBeGreaterThan(NOW);
    expect(Date.parse(r.p85At!)).toBeGreaterThanOrEqual(Date.parse(r.expectedAt!));
    expect(rowCounts()).toEqual(before);
    // the same question gives the same answer (seeded runs)
    expect(await whatIf(spec)).toEqual(r);
  });

  it('an 8-colour hard enamel order ships no earlier than the same order with 1 colour', async () => {
    const one = await whatIf({ ...spec, colours: colours(1) });
    const eight = await whatIf({ ...spec, colours: colours(8) });
    expect(Date.parse(eight.expectedAt!)).toBeGreaterThanOrEqual(Date.parse(one.expectedAt!));
    expect(Date.parse(eight.p85At!)).toBeGreaterThanOrEqual(Date.parse(one.p85At!));
  });

  it('ten times the quantity ships no earlier, and moves other orders later, never earlier', async () => {
    const before = rowCounts();
    const small = await whatIf(spec);
    const big = await whatIf({ ...spec, quantity: spec.quantity * 10 });
    expect(Date.parse(big.expectedAt!)).toBeGreaterThanOrEqual(Date.parse(small.expectedAt!));
    expect(Date.parse(big.p85At!)).toBeGreaterThanOrEqual(Date.parse(small.p85At!));
    // 5,250 pieces due first take places other trays were waiting for
    expect(big.impacts.length).toBeGreaterThan(0);
    for (const i of [...small.impacts, ...big.impacts]) expect(Date.parse(i.p85After), i.number).toBeGreaterThan(Date.parse(i.p85Before));
    expect(rowCounts()).toEqual(before);
  });

  it('starts the order at releaseAt when it is later than now', async () => {
    const now = await whatIf(spec);
    const later = await whatIf({ ...spec, releaseAt: new Date(NOW + 7 * 24 * HOUR).toISOString() });
    expect(Date.parse(later.expectedAt!)).toBeGreaterThan(Date.parse(now.expectedAt!));
    expect(Date.parse(later.expectedAt!)).toBeGreaterThan(NOW + 7 * 24 * HOUR);
  });

  it('lets planners ask too, and refuses a spec that is not valid', async () => {
    expect((await planner.post('/api/projections/what-if').send(spec)).status).toBe(200);
    const bad = await sales.post('/api/projections/what-if').send({ ...spec, colours: [] });
    expect(bad.status).toBe(400);
    const unknown = await sales.post('/api/projections/what-if').send({ ...spec, traySize: 50 });
    expect(unknown.status).toBe(400);
  });
});

describe('GET /api/projections/coverage', () => {
  it('gives the coverage of the 85 % date the kept backtest measured, for the label beside projected dates', async () => {
    const kept = JSON.parse(fs.readFileSync(COVERAGE_FILE, 'utf8'));
    const res = await sales.get('/api/projections/coverage');
    expect(res.status).toBe(200);
    expect(res.body.coverage).toEqual({ p85Coverage: kept.snapshots.p85Coverage, measuredOn: kept.measuredOn, floors: kept.floors, orders: kept.snapshots.n });
    expect(res.body.coverage.p85Coverage).toBeGreaterThan(0);
    expect(res.body.coverage.p85Coverage).toBeLessThanOrEqual(1);
  });
});
