// The backtest of projected ship dates. Each invented floor is cut at moments in its past; at
// each cut the floor is rebuilt from the scans up to that moment only (FloorReplay), the
// product's projection is made with the clock at the cut, and the dates are compared with when
// the order really shipped. Calibration is measured on these held-out outcomes, never on the
// data the projection was fitted to (Gneiting & Raftery 2007, "Strictly Proper Scoring Rules,
// Prediction, and Estimation", JASA 102(477): 359–378): an honest 85th percentile is passed by
// about 15 % of the orders.
import { FloorReplay, type FloorSnapshot } from '@shared/domain/floor-history';
import type { WorkingCalendar } from '@shared/domain/calendar';
import type { StationKind } from '@shared/domain/vocabulary';
import { makeDemoFloor, type DemoFloor } from './demo-floor';

const HOUR = 3_600_000;
const DAY = 86_400_000;

export interface CutStats {
  n: number;
  /** share of orders that shipped by their 85th-percentile date (0–1) */
  p85Coverage: number;
  /** mean of actual − expected, hours (positive: shipped later than expected) */
  biasHours: number;
  /** mean absolute error of the expected date, hours */
  maeHours: number;
}

export interface BacktestResult {
  floors: number;
  atRelease: CutStats;
  halfway: CutStats;
  snapshots: CutStats;
}

export type FloorProjector = (
  snapshot: FloorSnapshot,
  ctx: { calendar: WorkingCalendar; stations: readonly { id: string; kind: StationKind; capacityTrays: number }[] },
) => Map<string, { expectedAt: number | null; p85At: number | null }>;

export interface BacktestOptions {
  floors?: number;
  historyDays?: number;
  /** days at the start of each floor used only as history (no cuts) */
  warmupDays?: number;
  /** the end of every floor's history */
  end?: number;
  /** local hour of the daily snapshot (factory time) */
  snapshotHourUtc?: number;
  onFloor?: (i: number, floor: DemoFloor) => void;
  /**
   * the floors' seeds are `${seedPrefix}-${i + 1}` (default 'backtest-floor'): anything fitted
   * from data is fitted on floors of another prefix, so the scored floors stay out of sample
   */
  seedPrefix?: string;
  /** every scored cut, for a closer look (which cut, the clock, the projection and the outcome) */
  onSample?: (s: {
    cut: 'release' | 'halfway' | 'snapshot';
    floor: number;
    orderId: string;
    t: number;
    actual: number;
    expectedAt: number | null;
    p85At: number | null;
  }) => void;
}

/** A fixed end, so the same options always give the same floors (a Saturday would do as well). */
export const BACKTEST_END = Date.parse('2026-06-01T04:00:00Z');

interface Sample {
  actual: number;
  expectedAt: number | null;
  p85At: number | null;
}

function stats(samples: Sample[]): CutStats {
  const ok = samples.filter((s) => s.expectedAt != null);
  const n = ok.length;
  if (n === 0) return { n: 0, p85Coverage: 0, biasHours: 0, maeHours: 0 };
  let covered = 0;
  let bias = 0;
  let abs = 0;
  for (const s of ok) {
    const err = (s.actual - (s.expectedAt as number)) / HOUR;
    bias += err;
    abs += Math.abs(err);
    if (s.actual <= (s.p85At ?? (s.expectedAt as number))) covered++;
  }
  const r = (x: number, d = 3) => Math.round(x * 10 ** d) / 10 ** d;
  return { n, p85Coverage: r(covered / n, 4), biasHours: r(bias / n, 2), maeHours: r(abs / n, 2) };
}

export function runBacktest(project: FloorProjector, o: BacktestOptions = {}): BacktestResult {
  const floors = o.floors ?? 12;
  const historyDays = o.historyDays ?? 70;
  const warmup = (o.warmupDays ?? 14) * DAY;
  const end = o.end ?? BACKTEST_END;
  const at: Sample[] = [];
  const half: Sample[] = [];
  const snaps: Sample[] = [];
  for (let i = 0; i < floors; i++) {
    const floor = makeDemoFloor(`${o.seedPrefix ?? 'backtest-floor'}-${i + 1}`, end, historyDays);
    o.onFloor?.(i, floor);
    const judged = floor.shipped.filter((s) => s.releasedAt >= floor.start + warmup);
    // every cut: [time, which list, order]
    const cuts: { t: number; list: Sample[]; orderId: string; actual: number }[] = [];
    for (const s of judged) {
      cuts.push({ t: s.releasedAt + 60_000, list: at, orderId: s.orderId, actual: s.shippedAt });
      cuts.push({ t: Math.round(s.releasedAt + (s.shippedAt - s.releasedAt) / 2), list: half, orderId: s.orderId, actual: s.shippedAt });
    }
    const hour = o.snapshotHourUtc ?? 1; // 09:00 in the demo factory (UTC+8)
    const firstDay = Math.ceil((floor.start + warmup) / DAY) * DAY + hour * HOUR;
    for (let t = firstDay; t < end; t += DAY) {
      for (const s of judged) if (s.releasedAt < t && s.shippedAt > t) cuts.push({ t, list: snaps, orderId: s.orderId, actual: s.shippedAt });
    }
    cuts.sort((a, b) => a.t - b.t);
    const replay = new FloorReplay(floor.history);
    let k = 0;
    while (k < cuts.length) {
      const t = cuts[k].t;
      replay.advanceTo(t);
      const projected = project(replay.snapshot(), { calendar: floor.calendar, stations: floor.stations });
      for (; k < cuts.length && cuts[k].t === t; k++) {
        const c = cuts[k];
        const p = projected.get(c.orderId);
        c.list.push({ actual: c.actual, expectedAt: p?.expectedAt ?? null, p85At: p?.p85At ?? null });
        o.onSample?.({
          cut: c.list === at ? 'release' : c.list === half ? 'halfway' : 'snapshot',
          floor: i,
          orderId: c.orderId,
          t,
          actual: c.actual,
          expectedAt: p?.expectedAt ?? null,
          p85At: p?.p85At ?? null,
        });
      }
    }
  }
  return { floors, atRelease: stats(at), halfway: stats(half), snapshots: stats(snaps) };
}

export function formatTable(r: BacktestResult): string {
  const pct = (x: number) => `${(x * 100).toFixed(1)} %`;
  const h = (x: number) => `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(1)} h`;
  const rows = [
    ['release', r.atRelease],
    ['halfway to ship', r.halfway],
    ['daily snapshots', r.snapshots],
  ] as const;
  const lines = [
    `| as of | orders | shipped by the P85 date | mean abs. error of expected | bias of expected |`,
    `|---|---|---|---|---|`,
    ...rows.map(([name, s]) => `| ${name} | ${s.n.toLocaleString('en-GB')} | ${pct(s.p85Coverage)} | ${s.maeHours.toFixed(1)} h | ${h(s.biasHours)} |`),
  ];
  return lines.join('\n');
}
