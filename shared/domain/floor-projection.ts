// Projected ship dates of every open order: a finite-capacity Monte Carlo of the open floor.
//
// Each run plays the floor forward from `now`. Every open traveller walks its remaining
// steps; at each step it first waits a handover time drawn from history, then asks for a
// place at a station of the step's kind. A kind has as many places as its stations'
// `capacityTrays` together; when all are taken the traveller queues, and a freed place goes to
// the waiting traveller whose order is due first, then to the one that asked first. Work is
// laid on the working calendar of the kind (shifts, days off); an oven holds its place for the
// cure on its own calendar, through nights and weekends. Process times are the standard
// minutes times a ratio drawn from measured steps. Strikes and casts wait for the order's
// moulds. An order's trays are gathered before dispatch: the dispatch wait is drawn once per
// order, from the measured waits between an order's last packed tray and its dispatch of the
// orders packed nearest in time of day (collections come at set times), and then the trays go
// through the dispatch places like any step.
//
// A traveller already waiting at `now` draws its handover afresh and keeps only what is left
// after its wait so far (none when it has waited longer): the rest of its wait is then for a
// place, which the runs simulate, rather than a second handover from the tail. The floor's
// pace is drawn day by day within a run (a bootstrap of measured days), so a long projection
// averages over several days as the floor does.
//
// Queue theory behind the checks: Little (1961), L = λW, and Kingman (1961) for the mean wait
// of a single queue (M/M/1: Wq = ρ/(μ − λ)); the unit tests check the simulation against both.
// The handover times are the measured waits of travellers that found a free place on arrival,
// so that the wait for capacity is simulated, not counted twice. Expected date: the mean of
// the runs. The runs' own 85th percentile (type 7, Hyndman & Fan 1996) is too narrow (the
// model leaves out spread such as one crew working several kinds), so the 85 % date is the
// expected date plus a split-conformal factor times the runs' spread, in the factory's working
// time (`P85_WIDTH`, fitted on held-out seeded floors; Lei et al. 2018). Calibration is
// measured by the backtest (Gneiting & Raftery 2007).
//
// Each traveller draws from its own random stream (seeded by its id and the run), so the same
// floor gives the same dates, and adding an order changes others' dates only through capacity.
import type { Timeline, WorkingCalendar } from './calendar';
import { zoneOffsetMs } from './time-zone';
import { countAtMost, MULBERRY32_STEP, mulberry32Draw, quantileSorted, seedOf } from './stats';
import { normalizedScore } from './conformal';
import { ORDER_LEVEL_KINDS, type DispatchRecord, type FloorSnapshot, type MeasuredHistory, type ProcessRecord, type QueueRecord } from './floor-history';
import type { RoutingStep, TrayState } from './vocabulary';
import { OVEN_KINDS } from './traveller/station-kinds';
import { MOULD_USING_KINDS } from './routing';

const MINUTE = 60_000;
const DAY_MS = 86_400_000;
/** days with fewer measured handovers than this say little about the floor's pace */
const PACE_MIN_SAMPLES = 8;
/** fewer measured days than this: no day-to-day pace */
const PACE_MIN_DAYS = 10;
const MOULD_STEP_KINDS = new Set(['engrave', 'mould_check']);
/** a kind's crew limit is read from its measured steps only when at least this share of its steps were scanned out */
const MEASURED_SHARE = 0.8;

/**
 * The width of the 85 % date: it lies `factor` times the runs' own spread (working minutes of
 * the factory from the expected date to the runs' 85th percentile) after the expected date.
 * Split conformal calibration (Vovk et al. 2005; Lei, G'Sell, Rinaldo, Tibshirani & Wasserman
 * 2018, "Distribution-Free Predictive Inference for Regression", normalized scores): each
 * projection of the calibration floors scores (actual − expected) / spread in working time, and
 * the factor is the ⌈(n + 1)·0.85⌉-th smallest score, fitted apart (Mondrian, by group) for
 * orders released less than `justReleasedHours` ago and for orders under way.
 *
 * Fitted on 4 December 2026 with `npm run backtest -- --fit` on the seeded floors
 * `tune-floor-1` … `tune-floor-12` (release, halfway and daily cuts; never the scored
 * `backtest-floor-*` twelve), 50 runs a projection. Re-fit after any change to the model.
 */
export const P85_WIDTH = { justReleasedHours: 8, justReleased: 2.008, underWay: 1.137 } as const;
export type P85Width = { justReleasedHours: number; justReleased: number; underWay: number };

/**
 * The 85 % date from the expected date and the runs' own 85th percentile, widened by the
 * conformal factor in working time. Without spread (every run the same) it is the expected date.
 */
export function calibratedP85(factory: Timeline, expected: number, runsP85: number, factor: number): number {
  const spread = runsP85 > expected ? factory.workingMinutesBetween(expected, runsP85) : 0;
  if (!(spread > 0)) return Math.max(expected, runsP85);
  return Math.max(expected, factory.addWorkingMinutes(expected, factor * spread));
}

/** The conformal score of one outcome: signed working minutes past the expected date over the runs' spread. */
export function p85Score(factory: Timeline, expected: number, runsP85: number, actual: number): number {
  const spread = runsP85 > expected ? factory.workingMinutesBetween(expected, runsP85) : 0;
  return normalizedScore(factory.workingMinutesBetween(expected, actual), spread);
}

// ---- measured history ----------------------------------------------------------------------

/** Fewer samples above a wait than this: the rest of the wait comes from the tail estimate. */
export const TAIL_SAMPLES = 10;

/**
 * A measured waiting time (working minutes). `remaining(waited)` draws what is left of a wait
 * that has already lasted `waited`: from the measured waits longer than that when there are
 * enough of them, otherwise from an exponential tail whose mean is the mean excess of the
 * longest waits over the threshold below them (mean residual life of the top `TAIL_SAMPLES`;
 * a memoryless tail, the simplest peaks-over-threshold estimate — from memory, Balkema & de
 * Haan 1974 / Pickands 1975 for the general theory). A tray that has waited longer than every
 * sample is given that tail, never zero.
 */
export class WaitDistribution {
  readonly sorted: Float64Array;
  private readonly suffix: Float64Array;
  readonly tailMean: number;
  /** `tailMean`: the tail's mean when the samples are a neighbourhood of a larger set (default: from these samples) */
  constructor(samples: readonly number[], tailMean?: number) {
    this.sorted = Float64Array.from(samples.filter((x) => Number.isFinite(x) && x >= 0)).sort();
    const n = this.sorted.length;
    this.suffix = new Float64Array(n + 1);
    for (let i = n - 1; i >= 0; i--) this.suffix[i] = this.suffix[i + 1] + this.sorted[i];
    const k = Math.min(TAIL_SAMPLES, n);
    if (tailMean != null) this.tailMean = tailMean;
    else if (k === 0) this.tailMean = 0;
    else {
      const threshold = n > k ? this.sorted[n - k - 1] : 0;
      this.tailMean = Math.max(1, this.suffix[n - k] / k - threshold);
    }
  }
  get n() {
    return this.sorted.length;
  }
  /** the mean of what is left after `waited` */
  meanRemaining(waited: number): number {
    const n = this.sorted.length;
    if (n === 0) return 0;
    const i = waited > 0 ? countAtMost(this.sorted, waited) : 0;
    if (n - i >= TAIL_SAMPLES || (i === 0 && n > 0)) return this.suffix[i] / (n - i) - Math.max(0, waited);
    return this.tailMean;
  }
  /** a draw of what is left after `waited`; `u` uniform in [0, 1) */
  drawRemaining(waited: number, u: number): number {
    const n = this.sorted.length;
    if (n === 0) return 0;
    const i = waited > 0 ? countAtMost(this.sorted, waited) : 0;
    if (n - i >= TAIL_SAMPLES || i === 0) return this.sorted[i + Math.floor(u * (n - i))] - Math.max(0, waited);
    return -Math.log(1 - u) * this.tailMean;
  }
}

/** Neighbours (by time of day) a dispatch wait is drawn from: at least this many, or a tenth of the samples. */
export const DISPATCH_NEIGHBOURS = 5;
const BUCKET_MINUTES = 15;

const dayDistance = (a: number, b: number) => {
  const d = Math.abs(a - b) % 1440;
  return Math.min(d, 1440 - d);
};

/**
 * The order-level wait before dispatch, from the order's last packed tray to the dispatch
 * start (working minutes), conditioned on the local time of day the last tray was packed.
 * Couriers and carriers collect at set times of day, so an order packed at 10:00 and one packed
 * at 16:45 wait very differently; drawing either from all the waits put a random night (or
 * none) into every projection. The draw comes from the measured orders whose last tray was
 * packed nearest in time of day (the k nearest neighbours, k = max(5, n / 10): a nearest-
 * neighbour conditional distribution, from memory, e.g. Hastie, Tibshirani & Friedman, "The
 * Elements of Statistical Learning", ch. 2). An order already waiting `w` minutes is compared
 * only with measured orders that waited longer than `w` (then nearest in time of day), so an
 * order packed after the day's collection waits for the next one. A floor with no set
 * collection times has alike neighbourhoods everywhere, and the draw is the plain measured one.
 */
export class DispatchWait {
  /** per 15-minute bucket of the local day: the neighbours' waits (for orders not yet waiting) */
  private readonly buckets: WaitDistribution[];
  private readonly samples: { minuteOfDay: number; wait: number }[];
  private readonly k: number;
  private readonly tailMean: number;
  readonly n: number;
  constructor(samples: readonly { minuteOfDay: number; wait: number }[]) {
    const ok = samples.filter((x) => Number.isFinite(x.wait) && x.wait >= 0 && Number.isFinite(x.minuteOfDay));
    this.samples = ok;
    this.n = ok.length;
    this.k = Math.min(ok.length, Math.max(DISPATCH_NEIGHBOURS, Math.ceil(ok.length / 10)));
    const all = new WaitDistribution(ok.map((x) => x.wait));
    this.tailMean = all.tailMean;
    this.buckets = [];
    for (let b = 0; b < 1440 / BUCKET_MINUTES; b++) this.buckets.push(this.near(b * BUCKET_MINUTES + BUCKET_MINUTES / 2, 0));
  }
  private near(minuteOfDay: number, waited: number): WaitDistribution {
    const longer = this.samples.filter((x) => x.wait > waited);
    if (longer.length === 0) return new WaitDistribution([], this.tailMean);
    const near = longer.sort((x, y) => dayDistance(x.minuteOfDay, minuteOfDay) - dayDistance(y.minuteOfDay, minuteOfDay)).slice(0, this.k);
    return new WaitDistribution(
      near.map((x) => x.wait - waited),
      this.tailMean,
    );
  }
  /** a draw of what is left of the wait of an order whose last tray was packed at local `minuteOfDay` and has waited `waited` */
  drawRemaining(minuteOfDay: number, waited: number, u: number): number {
    if (this.n === 0) return 0;
    if (waited > 0) {
      const d = this.near(minuteOfDay, waited);
      return d.n ? d.drawRemaining(0, u) : -Math.log(1 - u) * this.tailMean;
    }
    const b = Math.min(this.buckets.length - 1, Math.max(0, Math.floor(minuteOfDay / BUCKET_MINUTES)));
    return this.buckets[b].drawRemaining(0, u);
  }
}

export interface FloorModel {
  /** handover waits per kind: measured waits of travellers that found a free place on arrival */
  handover: Map<string, WaitDistribution>;
  /** every measured wait per kind (the model without capacity uses these) */
  queue: Map<string, WaitDistribution>;
  /** the order-level wait before dispatch: last packed tray → dispatch start, by the time of day it was packed */
  dispatch: DispatchWait;
  /** the factory's time zone (for the time of day) */
  timeZone: string;
  /** measured process time ÷ standard time, per kind (sorted) */
  ratio: Map<string, Float64Array>;
  /** chance that a tray is put on hold while it waits for a step, and how long holds last */
  holdRate: number;
  hold: WaitDistribution;
  /** places per kind (sum of stations' capacityTrays) */
  places: Map<string, number>;
  /**
   * The floor's pace, day by day: each measured day's mean handover wait over the mean of all
   * days (mean 1). A run draws one day's pace for all its handovers, so slow days slow every
   * order together (a bootstrap of whole days, not of single waits).
   */
  pace: Float64Array;
  /** measured samples, for the explanation */
  counts: { queues: number; processes: number; dispatches: number };
}

export interface MeasureOptions {
  /** most recent samples kept per kind (default 400) */
  perKind?: number;
  /** fewer samples than this for a kind: pooled samples of its traveller kind (default 5) */
  minSamples?: number;
}

export interface StationPlaces {
  id?: string;
  kind: string;
  capacityTrays: number;
  active?: boolean;
}

/** local minutes after midnight in the zone */
export function minuteOfDay(timeZone: string, t: number): number {
  const local = t + zoneOffsetMs(timeZone, t);
  return (((local % DAY_MS) + DAY_MS) % DAY_MS) / MINUTE;
}

function latest<T>(rows: readonly T[], at: (r: T) => number, n: number): T[] {
  return [...rows].sort((a, b) => at(b) - at(a)).slice(0, n);
}

/** Builds the model's distributions from what the floor measured. */
export function measureFloor(measured: MeasuredHistory, calendar: WorkingCalendar, stations: readonly StationPlaces[], o: MeasureOptions = {}): FloorModel {
  const perKind = o.perKind ?? 400;
  const minSamples = o.minSamples ?? 5;
  const places = new Map<string, number>();
  for (const s of stations) if (s.active !== false) places.set(s.kind, (places.get(s.kind) ?? 0) + Math.max(1, s.capacityTrays));

  // occupancy per kind at a moment, from measured steps: starts ≤ t minus finishes ≤ t
  const busyStarts = new Map<string, number[]>();
  const busyEnds = new Map<string, number[]>();
  for (const p of measured.processes) {
    (busyStarts.get(p.stationKind) ?? busyStarts.set(p.stationKind, []).get(p.stationKind)!).push(p.startedAt);
    (busyEnds.get(p.stationKind) ?? busyEnds.set(p.stationKind, []).get(p.stationKind)!).push(p.finishedAt);
  }
  const starts = new Map([...busyStarts].map(([k, v]) => [k, Float64Array.from(v).sort()]));
  const ends = new Map([...busyEnds].map(([k, v]) => [k, Float64Array.from(v).sort()]));
  const busyAt = (kind: string, t: number) => countAtMost(starts.get(kind) ?? new Float64Array(), t) - countAtMost(ends.get(kind) ?? new Float64Array(), t);

  // the places a kind really works at once: its stations' capacity, or fewer when the crew
  // limits it (the most steps of that kind measured under way at one moment). Only where most
  // of the kind's steps were measured from start to finish: a step closed without its own
  // finish scan (an oven emptied straight into the next step) says nothing about when its place
  // came free, so counting only the scanned-out ones made a 12-tray oven look like 4 places
  const startsOf = new Map<string, number>();
  for (const q of measured.queues) startsOf.set(q.stationKind, (startsOf.get(q.stationKind) ?? 0) + 1);
  for (const [kind, st] of starts) {
    let peak = 0;
    for (let i = 0; i < st.length; i++) peak = Math.max(peak, busyAt(kind, st[i]));
    const cap = places.get(kind);
    const measuredShare = st.length / Math.max(st.length, startsOf.get(kind) ?? 0);
    if (cap != null && peak > 0 && st.length >= minSamples && measuredShare >= MEASURED_SHARE) places.set(kind, Math.min(cap, peak));
  }

  const own = (q: QueueRecord) => (MOULD_STEP_KINDS.has(q.stationKind) ? q.travellerKind === 'mould' : q.travellerKind === 'tray');
  const byKind = new Map<string, QueueRecord[]>();
  for (const q of measured.queues) {
    if (!own(q) || ORDER_LEVEL_KINDS.includes(q.stationKind)) continue;
    (byKind.get(q.stationKind) ?? byKind.set(q.stationKind, []).get(q.stationKind)!).push(q);
  }
  const wm = (q: { stationKind: string; stationId: string | null; readyAt: number; startedAt: number }) =>
    Math.max(0, calendar.forStation(q.stationId, q.stationKind).workingMinutesBetween(q.readyAt, q.startedAt));
  const queue = new Map<string, WaitDistribution>();
  const handover = new Map<string, WaitDistribution>();
  const pooled: Record<'tray' | 'mould', { all: number[]; free: number[] }> = { tray: { all: [], free: [] }, mould: { all: [], free: [] } };
  const raw = new Map<string, { all: number[]; free: number[] }>();
  for (const [kind, rows] of byKind) {
    const recent = latest(rows, (r) => r.startedAt, perKind);
    const all: number[] = [];
    const free: number[] = [];
    const cap = places.get(kind) ?? Infinity;
    for (const r of recent) {
      const w = wm(r);
      all.push(w);
      if (r.lead ?? busyAt(kind, r.readyAt) < cap) free.push(w);
    }
    raw.set(kind, { all, free });
    const pool = pooled[MOULD_STEP_KINDS.has(kind) ? 'mould' : 'tray'];
    pool.all.push(...all);
    pool.free.push(...free);
  }
  const kinds = new Set([...places.keys(), ...raw.keys()]);
  for (const kind of kinds) {
    if (ORDER_LEVEL_KINDS.includes(kind)) continue;
    const r = raw.get(kind);
    const pool = pooled[MOULD_STEP_KINDS.has(kind) ? 'mould' : 'tray'];
    queue.set(kind, new WaitDistribution(r && r.all.length >= minSamples ? r.all : pool.all));
    handover.set(kind, new WaitDistribution(r && r.free.length >= minSamples ? r.free : r && r.all.length >= minSamples ? r.all : pool.free));
  }
  const dispatchWaits = latest(measured.dispatches, (d: DispatchRecord) => d.startedAt, perKind).map((d) => ({
    minuteOfDay: minuteOfDay(calendar.timeZone, d.lastPackedAt),
    wait: Math.max(0, calendar.forStation(ORDER_LEVEL_KINDS[0]).workingMinutesBetween(d.lastPackedAt, d.startedAt)),
  }));

  const ratioRaw = new Map<string, number[]>();
  for (const p of latest(
    measured.processes.filter((x) => !x.cure && x.standardMinutes > 0),
    (x: ProcessRecord) => x.finishedAt,
    perKind * 20,
  )) {
    const list = ratioRaw.get(p.stationKind) ?? ratioRaw.set(p.stationKind, []).get(p.stationKind)!;
    if (list.length >= perKind) continue;
    const worked = calendar.forStation(p.stationId, p.stationKind).workingMinutesBetween(p.startedAt, p.finishedAt);
    if (worked >= 0) list.push(worked / p.standardMinutes);
  }
  const ratio = new Map<string, Float64Array>();
  for (const [k, v] of ratioRaw) if (v.length >= minSamples) ratio.set(k, Float64Array.from(v).sort());
  // day-to-day pace: each day's mean handover wait (trays, own kinds) over the mean of the days
  const byDay = new Map<number, { sum: number; n: number }>();
  for (const [kind, rows] of byKind) {
    if (MOULD_STEP_KINDS.has(kind)) continue;
    const cap = places.get(kind) ?? Infinity;
    for (const r of latest(rows, (x) => x.startedAt, perKind)) {
      if (!(r.lead ?? busyAt(kind, r.readyAt) < cap)) continue;
      const d = Math.floor(r.readyAt / DAY_MS);
      const e = byDay.get(d) ?? byDay.set(d, { sum: 0, n: 0 }).get(d)!;
      e.sum += wm(r);
      e.n++;
    }
  }
  const dayMeans = [...byDay.values()].filter((e) => e.n >= PACE_MIN_SAMPLES).map((e) => e.sum / e.n);
  const meanOfDays = dayMeans.reduce((a, b) => a + b, 0) / (dayMeans.length || 1);
  const pace = dayMeans.length >= PACE_MIN_DAYS && meanOfDays > 0 ? Float64Array.from(dayMeans.map((m) => m / meanOfDays)).sort() : new Float64Array();
  const trayWaits = measured.queues.filter((q) => q.travellerKind === 'tray').length;
  return {
    holdRate: trayWaits ? Math.min(1, measured.holds.length / trayWaits) : 0,
    hold: new WaitDistribution(measured.holds.map((h) => Math.max(0, calendar.factory.workingMinutesBetween(h.heldAt, h.releasedAt)))),
    handover,
    queue,
    dispatch: new DispatchWait(dispatchWaits),
    timeZone: calendar.timeZone,
    ratio,
    places,
    pace,
    counts: { queues: measured.queues.length, processes: measured.processes.length, dispatches: dispatchWaits.length },
  };
}

// ---- the simulation ------------------------------------------------------------------------

export interface ProjectFloorOptions {
  calendar: WorkingCalendar;
  model: FloorModel;
  /** runs of the floor (default 100) */
  runs?: number;
  seed?: number;
  /** false: every kind has unlimited places and the full measured waits are drawn */
  capacity?: boolean;
  /** how a freed place picks the next traveller (default earliest due date, then first to ask) */
  rule?: 'due_date' | 'first_come';
  /** false: every run at the floor's average pace (no day-to-day pace drawn) */
  pace?: boolean;
  /** the conformal width of the 85 % date (default `P85_WIDTH`); null: the runs' own 85th percentile */
  p85Width?: P85Width | null;
}

export interface OrderOutlook {
  orderId: string;
  expectedAt: number | null;
  p85At: number | null;
  runs: number;
  /** the station kind where the order's travellers spend the longest waiting, on average */
  drivingKind: string | null;
  /** mean minutes of waiting per run at that kind */
  drivingWaitMinutes: number;
  traysOpen: number;
  traysOnHold: number;
  /** the tray with the most standard work left: its steps and standard minutes */
  remainingSteps: number;
  standardMinutes: number;
}

interface Sim {
  order: number;
  kind: 'tray' | 'mould';
  /** the remaining steps in order */
  steps: RoutingStep[];
  qty: number;
  idx: number;
  /** working minutes already waited for the first step */
  waited: number;
  notBefore: number;
  /** in process at `now`: the step under way finishes at/after this */
  startedAt: number | null;
  seed: number;
  rnd: number;
  requestAt: number;
  /** waiting since (for a tray already gathered before dispatch: when it was packed) */
  since: number;
  /** on hold now: working minutes held so far (−1: not held) */
  heldFor: number;
  /** the order's release: a traveller of an order released later than now starts then */
  availableAt: number;
}

const ms = (x: string | null | undefined) => (x ? Date.parse(x) : null);

/**
 * The heap of pending events: time, then insertion order (deterministic). A four-ary heap on
 * typed arrays with a moving hole instead of swaps: a run of the bench floor pushes and pops
 * some 40,000 events, and a shallower heap pops them with fewer cache misses.
 */
class EventHeap {
  private t = new Float64Array(1024);
  private n = new Float64Array(1024);
  /** who × 2 + what */
  private p = new Int32Array(1024);
  private c = 0;
  size = 0;
  reset() {
    this.size = 0;
    this.c = 0;
  }
  private grow() {
    const cap = this.t.length * 2;
    const t = new Float64Array(cap);
    t.set(this.t);
    const n = new Float64Array(cap);
    n.set(this.n);
    const p = new Int32Array(cap);
    p.set(this.p);
    this.t = t;
    this.n = n;
    this.p = p;
  }
  push(time: number, who: number, what: number) {
    if (this.size === this.t.length) this.grow();
    const { t, n, p } = this;
    const seq = this.c++;
    let i = this.size++;
    while (i > 0) {
      const up = (i - 1) >> 2;
      if (t[up] < time || (t[up] === time && n[up] < seq)) break;
      t[i] = t[up];
      n[i] = n[up];
      p[i] = p[up];
      i = up;
    }
    t[i] = time;
    n[i] = seq;
    p[i] = who * 2 + what;
  }
  /** pops the top: its time in out[0], who in out[1], what in out[2] */
  pop(out: [number, number, number]) {
    const { t, n, p } = this;
    out[0] = t[0];
    out[1] = p[0] >> 1;
    out[2] = p[0] & 1;
    const size = --this.size;
    if (size === 0) return;
    const lt = t[size];
    const ln = n[size];
    const lp = p[size];
    let i = 0;
    for (;;) {
      const first = 4 * i + 1;
      if (first >= size) break;
      let m = first;
      const end = first + 4 < size ? first + 4 : size;
      for (let c = first + 1; c < end; c++) if (t[c] < t[m] || (t[c] === t[m] && n[c] < n[m])) m = c;
      if (lt < t[m] || (lt === t[m] && ln < n[m])) break;
      t[i] = t[m];
      n[i] = n[m];
      p[i] = p[m];
      i = m;
    }
    t[i] = lt;
    n[i] = ln;
    p[i] = lp;
  }
}

/**
 * Travellers waiting for a place at one kind: the best first (earliest due, then first to ask,
 * then the lower index). The keys are copied in when a traveller joins, so comparing is
 * reading three numbers.
 */
class WaitingLine {
  private a = new Float64Array(64);
  private b = new Float64Array(64);
  private w = new Int32Array(64);
  size = 0;
  reset() {
    this.size = 0;
  }
  private grow() {
    const cap = this.a.length * 2;
    const a = new Float64Array(cap);
    a.set(this.a);
    const b = new Float64Array(cap);
    b.set(this.b);
    const w = new Int32Array(cap);
    w.set(this.w);
    this.a = a;
    this.b = b;
    this.w = w;
  }
  push(due: number, askedAt: number, who: number) {
    if (this.size === this.a.length) this.grow();
    const { a, b, w } = this;
    let i = this.size++;
    while (i > 0) {
      const up = (i - 1) >> 1;
      if (a[up] < due || (a[up] === due && (b[up] < askedAt || (b[up] === askedAt && w[up] < who)))) break;
      a[i] = a[up];
      b[i] = b[up];
      w[i] = w[up];
      i = up;
    }
    a[i] = due;
    b[i] = askedAt;
    w[i] = who;
  }
  pop(): number {
    const { a, b, w } = this;
    const top = w[0];
    const size = --this.size;
    if (size === 0) return top;
    const la = a[size];
    const lb = b[size];
    const lw = w[size];
    let i = 0;
    for (;;) {
      let m = 2 * i + 1;
      if (m >= size) break;
      const r = m + 1;
      if (r < size && (a[r] < a[m] || (a[r] === a[m] && (b[r] < b[m] || (b[r] === b[m] && w[r] < w[m]))))) m = r;
      if (la < a[m] || (la === a[m] && (lb < b[m] || (lb === b[m] && lw < w[m])))) break;
      a[i] = a[m];
      b[i] = b[m];
      w[i] = w[m];
      i = m;
    }
    a[i] = la;
    b[i] = lb;
    w[i] = lw;
    return top;
  }
}

// event kinds
const REQUEST = 0;
const FINISH = 1;

/** the next draw of a traveller's own stream (the app's one generator, shared/domain/stats.ts) */
function nextU(s: Sim): number {
  return mulberry32Draw((s.rnd = (s.rnd + MULBERRY32_STEP) >>> 0));
}

/** a uniform in [0, 1) from three numbers (one mulberry32 round on their mix): the same inputs, the same draw */
function hashU(a: number, b: number, c: number): number {
  const t = (a ^ Math.imul(b + 1, 0x85ebca6b) ^ Math.imul(c + 1, 0xc2b2ae35)) >>> 0;
  return mulberry32Draw((t + MULBERRY32_STEP) >>> 0);
}

function stepsFrom(
  state: TrayState,
  routing: readonly RoutingStep[],
  now: number,
): { steps: RoutingStep[]; waitingSince: number | null; notBefore: number; startedAt: number | null } {
  let from = state.stepSeq ?? 1;
  let waitingSince = ms(state.waitingSince);
  let startedAt = state.phase === 'in_process' || state.phase === 'curing' ? ms(state.startedAt) : null;
  const cureReady = ms(state.cureReadyAt);
  let notBefore = -Infinity;
  if (state.phase === 'curing' && cureReady != null && cureReady <= now) {
    // a cure that has run out: waiting for the next step since it ended
    from += 1;
    waitingSince = cureReady;
    startedAt = null;
  } else if (state.phase === 'waiting' && cureReady != null) notBefore = cureReady;
  return { steps: routing.filter((s) => s.seq >= from), waitingSince, notBefore, startedAt };
}

/** Projects every open order of the snapshot. */
export function projectFloor(snapshot: FloorSnapshot, o: ProjectFloorOptions): Map<string, OrderOutlook> {
  const now = snapshot.now;
  const runs = Math.max(1, o.runs ?? 100);
  const seed = o.seed ?? 1;
  const capacity = o.capacity !== false;
  const usePace = capacity && o.pace !== false && o.model.pace.length > 0;
  const firstCome = o.rule === 'first_come';
  const { calendar, model } = o;
  const orders = snapshot.orders;
  const orderSeed = orders.map((x) => (seedOf(x.id) ^ seed) >>> 0);
  const dueOf = orders.map((x) => Date.parse(`${x.dueDate}T00:00:00Z`) || Infinity);
  const kindsIndex = new Map<string, number>();
  const kindNames: string[] = [];
  const kindIdx = (k: string) => {
    let i = kindsIndex.get(k);
    if (i == null) {
      i = kindNames.length;
      kindsIndex.set(k, i);
      kindNames.push(k);
    }
    return i;
  };

  // the travellers still on the floor
  const sims: Sim[] = [];
  const closedLatest = orders.map(() => -Infinity);
  const living = orders.map(() => 0);
  const mouldsOpen = orders.map(() => 0);
  const onHold = orders.map(() => 0);
  orders.forEach((ord, oi) => {
    for (const t of ord.travellers) {
      const st = t.state;
      if (st.phase === 'done' || st.phase === 'scrapped' || st.phase === 'merged') {
        if (st.phase === 'done' && t.kind === 'tray') closedLatest[oi] = Math.max(closedLatest[oi], ms(st.lastEventAt) ?? now);
        continue;
      }
      const routing = t.kind === 'mould' ? ord.routing.mould : ord.routing.tray;
      const f = stepsFrom(st, routing, now);
      if (f.steps.length === 0) continue;
      if (st.onHold) onHold[oi]++;
      const first = f.steps[0];
      const line = calendar.forStation(first.stationKind);
      const waited = f.startedAt == null && f.waitingSince != null ? Math.max(0, line.workingMinutesBetween(f.waitingSince, now)) : 0;
      for (const s of f.steps) kindIdx(s.stationKind);
      sims.push({
        order: oi,
        kind: t.kind,
        steps: f.steps,
        qty: t.kind === 'mould' ? 1 : st.quantity,
        idx: 0,
        waited,
        notBefore: f.notBefore,
        startedAt: f.startedAt,
        seed: seedOf(t.id) ^ seed,
        rnd: 0,
        requestAt: 0,
        since: f.waitingSince ?? now,
        heldFor: st.onHold ? Math.max(0, calendar.factory.workingMinutesBetween(ms(st.lastEventAt) ?? now, now)) : -1,
        availableAt: ord.releasedAt,
      });
      if (t.kind === 'tray') living[oi]++;
      else mouldsOpen[oi]++;
    }
  });
  const nK = kindNames.length;
  const lines: Timeline[] = kindNames.map((k) => calendar.forStation(k));
  const ovens: Timeline[] = kindNames.map((k) => calendar.forStation(...OVEN_KINDS, k));
  const placesOf = kindNames.map((k) => (capacity ? (model.places.get(k) ?? Infinity) : Infinity));
  const waitDist = kindNames.map((k) => (capacity ? model.handover.get(k) : model.queue.get(k)) ?? model.queue.get(k) ?? new WaitDistribution([]));
  const ratios = kindNames.map((k) => model.ratio.get(k) ?? null);
  const orderLevel = kindNames.map((k) => ORDER_LEVEL_KINDS.includes(k));
  const mouldGated = kindNames.map((k) => (MOULD_USING_KINDS as readonly string[]).includes(k));
  const kindOfStep = sims.map((s) => s.steps.map((st) => kindsIndex.get(st.stationKind)!));
  /** trays already under way at an order-level step (the rest of the order is not waited for by them) */
  const leaving = orders.map(() => 0);
  sims.forEach((s, si) => {
    if (s.kind === 'tray' && s.startedAt != null && orderLevel[kindOfStep[si][0]]) leaving[s.order]++;
  });

  const finishes = orders.map(() => new Float64Array(runs));
  const waitSum = orders.map(() => new Float64Array(nK));
  const heap = new EventHeap();
  const waiting = kindNames.map(() => new WaitingLine());
  const out: [number, number, number] = [0, 0, 0];

  for (let r = 0; r < runs; r++) {
    const busy = new Int32Array(nK);
    heap.reset();
    for (const line of waiting) line.reset();
    const gathered = orders.map(() => 0);
    const gatheredList: number[][] = orders.map(() => []);
    const lastPacked = orders.map(() => -Infinity);
    const mouldsLeft = [...mouldsOpen];
    const mouldsReadyAt = orders.map((_, oi) => (mouldsOpen[oi] === 0 ? now : Infinity));
    const parked: number[][] = orders.map(() => []);
    const ship = orders.map(() => -Infinity);
    // the run's pace: one measured day's, the same for every order (drawn from the run number only)
    // the run's pace, day by day: each day of the run draws one measured day's pace, the same for
    // every order (drawn from the run and the day only): a bootstrap of whole days
    const paceOf = (t: number) => (usePace ? model.pace[Math.floor(hashU(0x5eed ^ seed, r, Math.floor(t / DAY_MS)) * model.pace.length)] : 1);

    const start = (si: number, at: number) => {
      const s = sims[si];
      const k = kindOfStep[si][s.idx];
      const step = s.steps[s.idx];
      busy[k]++;
      waitSum[s.order][k] += Math.max(0, (at - s.requestAt) / MINUTE);
      const std = step.trayMinutes + step.pieceMinutes * s.qty;
      const rs = ratios[k];
      const minutes = rs ? std * rs[Math.floor(nextU(s) * rs.length)] : std;
      let end = lines[k].addWorkingMinutes(at, minutes);
      if (step.cureMinutes != null && step.cureMinutes > 0)
        end = Math.max(lines[k].addWorkingMinutes(at, std), ovens[k].addWorkingMinutes(at, step.cureMinutes));
      heap.push(end, si, FINISH);
    };
    const request = (si: number, at: number) => {
      const s = sims[si];
      const k = kindOfStep[si][s.idx];
      s.requestAt = at;
      if (busy[k] < placesOf[k]) start(si, at);
      else waiting[k].push(firstCome ? 0 : dueOf[s.order], at, si);
    };
    /** the traveller is ready for its step at `at`: draw its handover, then ask for a place */
    const ready = (si: number, at: number, waited: number) => {
      const s = sims[si];
      const k = kindOfStep[si][s.idx];
      const oi = s.order;
      if (orderLevel[k]) {
        // gathered with the rest of the order; the order leaves once, after its last packed tray
        lastPacked[oi] = Math.max(lastPacked[oi], at);
        gathered[oi]++;
        gatheredList[oi].push(si);
        if (gathered[oi] === living[oi] - leaving[oi]) {
          const from = lastPacked[oi];
          const line = lines[k];
          const already = from < now ? Math.max(0, line.workingMinutesBetween(from, now)) : 0;
          const q = model.dispatch.n
            ? model.dispatch.drawRemaining(minuteOfDay(model.timeZone, from), already, nextU(s))
            : waitDist[k].drawRemaining(already, nextU(s));
          waitSum[oi][k] += q;
          // the order's trays then go through the step together, each asking for a place (a big
          // order takes several rounds of the dispatch bench)
          const leaveAt = line.addWorkingMinutes(Math.max(from, now), q);
          for (const x of gatheredList[oi]) heap.push(leaveAt, x, REQUEST);
          gatheredList[oi] = [];
        }
        return;
      }
      // the handover is the order's: its trays reach a step together and share the draw. A
      // traveller already waiting keeps what is left of a fresh draw after its wait so far; when
      // it has waited longer, the rest of its wait is for a place (simulated), not more handover
      const q0 = capacity
        ? Math.max(0, waitDist[k].drawRemaining(0, hashU(orderSeed[oi], s.steps[s.idx].seq, r)) - waited)
        : waitDist[k].drawRemaining(waited, nextU(s));
      let q = q0 * paceOf(at);
      // a tray now and then waits on hold for a decision (measured rate and length)
      if (s.kind === 'tray') {
        if (s.idx === 0 && s.heldFor >= 0) q += model.hold.drawRemaining(s.heldFor, nextU(s));
        else if (model.holdRate > 0 && nextU(s) < model.holdRate) q += model.hold.drawRemaining(0, nextU(s));
      }
      let t = q > 0 ? lines[k].addWorkingMinutes(at, q) : at;
      if (s.idx === 0 && t < s.notBefore) t = s.notBefore;
      if (mouldGated[k] && s.kind === 'tray' && mouldsReadyAt[oi] > t) {
        if (mouldsReadyAt[oi] === Infinity) {
          parked[oi].push(si);
          return;
        }
        t = mouldsReadyAt[oi];
      }
      heap.push(t, si, REQUEST);
    };

    for (let si = 0; si < sims.length; si++) {
      const s = sims[si];
      s.idx = 0;
      s.rnd = (s.seed + Math.imul(r + 1, 0x9e3779b9)) >>> 0;
      if (s.startedAt != null) {
        // the step under way: the rest of its drawn time from now, holding its place
        const k = kindOfStep[si][0];
        const step = s.steps[0];
        busy[k]++;
        const std = step.trayMinutes + step.pieceMinutes * s.qty;
        const rs = ratios[k];
        const minutes = rs ? std * rs[Math.floor(nextU(s) * rs.length)] : std;
        const done = Math.max(0, lines[k].workingMinutesBetween(s.startedAt, now));
        let end = lines[k].addWorkingMinutes(now, Math.max(0, minutes - done));
        if (step.cureMinutes != null && step.cureMinutes > 0) end = Math.max(end, ovens[k].addWorkingMinutes(s.startedAt, step.cureMinutes));
        heap.push(Math.max(end, now), si, FINISH);
      } else ready(si, orderLevel[kindOfStep[si][0]] ? Math.min(s.since, now) : Math.max(now, s.availableAt), s.waited);
    }

    while (heap.size) {
      heap.pop(out);
      const [t, si, what] = out;
      const s = sims[si];
      if (what === REQUEST) {
        request(si, t);
        continue;
      }
      // FINISH: free the place, hand it on, move the traveller on
      const k = kindOfStep[si][s.idx];
      busy[k]--;
      const queue = waiting[k];
      if (queue.size) start(queue.pop()!, t);
      s.idx++;
      const oi = s.order;
      if (s.idx >= s.steps.length) {
        if (s.kind === 'mould') {
          mouldsLeft[oi]--;
          if (mouldsLeft[oi] === 0) {
            mouldsReadyAt[oi] = t;
            for (const p of parked[oi]) heap.push(t, p, REQUEST);
            parked[oi] = [];
          }
        } else ship[oi] = Math.max(ship[oi], t);
        continue;
      }
      ready(si, t, 0);
    }
    for (let oi = 0; oi < orders.length; oi++) finishes[oi][r] = Math.max(ship[oi], closedLatest[oi], now);
  }

  const mostWork = orders.map(() => ({ steps: 0, minutes: 0 }));
  for (const sm of sims) {
    if (sm.kind !== 'tray') continue;
    let minutes = 0;
    for (const st of sm.steps) minutes += st.trayMinutes + st.pieceMinutes * sm.qty;
    const m = mostWork[sm.order];
    if (minutes > m.minutes) {
      m.minutes = minutes;
      m.steps = sm.steps.length;
    }
  }
  const result = new Map<string, OrderOutlook>();
  const width = o.p85Width === undefined ? P85_WIDTH : o.p85Width;
  orders.forEach((ord, oi) => {
    const f = finishes[oi].sort();
    let sum = 0;
    for (let i = 0; i < runs; i++) sum += f[i];
    const open = living[oi] > 0;
    const expected = open ? Math.round(sum / runs) : Number.isFinite(closedLatest[oi]) ? closedLatest[oi] : null;
    const runsP85 = Math.round(quantileSorted(f, 0.85));
    const factor = width == null ? null : now - ord.releasedAt < width.justReleasedHours * 3_600_000 ? width.justReleased : width.underWay;
    const p85 = !open ? expected : factor == null || expected == null ? runsP85 : Math.round(calibratedP85(calendar.factory, expected, runsP85, factor));
    let drive = -1;
    for (let k = 0; k < nK; k++) if (drive < 0 || waitSum[oi][k] > waitSum[oi][drive]) drive = k;
    result.set(ord.id, {
      orderId: ord.id,
      expectedAt: expected,
      p85At: p85 == null || expected == null ? p85 : Math.max(p85, expected),
      runs,
      drivingKind: drive >= 0 && waitSum[oi][drive] > 0 ? kindNames[drive] : null,
      drivingWaitMinutes: drive >= 0 ? Math.round(waitSum[oi][drive] / runs) : 0,
      traysOpen: living[oi],
      traysOnHold: onHold[oi],
      remainingSteps: mostWork[oi].steps,
      standardMinutes: Math.round(mostWork[oi].minutes * 10) / 10,
    });
  });
  return result;
}
