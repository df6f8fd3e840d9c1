// Projected finish of trays and orders.
//
// Each remaining step costs a queue time, then its standard minutes, both laid on the working
// calendar of the step's station kind; a cure step also holds the tray for its minimum cure
// time on the oven's own (usually continuous) calendar. Queue times come from history: the
// measured queue times (working minutes) per station kind. A tray already waiting only gets
// the rest of a queue time longer than what it has waited so far.
//
// Expected date: every queue at its (conditional) mean. 85th-percentile date: the 85th
// percentile (type 7) of many sampled runs, each drawing queue times from the measured
// samples (bootstrap); an order finishes when its last tray does. Trays are treated as
// independent and station capacity is not modelled beyond what the measured queues show.
// The 85th-percentile date is never reported earlier than the expected one.

import type { Timeline, WorkingCalendar } from './calendar';
import { OVEN_KINDS } from './traveller/station-kinds';
import { MINUTE } from './calendar';
import { countAtMost, quantileSorted, seededRandom } from './stats';

export interface ProjectedStep {
  seq: number;
  stationKind: string;
  /** standard minutes for this tray's quantity */
  standardMinutes: number;
  cureMinutes?: number | null;
}

export interface TrayOutlook {
  trayId: string;
  phase: 'waiting' | 'in_process' | 'curing' | 'done' | 'scrapped' | 'merged';
  /** steps still to do in routing order, the current one first */
  steps: readonly ProjectedStep[];
  /** start of the current step (in_process, curing) */
  startedAt?: number | null;
  /** start of the current wait (waiting) */
  waitingSince?: number | null;
  /** earliest start of the next step after a cure */
  cureReadyAt?: number | null;
  /** when a finished tray finished its last step */
  finishedAt?: number | null;
  onHold?: boolean;
}

/** Measured queue times in working minutes per station kind. */
export type QueueSamples = Readonly<Record<string, readonly number[]>>;

export interface ProjectionOptions {
  now: number;
  calendar: WorkingCalendar;
  queueSamples: QueueSamples;
  /** sampled runs for the percentile (default 200) */
  runs?: number;
  seed?: number;
  /** fewer samples than this for a kind: use all kinds' samples pooled (default 5) */
  minSamples?: number;
  /** queue minutes when there is no history at all (default 60) */
  defaultQueueMinutes?: number;
  /** a model built once from `queueSamples` (saves sorting them again for every order) */
  queueTimes?: QueueTimes;
}

export interface Projection {
  expectedAt: number | null;
  p85At: number | null;
  /** what the slowest tray's expected path is made of (minutes) */
  remainingSteps: number;
  standardMinutes: number;
  queueMinutes: number;
  cureMinutes: number;
  runs: number;
  /** the tray whose expected finish is last */
  criticalTrayId: string | null;
  traysOnHold: number;
}

interface QueueModel {
  sorted: Float64Array;
  /** suffix sums for conditional means */
  suffix: Float64Array;
}

function model(samples: readonly number[]): QueueModel {
  const sorted = Float64Array.from(samples.filter((x) => Number.isFinite(x) && x >= 0)).sort();
  const suffix = new Float64Array(sorted.length + 1);
  for (let i = sorted.length - 1; i >= 0; i--) suffix[i] = suffix[i + 1] + sorted[i];
  return { sorted, suffix };
}

/** The measured queue times, sorted per kind: build once, use for many projections. */
export class QueueTimes {
  private readonly byKind = new Map<string, QueueModel>();
  private readonly pooled: QueueModel;
  constructor(
    samples: QueueSamples,
    private readonly minSamples: number,
    private readonly fallback: number,
  ) {
    const all: number[] = [];
    for (const [k, xs] of Object.entries(samples)) {
      this.byKind.set(k, model(xs));
      for (const x of xs) all.push(x);
    }
    this.pooled = model(all);
  }
  private pick(kind: string): QueueModel | null {
    const m = this.byKind.get(kind);
    if (m && m.sorted.length >= this.minSamples) return m;
    return this.pooled.sorted.length ? this.pooled : null;
  }
  /** mean of the queue time left after `waited` minutes */
  meanRemaining(kind: string, waited: number): number {
    const m = this.pick(kind);
    if (!m) return Math.max(0, this.fallback - waited);
    // a tray still waiting after `waited` minutes has a queue longer than that
    const i = waited > 0 ? countAtMost(m.sorted, waited) : 0;
    const n = m.sorted.length - i;
    return n === 0 ? 0 : m.suffix[i] / n - waited;
  }
  sampleRemaining(kind: string, waited: number, rnd: () => number): number {
    const m = this.pick(kind);
    if (!m) return Math.max(0, this.fallback - waited);
    const i = waited > 0 ? countAtMost(m.sorted, waited) : 0;
    const n = m.sorted.length - i;
    if (n === 0) return 0;
    return m.sorted[i + Math.floor(rnd() * n)] - waited;
  }
}

interface PathCost {
  finish: number;
  standard: number;
  queue: number;
  cure: number;
  steps: number;
}

/** How a walk picks each queue time: the conditional mean, or a draw from the measured ones. */
interface QueuePick {
  queues: QueueTimes;
  rnd: (() => number) | null;
}

function queueOf(pick: QueuePick, kind: string, waited: number): number {
  return pick.rnd ? pick.queues.sampleRemaining(kind, waited, pick.rnd) : pick.queues.meanRemaining(kind, waited);
}

function walkTray(tray: TrayOutlook, o: ProjectionOptions, pick: QueuePick): PathCost {
  const cal = o.calendar;
  const cost: PathCost = { finish: o.now, standard: 0, queue: 0, cure: 0, steps: 0 };
  if (tray.phase === 'done' || tray.phase === 'scrapped' || tray.phase === 'merged' || tray.steps.length === 0) {
    cost.finish = tray.finishedAt ?? o.now;
    return cost;
  }
  // Working minutes on one timeline add up (adding a then b is adding a + b), so consecutive
  // steps on the same calendar are summed and laid on it once: the sampled runs stay cheap.
  // (Plain loops, no closures: this runs a few hundred thousand times for the order list.)
  let t = o.now;
  let pending = 0;
  let pendingLine: Timeline | null = null;
  const readyAt = tray.cureReadyAt ?? -Infinity;
  const steps = tray.steps;
  for (let i = 0; i < steps.length; i++) {
    const step = steps[i];
    const line = cal.forStation(step.stationKind);
    const curing = step.cureMinutes != null && step.cureMinutes > 0;
    const oven = curing ? cal.forStation(...OVEN_KINDS, step.stationKind) : line;
    cost.steps++;
    if (i === 0 && (tray.phase === 'in_process' || tray.phase === 'curing') && tray.startedAt != null) {
      // the step under way: what is left of its standard time, from now
      const start = tray.startedAt;
      const left = Math.max(0, step.standardMinutes - Math.max(0, line.workingMinutesBetween(start, o.now)));
      cost.standard += left;
      let end = line.addWorkingMinutes(o.now, left);
      if (curing) {
        const cureEnd = oven.addWorkingMinutes(start, step.cureMinutes as number);
        cost.cure += Math.max(0, (cureEnd - Math.max(start, o.now)) / MINUTE);
        if (cureEnd > end) end = cureEnd;
      }
      t = Math.max(end, o.now);
      continue;
    }
    const waited = i === 0 && tray.waitingSince != null ? Math.max(0, line.workingMinutesBetween(tray.waitingSince, t)) : 0;
    const q = queueOf(pick, step.stationKind, waited);
    cost.queue += q;
    cost.standard += step.standardMinutes;
    if (pendingLine !== line) {
      if (pendingLine && pending > 0) t = pendingLine.addWorkingMinutes(t, pending);
      pending = 0;
    }
    pendingLine = line;
    pending += q;
    if ((i === 0 && readyAt > -Infinity) || curing) {
      if (pending > 0) t = line.addWorkingMinutes(t, pending);
      pending = 0;
      // may not start before a cure (or a mould) is ready
      if (i === 0 && t < readyAt) t = readyAt;
    }
    if (curing) {
      const start = t;
      const cureEnd = oven.addWorkingMinutes(start, step.cureMinutes as number);
      cost.cure += step.cureMinutes as number;
      // the next step may not start before the cure has run out
      t = Math.max(line.addWorkingMinutes(start, step.standardMinutes), cureEnd, o.now);
      pendingLine = null;
      continue;
    }
    pending += step.standardMinutes;
  }
  if (pendingLine && pending > 0) t = (pendingLine as Timeline).addWorkingMinutes(t, pending);
  cost.finish = Math.max(t, o.now);
  return cost;
}

export function queueTimesOf(o: Pick<ProjectionOptions, 'queueSamples' | 'minSamples' | 'defaultQueueMinutes'>): QueueTimes {
  return new QueueTimes(o.queueSamples, o.minSamples ?? 5, o.defaultQueueMinutes ?? 60);
}

export function projectTrays(trays: readonly TrayOutlook[], o: ProjectionOptions): Projection {
  const runs = o.runs ?? 200;
  const queues = o.queueTimes ?? queueTimesOf(o);
  const result: Projection = {
    expectedAt: null,
    p85At: null,
    remainingSteps: 0,
    standardMinutes: 0,
    queueMinutes: 0,
    cureMinutes: 0,
    runs,
    criticalTrayId: null,
    traysOnHold: trays.filter((t) => t.onHold).length,
  };
  if (trays.length === 0) return result;

  let critical: PathCost | null = null;
  for (const tray of trays) {
    const c = walkTray(tray, o, { queues, rnd: null });
    if (!critical || c.finish > critical.finish) {
      critical = c;
      result.criticalTrayId = tray.trayId;
    }
  }
  const crit = critical as PathCost;
  result.expectedAt = crit.finish;
  result.remainingSteps = crit.steps;
  result.standardMinutes = crit.standard;
  result.queueMinutes = crit.queue;
  result.cureMinutes = crit.cure;

  const open = trays.filter((t) => !(t.phase === 'done' || t.phase === 'scrapped' || t.phase === 'merged') && t.steps.length > 0);
  if (open.length === 0 || runs <= 0) {
    result.p85At = result.expectedAt;
    return result;
  }
  const closedLatest = Math.max(-Infinity, ...trays.filter((t) => !open.includes(t)).map((t) => t.finishedAt ?? -Infinity));
  const sampled: QueuePick = { queues, rnd: seededRandom(o.seed ?? 1) };
  const finishes = new Float64Array(runs);
  for (let r = 0; r < runs; r++) {
    let latest = closedLatest;
    for (let i = 0; i < open.length; i++) {
      const c = walkTray(open[i], o, sampled);
      if (c.finish > latest) latest = c.finish;
    }
    finishes[r] = latest;
  }
  finishes.sort();
  const p85 = Math.round(quantileSorted(finishes, 0.85));
  result.p85At = Math.max(p85, result.expectedAt);
  return result;
}
