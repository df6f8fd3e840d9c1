import { describe, expect, it } from 'vitest';
import { quantileSorted as ssQuantileSorted, quantile as ssQuantile, mean as ssMean } from 'simple-statistics';
import { orderStatisticsFor, quantile, quantileSorted, seededRandom, summarize, roundSummary } from './stats';

// Worked example: Hyndman, R. J. & Fan, Y. (1996), "Sample Quantiles in Statistical Packages",
// The American Statistician 50(4): 361-365, type 7.
const X = [2, 4, 4, 5, 7, 9, 10, 12, 15, 30];

describe('type 7 quantile (Hyndman & Fan 1996)', () => {
  it('gives p50 = 8, p90 = 16.5, p95 = 23.25 on the worked example', () => {
    expect(quantile(X, 0.5)).toBeCloseTo(8, 12);
    expect(quantile(X, 0.9)).toBeCloseTo(16.5, 12);
    expect(quantile(X, 0.95)).toBeCloseTo(23.25, 12);
  });

  it('returns the minimum at p = 0 and the maximum at p = 1, and ignores input order', () => {
    const shuffled = [30, 2, 12, 4, 15, 9, 4, 10, 7, 5];
    expect(quantile(shuffled, 0)).toBe(2);
    expect(quantile(shuffled, 1)).toBe(30);
    expect(quantile(shuffled, 0.95)).toBeCloseTo(23.25, 12);
    expect(shuffled[0]).toBe(30); // not sorted in place
  });

  it('sorts numerically, not as strings', () => {
    expect(quantile([100, 9, 20], 0.5)).toBe(20);
  });

  it('refuses an empty sample and p outside [0, 1]', () => {
    expect(() => quantile([], 0.5)).toThrow(RangeError);
    expect(() => quantile([1, 2], 1.2)).toThrow(RangeError);
    expect(() => quantile([1, 2], Number.NaN)).toThrow(RangeError);
  });

  // simple-statistics 7.12 `quantileSorted` implements the same linear interpolation of order
  // statistics (its source names it type 7, NumPy's "linear" method).
  it('agrees with simple-statistics quantileSorted (linear interpolation, type 7) on random samples', () => {
    const rnd = seededRandom(42);
    for (let trial = 0; trial < 200; trial++) {
      const n = 1 + Math.floor(rnd() * 60);
      const xs = Array.from({ length: n }, () => Math.round(rnd() * 1000) / 10);
      const sorted = [...xs].sort((a, b) => a - b);
      for (const p of [0, 0.05, 0.25, 0.5, 0.85, 0.9, 0.95, 0.99, 1, rnd()]) {
        expect(quantileSorted(sorted, p)).toBeCloseTo(ssQuantileSorted(sorted, p), 9);
        expect(quantile(xs, p)).toBeCloseTo(ssQuantile(xs, p) as number, 9);
      }
    }
  });

  it('agrees with simple-statistics on the worked example too', () => {
    expect(ssQuantile(X, 0.95)).toBeCloseTo(23.25, 12);
    expect(ssQuantile(X, 0.9)).toBeCloseTo(16.5, 12);
  });
});

describe('type 7 from two order statistics', () => {
  it('names the order statistics of the worked example: p95 uses the 9th and 10th smallest', () => {
    // h = (10 - 1) x 0.95 = 8.55 -> 0-based 8 and 9 (Hyndman & Fan 1996, type 7)
    expect(orderStatisticsFor(10, 0.95)).toEqual([8, 9]);
    expect(orderStatisticsFor(10, 1)).toEqual([9, 9]);
    expect(orderStatisticsFor(1, 0.5)).toEqual([0, 0]);
  });

  it('gives the value of the worked example from the two order statistics', () => {
    const sorted = [...X].sort((a, b) => a - b);
    expect(quantileSorted(sorted, 0.95)).toBeCloseTo(23.25, 12);
  });
});

describe('summarize', () => {
  it('returns n, p50, p85, p95 and mean of the worked example', () => {
    const s = summarize(X);
    expect(s.n).toBe(10);
    expect(s.p50).toBeCloseTo(8, 12);
    // type 7 at 0.85: h = 9 * 0.85 = 7.65 -> 12 + 0.65 * (15 - 12) = 13.95 (computed from the definition)
    expect(s.p85).toBeCloseTo(13.95, 12);
    expect(s.p95).toBeCloseTo(23.25, 12);
    expect(s.mean).toBeCloseTo(ssMean(X), 12);
    expect(s.mean).toBeCloseTo(9.8, 12);
  });

  it('returns n = 0 and nulls for an empty sample, and skips non-finite values', () => {
    expect(summarize([])).toEqual({ n: 0, p50: null, p85: null, p95: null, mean: null });
    expect(summarize([Number.NaN, 4, Number.POSITIVE_INFINITY]).n).toBe(1);
  });

  it('rounds for display', () => {
    expect(roundSummary({ n: 3, p50: 1.23456, p85: null, p95: 2, mean: 1 / 3 }, 2)).toEqual({
      n: 3,
      p50: 1.23,
      p85: null,
      p95: 2,
      mean: 0.33,
    });
  });
});
