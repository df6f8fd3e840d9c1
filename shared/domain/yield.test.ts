import { describe, expect, it } from 'vitest';
import { checkCounts, multiplyRatios, pareto, ratio, ratioToNumber, rolledThroughputYield, stepYield, sumStepCounts } from './yield';

// Check values: Minitab's published help on throughput yield and rolled throughput yield:
// 1000 units in, 950 pass step 1, 800 of 950 pass step 2, 700 of 800 pass step 3 -> RTY 0.70
// when the exact ratios are multiplied (0.7022 with the rounded 0.95 x 0.84 x 0.88).
const MINITAB = [
  { seq: 1, inQty: 1000, goodQty: 950, scrapQty: 50, reworkQty: 0 },
  { seq: 2, inQty: 950, goodQty: 800, scrapQty: 150, reworkQty: 0 },
  { seq: 3, inQty: 800, goodQty: 700, scrapQty: 100, reworkQty: 0 },
];

describe('rolled throughput yield (Minitab help example)', () => {
  it('is exactly 0.70 when the exact ratios are multiplied', () => {
    const r = rolledThroughputYield(MINITAB);
    expect(r.rtyExact).toEqual({ num: 7n, den: 10n });
    expect(r.rty).toBe(0.7);
    expect(r.finalYield).toBe(0.7);
  });

  it('differs from the product of rounded step yields (0.7022), which we must not use', () => {
    const rounded = 0.95 * 0.84 * 0.88;
    expect(rounded).toBeCloseTo(0.7022, 4);
    expect(rolledThroughputYield(MINITAB).rty).not.toBeCloseTo(rounded, 3);
  });

  it('does not depend on the order the steps are given in', () => {
    expect(rolledThroughputYield([...MINITAB].reverse()).rty).toBe(0.7);
  });
});

describe('first-pass yield counts rework as not passed; final yield counts it as good', () => {
  // Minitab help: FPY excludes units that needed rework; final yield counts them.
  it('splits a step with rework', () => {
    const y = stepYield({ seq: 1, inQty: 100, goodQty: 95, scrapQty: 5, reworkQty: 10 });
    expect(y.firstPassQty).toBe(85);
    expect(y.firstPassYield).toBe(0.85);
    expect(y.finalYield).toBe(0.95);
  });

  it('lowers RTY but not final yield when a step has rework', () => {
    const withRework = MINITAB.map((s) => (s.seq === 2 ? { ...s, reworkQty: 95 } : s));
    const r = rolledThroughputYield(withRework);
    // (950/1000) x (705/950) x (700/800) = 705 x 7 / 8000 = 0.616875 (computed)
    expect(r.rtyExact).toEqual(ratio(4935, 8000));
    expect(r.rty).toBe(0.616875);
    expect(r.finalYield).toBe(0.7);
  });

  it('refuses counts that cannot be', () => {
    expect(() => stepYield({ seq: 1, inQty: 10, goodQty: 5, scrapQty: 5, reworkQty: 6 })).toThrow(RangeError);
    expect(() => stepYield({ seq: 1, inQty: 10, goodQty: 2.5, scrapQty: 5, reworkQty: 0 })).toThrow(RangeError);
    // more good pieces than went in: a yield above 100 % (a first-pass count above the pieces in)
    expect(() => checkCounts({ seq: 1, inQty: 10, goodQty: 11, scrapQty: 0, reworkQty: 0 })).toThrow(/more good pieces than went into it/);
    expect(() => stepYield({ seq: 1, inQty: 0, goodQty: 1, scrapQty: 0, reworkQty: 0 })).toThrow(RangeError);
    expect(() => checkCounts({ seq: 1, inQty: 10, goodQty: 10, scrapQty: 0, reworkQty: 0 })).not.toThrow();
  });

  it('reports null yields for a step nothing entered', () => {
    expect(stepYield({ seq: 4, inQty: 0, goodQty: 0, scrapQty: 0, reworkQty: 0 }).firstPassYield).toBeNull();
    expect(rolledThroughputYield([]).rty).toBeNull();
  });
});

describe('exact ratios', () => {
  it('stay exact over 25 steps of large counts', () => {
    const rs = Array.from({ length: 25 }, (_, i) => ratio(100_000 - i - 1, 100_000 - i));
    // telescoping product (99999/100000) x (99998/99999) x ... = 99975/100000 (computed)
    expect(multiplyRatios(rs)).toEqual({ num: 3999n, den: 4000n });
    expect(ratioToNumber(multiplyRatios(rs))).toBe(0.99975);
  });

  it('converts a ratio too large for doubles', () => {
    const big = { num: 10n ** 30n, den: 3n * 10n ** 30n };
    expect(ratioToNumber(big)).toBeCloseTo(1 / 3, 15);
  });
});

describe('sumStepCounts and pareto', () => {
  it('adds several trays step by step', () => {
    const trays = [
      { seq: 1, inQty: 500, goodQty: 480, scrapQty: 20, reworkQty: 5 },
      { seq: 1, inQty: 500, goodQty: 470, scrapQty: 30, reworkQty: 0 },
      { seq: 2, inQty: 950, goodQty: 950, scrapQty: 0, reworkQty: 0 },
    ];
    expect(sumStepCounts(trays)).toEqual([
      { seq: 1, inQty: 1000, goodQty: 950, scrapQty: 50, reworkQty: 5 },
      { seq: 2, inQty: 950, goodQty: 950, scrapQty: 0, reworkQty: 0 },
    ]);
  });

  it('orders reasons by quantity with cumulative shares ending at 1', () => {
    const p = pareto([
      { reason: 'dust', qty: 10 },
      { reason: 'colour_bleed', qty: 30 },
      { reason: 'dust', qty: 20 },
      { reason: 'bent_post', qty: 40 },
      { reason: 'none', qty: 0 },
    ]);
    expect(p.map((r) => r.reason)).toEqual(['bent_post', 'colour_bleed', 'dust']);
    expect(p.map((r) => r.qty)).toEqual([40, 30, 30]);
    expect(p[0].share).toBeCloseTo(0.4, 12);
    expect(p[1].cumulativeShare).toBeCloseTo(0.7, 12);
    expect(p[2].cumulativeShare).toBe(1);
  });
});
