import { describe, expect, it } from 'vitest';
import { conformalQuantile, normalizedScore } from './conformal';
import { seededRandom } from './stats';

// Lei, G'Sell, Rinaldo, Tibshirani & Wasserman (2018), "Distribution-Free Predictive Inference
// for Regression", JASA 113(523), the split conformal coverage theorem (its number from
// memory: 2.2): with n exchangeable calibration scores and the ⌈(n + 1)(1 − α)⌉-th smallest as
// the cut, a new score falls at or below it with probability at least 1 − α and, without ties,
// at most 1 − α + 1/(n + 1). The bound also follows from the rank of the new score being
// uniform on 1 … n + 1 (exchangeability), which the average below checks.
describe('split conformal quantile (Lei et al. 2018)', () => {
  it('takes the ⌈(n + 1)·p⌉-th smallest score (hand-worked)', () => {
    // n = 9, p = 0.85: ⌈10 × 0.85⌉ = 9 → the 9th smallest
    expect(conformalQuantile([5, 1, 9, 3, 7, 2, 8, 4, 6], 0.85)).toBe(9);
    // n = 19, p = 0.85: ⌈20 × 0.85⌉ = 17 → the 17th smallest of 1..19
    expect(
      conformalQuantile(
        Array.from({ length: 19 }, (_, i) => 19 - i),
        0.85,
      ),
    ).toBe(17);
    // n = 5, p = 0.85: ⌈6 × 0.85⌉ = 6 > 5 → no finite cut
    expect(conformalQuantile([1, 2, 3, 4, 5], 0.85)).toBe(Infinity);
  });

  it('keeps infinite scores in their place and refuses p outside (0, 1)', () => {
    // n = 11, p = 0.5: ⌈12 × 0.5⌉ = 6 → the 6th smallest of −∞, 1, 2, 3, 4, 5, …
    expect(conformalQuantile([-Infinity, 1, 2, Infinity, 3, 4, 5, 6, 7, 8, 9], 0.5)).toBe(5);
    expect(() => conformalQuantile([1, 2], 1)).toThrow(RangeError);
    expect(() => conformalQuantile([1, 2], 0)).toThrow(RangeError);
  });

  it('covers a fresh exchangeable case between p and p + 1/(n + 1) on average (the split conformal theorem)', () => {
    const rnd = seededRandom(7);
    const n = 39; // (n + 1)·0.85 = 34, an integer: the bound is p + 1/(n + 1) = 0.875
    const trials = 20_000;
    let covered = 0;
    for (let t = 0; t < trials; t++) {
      // skewed scores (exponential), as late shipments are
      const scores = Array.from({ length: n }, () => -Math.log(1 - rnd()));
      const cut = conformalQuantile(scores, 0.85);
      if (-Math.log(1 - rnd()) <= cut) covered++;
    }
    const rate = covered / trials;
    // exact expectation 34/40 = 0.85; 3 standard errors of a binomial mean ≈ 0.0076
    expect(rate).toBeGreaterThan(0.85 - 0.0076);
    expect(rate).toBeLessThan(0.875);
  });
});

describe('normalized score', () => {
  it('divides by the spread, and has no finite value without spread unless the outcome is the centre', () => {
    expect(normalizedScore(6, 4)).toBe(1.5);
    expect(normalizedScore(-2, 4)).toBe(-0.5);
    expect(normalizedScore(3, 0)).toBe(Infinity);
    expect(normalizedScore(-3, 0)).toBe(-Infinity);
    expect(normalizedScore(0, 0)).toBe(0);
  });
});
