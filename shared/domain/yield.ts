// First-pass yield, final yield and rolled throughput yield.
// FPY of a step = pieces that passed the first time (no rework) / pieces in.
// Final yield of a step = pieces good at the end (reworked ones included) / pieces in.
// RTY = product of the steps' FPY, multiplied as exact ratios so 950/1000 x 800/950 x 700/800
// gives exactly 0.70 (rounding each ratio first would drift).

export interface StepCounts {
  seq: number;
  name?: string;
  stationKind?: string;
  /** pieces that entered the step */
  inQty: number;
  /** pieces good at the end of the step, reworked ones included */
  goodQty: number;
  scrapQty: number;
  /** of the good pieces, how many needed rework to pass */
  reworkQty: number;
}

export interface StepYield {
  seq: number;
  name?: string;
  stationKind?: string;
  inQty: number;
  firstPassQty: number;
  goodQty: number;
  scrapQty: number;
  reworkQty: number;
  /** null when nothing entered the step */
  firstPassYield: number | null;
  finalYield: number | null;
}

/** An exact non-negative ratio kept as reduced big integers. */
export interface Ratio {
  num: bigint;
  den: bigint;
}

function gcd(a: bigint, b: bigint): bigint {
  while (b !== 0n) [a, b] = [b, a % b];
  return a < 0n ? -a : a;
}

export function ratio(num: number, den: number): Ratio {
  if (!Number.isInteger(num) || !Number.isInteger(den) || den <= 0 || num < 0) {
    throw new RangeError('a yield ratio needs whole non-negative counts and a positive denominator');
  }
  const n = BigInt(num);
  const d = BigInt(den);
  const g = gcd(n, d) || 1n;
  return { num: n / g, den: d / g };
}

export function multiplyRatios(rs: readonly Ratio[]): Ratio {
  let num = 1n;
  let den = 1n;
  for (const r of rs) {
    num *= r.num;
    den *= r.den;
  }
  // one reduction at the end: big-integer products are cheap, repeated gcds are not
  const g = gcd(num, den) || 1n;
  return { num: num / g, den: den / g };
}

/** Nearest double to an exact ratio (exact when both parts are safe integers). */
export function ratioToNumber(r: Ratio): number {
  const max = BigInt(Number.MAX_SAFE_INTEGER);
  if (r.num <= max && r.den <= max) return Number(r.num) / Number(r.den);
  const scale = 10n ** 18n;
  return Number((r.num * scale) / r.den) / 1e18;
}

export function checkCounts(c: StepCounts): void {
  for (const k of ['inQty', 'goodQty', 'scrapQty', 'reworkQty'] as const) {
    if (!Number.isInteger(c[k]) || c[k] < 0) throw new RangeError(`${k} must be a whole number >= 0`);
  }
  if (c.reworkQty > c.goodQty) throw new RangeError('reworked pieces are counted among the good ones');
  if (c.goodQty > c.inQty) throw new RangeError('a step cannot give more good pieces than went into it');
}

export function stepYield(c: StepCounts): StepYield {
  checkCounts(c);
  const firstPassQty = c.goodQty - c.reworkQty;
  return {
    seq: c.seq,
    name: c.name,
    stationKind: c.stationKind,
    inQty: c.inQty,
    firstPassQty,
    goodQty: c.goodQty,
    scrapQty: c.scrapQty,
    reworkQty: c.reworkQty,
    firstPassYield: c.inQty > 0 ? firstPassQty / c.inQty : null,
    finalYield: c.inQty > 0 ? c.goodQty / c.inQty : null,
  };
}

export interface RolledYield {
  steps: StepYield[];
  /** product of the steps' first-pass yields; null when no step had input */
  rty: number | null;
  rtyExact: Ratio | null;
  /** pieces good after the last step / pieces into the first step */
  finalYield: number | null;
}

/** Steps in routing order; steps that nothing entered yet are left out of the product. */
export function rolledThroughputYield(steps: readonly StepCounts[]): RolledYield {
  const ordered = [...steps].sort((a, b) => a.seq - b.seq);
  const ys = ordered.map(stepYield);
  const measured = ordered.filter((s) => s.inQty > 0);
  if (measured.length === 0) return { steps: ys, rty: null, rtyExact: null, finalYield: null };
  const exact = multiplyRatios(measured.map((s) => ratio(s.goodQty - s.reworkQty, s.inQty)));
  const first = measured[0];
  const last = measured[measured.length - 1];
  return { steps: ys, rty: ratioToNumber(exact), rtyExact: exact, finalYield: last.goodQty / first.inQty };
}

/** Adds counts of the same step from several trays (or orders). */
export function sumStepCounts(rows: readonly StepCounts[]): StepCounts[] {
  const bySeq = new Map<number, StepCounts>();
  for (const r of rows) {
    const cur = bySeq.get(r.seq);
    if (!cur) bySeq.set(r.seq, { ...r });
    else {
      cur.inQty += r.inQty;
      cur.goodQty += r.goodQty;
      cur.scrapQty += r.scrapQty;
      cur.reworkQty += r.reworkQty;
    }
  }
  return [...bySeq.values()].sort((a, b) => a.seq - b.seq);
}

export interface ParetoRow {
  reason: string;
  qty: number;
  share: number;
  cumulativeShare: number;
}

/** Scrap by reason, largest first, with each reason's share and the running share. */
export function pareto(rows: readonly { reason: string; qty: number }[]): ParetoRow[] {
  const byReason = new Map<string, number>();
  for (const r of rows) byReason.set(r.reason, (byReason.get(r.reason) ?? 0) + r.qty);
  const sorted = [...byReason.entries()].filter(([, q]) => q > 0).sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0]));
  const total = sorted.reduce((s, [, q]) => s + q, 0);
  let run = 0;
  return sorted.map(([reason, qty]) => {
    run += qty;
    return { reason, qty, share: qty / total, cumulativeShare: run / total };
  });
}
