// What an order's make actually took, step by step, read from its step runs (the facts derived
// from the scans): the working minutes between each start and finish scan, the pieces scrapped,
// and the oven cycles its cure steps ran. The result feeds compareCost (costing.ts).
//
// - Working minutes count only the factory's working time between a start and its finish (the
//   station's calendar), so a tray left on a bench overnight is not paid as labour.
// - A cure step's start-to-finish time is oven time, not work: its labour is the routing's
//   standard handling (per tray and per piece) for the trays that went in, and its oven is
//   counted in cycles.
// - Trays of the order that were in the oven at the same time share one cycle (they went in as
//   one load); a tray that went in after the others came out starts another.
import type { ActualStepInput } from './costing';
import { cures } from './traveller';
import { standardMinutes, type RoutingStep, type StationKind } from './vocabulary';

export interface StepRunFact {
  stepSeq: number;
  stationKind: string;
  startedAt: number | null;
  finishedAt: number;
  /** working minutes between the start and the finish scan (the station's calendar) */
  workingMinutes: number;
  qtyIn: number;
  scrapQty: number;
}

/** Oven cycles of one cure step's runs: runs that overlap in time are one cycle. */
export function cureCycles(runs: readonly Pick<StepRunFact, 'startedAt' | 'finishedAt'>[]): number {
  const spans = runs.map((r) => ({ from: r.startedAt ?? r.finishedAt, to: r.finishedAt })).sort((a, b) => a.from - b.from);
  let cycles = 0;
  let openUntil = -Infinity;
  for (const s of spans) {
    if (s.from >= openUntil) {
      cycles++;
      openUntil = s.to;
    } else openUntil = Math.max(openUntil, s.to);
  }
  return cycles;
}

/**
 * The actual side of each step of the routing (and of any step run the routing no longer has),
 * from the order's tray step runs.
 */
export function actualStepsOf(routing: readonly RoutingStep[], runs: readonly StepRunFact[]): ActualStepInput[] {
  const bySeq = new Map<number, StepRunFact[]>();
  for (const r of runs) bySeq.set(r.stepSeq, [...(bySeq.get(r.stepSeq) ?? []), r]);
  const steps = new Map(routing.map((s) => [s.seq, s]));
  const seqs = [...new Set([...steps.keys(), ...bySeq.keys()])].sort((a, b) => a - b);
  return seqs.map((seq) => {
    const step = steps.get(seq);
    const rs = bySeq.get(seq) ?? [];
    const kind = (step?.stationKind ?? rs[0]?.stationKind) as StationKind;
    const oven = cures(kind);
    const minutes = oven
      ? rs.reduce((sum, r) => sum + (step ? standardMinutes(step, r.qtyIn) : 0), 0)
      : rs.reduce((sum, r) => sum + Math.max(0, r.workingMinutes), 0);
    return {
      seq,
      name: step?.name ?? kind,
      stationKind: kind,
      minutes,
      scrap: rs.reduce((sum, r) => sum + r.scrapQty, 0),
      cureCycles: oven ? cureCycles(rs) : 0,
      cureMinutes: step?.cureMinutes ?? null,
    };
  });
}

/** Working minutes from a start to a finish scan, with a calendar's working-minutes function. */
export function runWorkingMinutes(startedAt: number | null, finishedAt: number, workingMinutesBetween: (from: number, to: number) => number): number {
  if (startedAt == null || finishedAt <= startedAt) return 0;
  return Math.max(0, workingMinutesBetween(startedAt, finishedAt));
}

export interface OrderCostFigures {
  process: string;
  colours: number;
  quoted: number;
  actual: number;
}

export interface CostGroup {
  process: string;
  colours: number;
  orders: number;
  quoted: number;
  actual: number;
  variance: number;
  /** variance as a percentage of the quoted cost; null when nothing was quoted */
  variancePct: number | null;
}

const money = (x: number) => Math.round((x + Number.EPSILON) * 100) / 100;

/** Orders summed by process and colour count, in process then colour order. */
export function costByProcessAndColours(orders: readonly OrderCostFigures[]): CostGroup[] {
  const groups = new Map<string, CostGroup>();
  for (const o of orders) {
    const key = `${o.process}|${o.colours}`;
    const g = groups.get(key) ?? { process: o.process, colours: o.colours, orders: 0, quoted: 0, actual: 0, variance: 0, variancePct: null };
    g.orders++;
    g.quoted += o.quoted;
    g.actual += o.actual;
    groups.set(key, g);
  }
  return [...groups.values()]
    .map((g) => ({
      ...g,
      quoted: money(g.quoted),
      actual: money(g.actual),
      variance: money(g.actual - g.quoted),
      variancePct: g.quoted > 0 ? Math.round(((g.actual - g.quoted) / g.quoted) * 1000) / 10 : null,
    }))
    .sort((a, b) => a.process.localeCompare(b.process) || a.colours - b.colours);
}
