import { describe, expect, it } from 'vitest';
import { actualStepsOf, costByProcessAndColours, cureCycles, runWorkingMinutes, type StepRunFact } from './costing-actual';
import { compareCost, costLine, type CostingSpec } from './costing';
import { DEFAULT_COSTING_SETTINGS as S } from '@shared/schemas/costing';
import type { RoutingStep, StationKind } from './vocabulary';

const MIN = 60_000;
const step = (seq: number, name: string, stationKind: StationKind, cureMinutes: number | null = null): RoutingStep => ({
  seq,
  name,
  stationKind,
  trayMinutes: 10,
  pieceMinutes: 0.2,
  cureMinutes,
  colour: null,
});
const ROUTING = [
  step(1, 'Die striking', 'strike'),
  step(2, 'Colour 1 of 1: fill', 'fill'),
  step(3, 'Colour 1 of 1: cure', 'cure', 120),
  step(4, 'Plating', 'plate'),
];
const run = (stepSeq: number, stationKind: string, start: number, finish: number, over: Partial<StepRunFact> = {}): StepRunFact => ({
  stepSeq,
  stationKind,
  startedAt: start * MIN,
  finishedAt: finish * MIN,
  workingMinutes: finish - start,
  qtyIn: 100,
  scrapQty: 0,
  ...over,
});

describe('oven cycles of a cure step', () => {
  it('trays in the oven at the same time share one cycle; a tray that goes in after they came out starts another', () => {
    expect(cureCycles([])).toBe(0);
    expect(cureCycles([run(3, 'cure', 0, 120), run(3, 'cure', 5, 125)])).toBe(1);
    expect(cureCycles([run(3, 'cure', 0, 120), run(3, 'cure', 130, 250)])).toBe(2);
    // in any order
    expect(cureCycles([run(3, 'cure', 300, 420), run(3, 'cure', 0, 120), run(3, 'cure', 100, 220)])).toBe(2);
  });
});

describe('the actual side of each step', () => {
  it('sums working minutes and scrap per step; a cure step is paid its standard handling and counted in cycles', () => {
    const runs = [
      run(1, 'strike', 0, 60, { scrapQty: 2 }),
      run(1, 'strike', 20, 80),
      run(2, 'fill', 90, 150),
      run(3, 'cure', 160, 280, { qtyIn: 98 }),
      run(3, 'cure', 170, 290),
    ];
    const a = actualStepsOf(ROUTING, runs);
    expect(a.map((s) => s.seq)).toEqual([1, 2, 3, 4]);
    expect(a[0]).toMatchObject({ minutes: 120, scrap: 2, cureCycles: 0 });
    expect(a[1]).toMatchObject({ minutes: 60, scrap: 0 });
    // standard handling: 10 min per tray + 0.2 min per piece → (10 + 19.6) + (10 + 20) = 59.6
    expect(a[2]).toMatchObject({ minutes: 59.6, cureCycles: 1, cureMinutes: 120 });
    // not run yet
    expect(a[3]).toMatchObject({ minutes: 0, scrap: 0, cureCycles: 0 });
  });

  it('keeps a step run the routing no longer has', () => {
    const a = actualStepsOf(ROUTING.slice(0, 2), [run(5, 'inspect', 0, 30)]);
    expect(a.map((s) => [s.seq, s.stationKind, s.minutes])).toEqual([
      [1, 'strike', 0],
      [2, 'fill', 0],
      [5, 'inspect', 30],
    ]);
  });

  it('counts only working time between a start and its finish', () => {
    // a calendar that works every other minute
    const half = (from: number, to: number) => (to - from) / MIN / 2;
    expect(runWorkingMinutes(0, 60 * MIN, half)).toBe(30);
    expect(runWorkingMinutes(null, 60 * MIN, half)).toBe(0);
    expect(runWorkingMinutes(60 * MIN, 0, half)).toBe(0);
  });
});

describe('quoted against actual, by step', () => {
  const spec: CostingSpec = {
    process: 'hard_enamel',
    material: 'iron',
    sizeMm: 25,
    heightMm: 25,
    thicknessMm: 1.5,
    outlineFactor: null,
    colours: [{ name: 'Navy' }],
    plating: 'gold',
    backing: { type: 'butterfly_clutch', count: 1 },
    backLogo: false,
    packaging: 'individual_bag',
    overrunPct: 0,
  };
  const quoted = costLine(spec, ROUTING, 200, 0, S);

  it('a cure step quotes its oven energy as well as its handling, so running it as quoted shows no variance', () => {
    const asQuoted = actualStepsOf(ROUTING, [
      run(1, 'strike', 0, 40, { qtyIn: 200 }),
      run(2, 'fill', 50, 90, { qtyIn: 200 }),
      run(3, 'cure', 100, 220, { qtyIn: 100 }),
      run(3, 'cure', 101, 221, { qtyIn: 100 }),
      run(4, 'plate', 230, 270, { qtyIn: 200 }),
    ]);
    // quoted minutes per step for 200 pieces in two trays: 2 × 10 + 200 × 0.2 = 60; the runs above took 40 each
    const c = compareCost({ quoted, quantity: 200, actualSteps: asQuoted, spec, routing: ROUTING, settings: S });
    const cure = c.steps.find((s) => s.seq === 3)!;
    // one oven load of 120 min: 4 kWh per load hour × 2 h × tariff 0.12 = 0.96, plus 60 min of handling at the oven rate
    expect(cure.quotedCost).toBeCloseTo(0.96 + S.labourRatePerHour.cure, 2);
    expect(cure.variance).toBeCloseTo(0, 2);
    const strike = c.steps.find((s) => s.seq === 1)!;
    expect(strike.variance).toBeCloseTo((-20 / 60) * S.labourRatePerHour.strike, 2);
    // the steps' variances add up to the whole
    expect(c.steps.reduce((s, x) => s + x.variance, 0)).toBeCloseTo(c.variance, 1);
  });

  it('a second oven cycle costs one more load', () => {
    const runs = [run(3, 'cure', 100, 220, { qtyIn: 100 }), run(3, 'cure', 230, 350, { qtyIn: 100 })];
    const c = compareCost({ quoted, quantity: 200, actualSteps: actualStepsOf(ROUTING, runs), spec, routing: ROUTING, settings: S });
    expect(c.actualParts.oven).toBeCloseTo(2 * 0.96, 2);
  });
});

describe('the report by process and colour count', () => {
  it('sums orders of the same process and colours, with the variance as a share of the quoted cost', () => {
    const rows = costByProcessAndColours([
      { process: 'soft_enamel', colours: 3, quoted: 100, actual: 120 },
      { process: 'hard_enamel', colours: 2, quoted: 200, actual: 190 },
      { process: 'hard_enamel', colours: 2, quoted: 100, actual: 140 },
      { process: 'hard_enamel', colours: 1, quoted: 0, actual: 10 },
    ]);
    expect(rows).toEqual([
      { process: 'hard_enamel', colours: 1, orders: 1, quoted: 0, actual: 10, variance: 10, variancePct: null },
      { process: 'hard_enamel', colours: 2, orders: 2, quoted: 300, actual: 330, variance: 30, variancePct: 10 },
      { process: 'soft_enamel', colours: 3, orders: 1, quoted: 100, actual: 120, variance: 20, variancePct: 20 },
    ]);
  });
});
