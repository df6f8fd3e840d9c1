// Flow figures: flow efficiency, the cumulative flow diagram, throughput and WIP over time (the
// tests check WIP against Little's Law, L = lambda W). All instants are UTC epoch milliseconds.
//
// Flow efficiency counts only process time (start -> finish at a station) as value-adding.
// Oven cure is needed but unattended, so it is not counted as value-adding; its share of the
// flow time is reported beside it, so a reader can see both.

import { dateOfDayNumber, localDayNumber, utcOfLocal } from './time-zone';
import { countAtMost } from './stats';

export interface FlowEfficiencyInput {
  processMinutes: number;
  cureMinutes?: number;
  flowMinutes: number;
}

export interface FlowEfficiency {
  processMinutes: number;
  cureMinutes: number;
  flowMinutes: number;
  /** process / flow; null when flow time is 0 */
  flowEfficiency: number | null;
  /** cure / flow */
  cureShare: number | null;
  /** (process + cure) / flow, for a reader who counts cure as value-adding */
  withCure: number | null;
}

export function flowEfficiency({ processMinutes, cureMinutes = 0, flowMinutes }: FlowEfficiencyInput): FlowEfficiency {
  if (processMinutes < 0 || cureMinutes < 0 || flowMinutes < 0) throw new RangeError('times must be >= 0');
  const f = flowMinutes > 0 ? flowMinutes : null;
  return {
    processMinutes,
    cureMinutes,
    flowMinutes,
    flowEfficiency: f ? processMinutes / f : null,
    cureShare: f ? cureMinutes / f : null,
    withCure: f ? (processMinutes + cureMinutes) / f : null,
  };
}

// ---- buckets --------------------------------------------------------------------------

export type BucketSize = 'day' | 'week';

export interface Bucket {
  /** local date of the bucket's first day */
  label: string;
  start: number;
  end: number;
}

/** Local days (or Monday-based weeks) in the factory's zone covering [from, to). */
export function makeBuckets(timeZone: string, from: number, to: number, size: BucketSize): Bucket[] {
  if (to <= from) return [];
  let day = localDayNumber(timeZone, from);
  if (size === 'week') day -= (((day + 3) % 7) + 7) % 7; // back to Monday
  const step = size === 'week' ? 7 : 1;
  const out: Bucket[] = [];
  for (;;) {
    const start = utcOfLocal(timeZone, day, 0);
    if (start >= to) break;
    const end = utcOfLocal(timeZone, day + step, 0);
    out.push({ label: dateOfDayNumber(day), start, end });
    day += step;
    if (out.length > 20_000) throw new RangeError('too many buckets');
  }
  return out;
}

function lowerBound(sorted: Float64Array, x: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** How many of the instants fall in each bucket [start, end). */
export function countPerBucket(times: readonly number[], buckets: readonly Bucket[]): number[] {
  const sorted = Float64Array.from(times).sort();
  return buckets.map((b) => lowerBound(sorted, b.end) - lowerBound(sorted, b.start));
}

// ---- cumulative flow diagram ----------------------------------------------------------

/**
 * Cumulative flow from each item's first arrival per stage (Infinity or NaN where it has not
 * arrived): for every instant in `at` and every stage, how many items had reached that stage or a
 * later one by then. Counting "that stage or later" keeps each line non-decreasing and the lines
 * nested even when an item skips a stage, so the vertical gap between the lines of stages a < b
 * is the number of items between a and b (WIP) at that instant.
 */
export function cumulativeFlowOfItems(items: Iterable<ArrayLike<number>>, stageCount: number, at: readonly number[]): number[][] {
  const reached: number[][] = Array.from({ length: stageCount }, () => []);
  for (const row of items) {
    let earliest = Infinity;
    for (let s = stageCount - 1; s >= 0; s--) {
      const v = row[s];
      if (v < earliest) earliest = v; // NaN compares false: not arrived
      if (earliest < Infinity) reached[s].push(earliest);
    }
  }
  const sorted = reached.map((r) => Float64Array.from(r).sort());
  return at.map((t) => sorted.map((x) => countAtMost(x, t)));
}

// ---- WIP over time --------------------------------------------------------------------

export interface Interval {
  start: number;
  /** null while the item is still in the system */
  end: number | null;
}

export interface WipPoint {
  /** time-weighted average WIP over the bucket (up to `now` for the current bucket) */
  average: number;
  /** WIP at the bucket's end (or at `now`) */
  atEnd: number;
}

/** WIP per bucket from items' [start, end) stays; open stays run to `now`. */
export function wipOverTime(items: readonly Interval[], buckets: readonly Bucket[], now: number): WipPoint[] {
  const starts = Float64Array.from(items.map((i) => i.start)).sort();
  const ends = Float64Array.from(items.map((i) => i.end ?? Infinity)).sort();
  return buckets.map((b) => {
    const to = Math.min(b.end, now);
    if (to <= b.start) return { average: 0, atEnd: 0 };
    const atEnd = countAtMost(starts, to) - countAtMost(ends, to);
    return { average: averageWip(items, b.start, to, starts, ends), atEnd };
  });
}

/** Time-average number of items in the system over [from, to). */
export function averageWip(items: readonly Interval[], from: number, to: number, starts?: Float64Array, ends?: Float64Array): number {
  // integral of WIP = integral of (how many started by t) - (how many ended by t)
  const s = starts ?? Float64Array.from(items.map((i) => i.start)).sort();
  const e = ends ?? Float64Array.from(items.map((i) => i.end ?? Infinity)).sort();
  return (integralCount(s, from, to) - integralCount(e, from, to)) / (to - from);
}

/** integral over [from, to) of #{x in sorted : x <= t} dt */
function integralCount(sorted: Float64Array, from: number, to: number): number {
  const before = countAtMost(sorted, from);
  let total = before * (to - from);
  for (let i = before; i < sorted.length && sorted[i] < to; i++) total += to - sorted[i];
  return total;
}
