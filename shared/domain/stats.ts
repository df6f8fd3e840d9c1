// Sample statistics used by every report. Percentiles are Hyndman & Fan (1996) type 7:
// linear interpolation between order statistics, the default of R and NumPy.

export const PERCENTILE_METHOD = 'Hyndman & Fan type 7' as const;

export interface Summary {
  n: number;
  p50: number | null;
  p85: number | null;
  p95: number | null;
  mean: number | null;
}

/** The 0-based order statistics type 7 needs for p in a sample of n: floor(h) and the next one. */
export function orderStatisticsFor(n: number, p: number): [number, number] {
  if (n <= 0) throw new RangeError('quantile of an empty sample');
  if (!(p >= 0 && p <= 1)) throw new RangeError('p must be within [0, 1]');
  const lo = Math.floor((n - 1) * p);
  return [lo, Math.min(lo + 1, n - 1)];
}

/** Type 7 quantile of values already sorted ascending (reads only the two order statistics it needs). */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  const [lo, hi] = orderStatisticsFor(n, p);
  const h = (n - 1) * p;
  const a = sorted[lo];
  return a + (h - lo) * (sorted[hi] - a);
}

/** Type 7 quantile of an unsorted sample (the input is not modified). */
export function quantile(values: readonly number[], p: number): number {
  return quantileSorted(sortNumbers(values), p);
}

export function sortNumbers(values: readonly number[]): number[] {
  // typed-array sort is numeric (a plain Array sort would compare as strings)
  return Array.from(Float64Array.from(values).sort());
}

export function mean(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  let s = 0;
  for (const v of values) s += v;
  return s / values.length;
}

/** n, p50, p85, p95 and mean; percentiles and mean are null when n = 0. */
export function summarize(values: ArrayLike<number>): Summary {
  // one typed copy, sorted in place: a year of step times is half a million values
  let n = 0;
  for (let i = 0; i < values.length; i++) if (Number.isFinite(values[i])) n++;
  if (n === 0) return { n: 0, p50: null, p85: null, p95: null, mean: null };
  const sorted = new Float64Array(n);
  let k = 0;
  let sum = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (Number.isFinite(v)) {
      sorted[k++] = v;
      sum += v;
    }
  }
  sorted.sort();
  return {
    n,
    p50: quantileSorted(sorted, 0.5),
    p85: quantileSorted(sorted, 0.85),
    p95: quantileSorted(sorted, 0.95),
    mean: sum / n,
  };
}

/** Rounds every number of a summary for display or the wire (null stays null). */
export function roundSummary(s: Summary, digits = 2): Summary {
  const f = 10 ** digits;
  const r = (v: number | null) => (v === null ? null : Math.round(v * f) / f);
  return { n: s.n, p50: r(s.p50), p85: r(s.p85), p95: r(s.p95), mean: r(s.mean) };
}

/** The state step of mulberry32 (a public-domain 32-bit generator). */
export const MULBERRY32_STEP = 0x6d2b79f5;

/** mulberry32's output for a state already advanced by MULBERRY32_STEP: a uniform in [0, 1). */
export function mulberry32Draw(state: number): number {
  let t = state;
  t = Math.imul(t ^ (t >>> 15), t | 1);
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
}

/**
 * The one seeded pseudo-random generator of the app and its tests (mulberry32): same seed, same
 * sequence, in [0, 1). Not for secrets.
 */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => mulberry32Draw((a = (a + MULBERRY32_STEP) >>> 0));
}

/** A 32-bit seed from a string (FNV-1a), so an order's projection is stable between requests. */
export function seedOf(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

/** How many values of an ascending array are ≤ x (the index of the first value above x). */
export function countAtMost(sorted: ArrayLike<number>, x: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
