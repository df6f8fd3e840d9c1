// A traveller's history read back through the scan guards: the same evaluation the server makes
// for every scan (../guards), applied to the stored events in time order, gives each traveller's
// state and the steps it closed. The report facts (step runs and tray flows) are built from these
// step records and from nothing else, so a report can never count a step differently from the
// floor.
//
// Splits and merges are not scans: the tray service writes them (server/services/trays.service.ts)
// and they are replayed here the way it makes them:
// - a split-off tray starts where its parent stands with the pieces it took; sent back to an
//   earlier step for rework it waits for that step from the moment of the split;
// - a merged tray is left with no pieces; the tray it went into holds them all, waits since the
//   earliest of the trays and may start when the last of their cures has run.
//
// Rework by a split: a tray split back to an earlier step does that step and the ones after it
// again. Those runs are not new pieces into the steps: the step it was sent back to counts its
// pieces as not passed first time (`pass: 'rework'`), and the steps done again after it count
// them neither as new pieces nor as failures (`pass: 'repeat'`); see stepRunYieldCounts.
import { evaluateScan, type GuardResult, type OverrideKind, type StepRecord } from '../guards';
import { initialTrayState, type Role, type RoutingStep, type StationKind, type TrayState, type TravellerKind } from '../vocabulary';
import { kindTraits } from './station-kinds';
import { iso } from '../time-zone';

const ms = (t: string | null) => (t == null ? null : Date.parse(t));

export interface ReplayTraveller {
  id: string;
  orderId: string;
  kind: TravellerKind;
  /** pieces at release (for a split-off tray: the pieces it took) */
  quantity: number;
  releasedAt: number;
  /** the tray it was split from */
  parentId?: string | null;
  /** the tray it was merged into */
  mergedIntoId?: string | null;
  routing: readonly RoutingStep[];
}

/** A stored event (times in ms), with what the guard needs to know about who and what let it through. */
export interface ReplayEvent {
  trayId: string;
  type: string;
  stepSeq: number | null;
  stationId: string | null;
  stationKind: string | null;
  occurredAt: number;
  qtyIn: number | null;
  goodQty: number | null;
  scrapQty: number | null;
  reworkQty: number | null;
  scrapReason: string | null;
  note?: string | null;
  /** the guard the supervisor's override let through, when the scan used one */
  overrideKind?: OverrideKind | null;
  /** role of the person who scanned (a supervisor releases a hold without an override) */
  actorRole?: Role | null;
}

/** How a run counts for yield: first time through the step, the step a split sent pieces back to, or a step done again after that. */
export type StepPass = 'first' | 'rework' | 'repeat';

/** One closed step of one traveller, as the report facts keep it (times in ms). */
export interface StepRun {
  trayId: string;
  orderId: string;
  travellerKind: TravellerKind;
  stepSeq: number;
  name: string;
  /** kind of the station the step was started at (the routing's kind unless an override let another kind do it) */
  stationKind: string;
  stationId: string | null;
  /** when the traveller became ready for the step (previous finish, end of a cure, release, split) */
  readyAt: number;
  startedAt: number | null;
  finishedAt: number;
  queueMinutes: number | null;
  processMinutes: number | null;
  /** minimum cure minutes of a cure step (as the routing asked); null for other steps */
  cureMinutes: number | null;
  qtyIn: number;
  goodQty: number;
  scrapQty: number;
  reworkQty: number;
  scrapReason: string | null;
  /** a cure step closed on its own when the next step started */
  implicit: boolean;
  pass: StepPass;
}

export interface ReplayRefusal {
  event: ReplayEvent;
  result: Extract<GuardResult, { ok: false }>;
}

export interface Replay {
  states: Map<string, TrayState>;
  runs: Map<string, StepRun[]>;
  /** stored events the guard would refuse from the replayed state (none, for a history the server wrote) */
  refused: ReplayRefusal[];
}

interface Open {
  readyAt: number;
  queueMinutes: number;
  stationId: string | null;
  stationKind: string | null;
}

/** Steps [from, until) of a tray split back for rework are done again. */
interface ReworkWindow {
  from: number;
  until: number;
}

const GUARDED = new Set(['start', 'finish', 'hold', 'release']);

/**
 * Replays the events of a set of travellers (one tray with its split-offs and merges, an order,
 * or the whole floor) in the order given: time order, and for one instant the order they were
 * stored in. Returns every traveller's state and its step runs.
 */
export function replayTravellers(travellers: Iterable<ReplayTraveller>, events: Iterable<ReplayEvent>): Replay {
  const info = new Map<string, ReplayTraveller>();
  const states = new Map<string, TrayState>();
  const runs = new Map<string, StepRun[]>();
  const open = new Map<string, Open>();
  const rework = new Map<string, ReworkWindow>();
  /** merged-in trays' states, waiting for their target's merge event at the same instant */
  const mergedIn = new Map<string, TrayState[]>();
  const refused: ReplayRefusal[] = [];

  for (const t of travellers) {
    info.set(t.id, t);
    runs.set(t.id, []);
    states.set(t.id, initialTrayState({ trayId: t.id, kind: t.kind, quantity: t.quantity, releasedAt: iso(t.releasedAt) }));
  }

  const passOf = (trayId: string, seq: number): StepPass => {
    const w = rework.get(trayId);
    if (!w || seq < w.from || seq >= w.until) return 'first';
    return seq === w.from ? 'rework' : 'repeat';
  };

  const record = (t: ReplayTraveller, c: StepRecord, o: Open | undefined) => {
    const step = t.routing.find((s) => s.seq === c.seq);
    const startedAt = ms(c.startedAt);
    runs.get(t.id)!.push({
      trayId: t.id,
      orderId: t.orderId,
      travellerKind: t.kind,
      stepSeq: c.seq,
      name: c.name,
      stationKind: o?.stationKind ?? c.stationKind,
      stationId: o?.stationId ?? null,
      readyAt: o?.readyAt ?? startedAt ?? Date.parse(c.finishedAt),
      startedAt,
      finishedAt: Date.parse(c.finishedAt),
      queueMinutes: o ? o.queueMinutes : null,
      processMinutes: c.processMinutes == null ? null : Math.max(0, c.processMinutes),
      cureMinutes: step?.cureMinutes != null && step.cureMinutes > 0 ? step.cureMinutes : null,
      qtyIn: c.quantityIn,
      goodQty: c.good,
      scrapQty: c.scrap,
      reworkQty: c.rework,
      scrapReason: c.scrapReason,
      implicit: c.implicit,
      pass: passOf(t.id, c.seq),
    });
  };

  for (const ev of events) {
    const t = info.get(ev.trayId);
    const state = states.get(ev.trayId);
    if (!t || !state) continue;
    const at = iso(ev.occurredAt);

    if (GUARDED.has(ev.type)) {
      const r = evaluateScan({
        state,
        routing: t.routing,
        station: { id: ev.stationId ?? '', kind: (ev.stationKind ?? '') as StationKind },
        event: {
          type: ev.type as 'start' | 'finish' | 'hold' | 'release',
          occurredAt: at,
          goodQty: ev.goodQty,
          scrapQty: ev.scrapQty,
          reworkQty: ev.reworkQty,
          scrapReason: ev.scrapReason,
          note: ev.note ?? null,
        },
        // the server accepted it when it arrived: judge it at its own moment
        now: ev.occurredAt,
        // the mould gate was open when the server accepted the start
        mouldReady: true,
        override: ev.overrideKind ? { id: 'stored', supervisorId: 'stored', reason: 'stored', kind: ev.overrideKind } : null,
        actorRole: ev.actorRole ?? null,
      });
      if (!r.ok) {
        refused.push({ event: ev, result: r });
        continue;
      }
      const before = open.get(t.id);
      for (const c of r.facts.completed) {
        record(t, c, before);
        open.delete(t.id);
      }
      if (ev.type === 'start') {
        open.set(t.id, {
          readyAt: r.facts.readyAt ? Date.parse(r.facts.readyAt) : ev.occurredAt,
          queueMinutes: r.facts.queueMinutes ?? 0,
          stationId: ev.stationId,
          stationKind: ev.stationKind,
        });
      }
      states.set(t.id, r.next);
      continue;
    }

    if (ev.type === 'split') {
      const parentId = t.parentId ?? null;
      const parent = parentId ? states.get(parentId) : undefined;
      if (parentId && parent && state.lastEventAt == null) {
        // this tray's first event: it is made from its parent, with the pieces it took
        const seq = ev.stepSeq ?? parent.stepSeq;
        const back = seq != null && parent.stepSeq != null && seq !== parent.stepSeq;
        states.set(t.id, {
          ...parent,
          trayId: t.id,
          kind: t.kind,
          quantity: ev.qtyIn ?? t.quantity,
          ...(back ? { stepSeq: seq, cureReadyAt: null, waitingSince: at } : {}),
          lastEventAt: at,
        });
        states.set(parentId, { ...parent, quantity: parent.quantity - (ev.qtyIn ?? t.quantity) });
        const inherited = rework.get(parentId);
        if (back) rework.set(t.id, { from: seq, until: Math.max(parent.stepSeq!, inherited?.until ?? 0) });
        else if (inherited) rework.set(t.id, inherited);
      } else {
        // the parent's own record of the split (its pieces went with the split-offs)
        states.set(t.id, { ...state, lastEventAt: at });
      }
      continue;
    }

    if (ev.type === 'merge') {
      if (t.mergedIntoId) {
        mergedIn.set(t.mergedIntoId, [...(mergedIn.get(t.mergedIntoId) ?? []), state]);
        states.set(t.id, { ...state, phase: 'merged', quantity: 0, stepSeq: null, lastEventAt: at });
      } else {
        const parts = [state, ...(mergedIn.get(t.id) ?? [])];
        mergedIn.delete(t.id);
        const latest = (xs: (string | null)[]) =>
          xs.filter((x): x is string => !!x).reduce<string | null>((a, b) => (a == null || Date.parse(b) > Date.parse(a) ? b : a), null);
        const earliest = (xs: (string | null)[]) =>
          xs.filter((x): x is string => !!x).reduce<string | null>((a, b) => (a == null || Date.parse(b) < Date.parse(a) ? b : a), null);
        states.set(t.id, {
          ...state,
          quantity: ev.qtyIn ?? parts.reduce((s, p) => s + p.quantity, 0),
          cureReadyAt: latest(parts.map((p) => p.cureReadyAt)),
          waitingSince: earliest(parts.map((p) => p.waitingSince)),
          lastEventAt: at,
        });
      }
    }
  }
  return { states, runs, refused };
}

/**
 * What a run adds to its step's yield counts (first-pass yield = (good - rework) / in):
 * - a first pass: its pieces in, good, scrap and the rework its finish reported;
 * - the step a split sent pieces back to: no new pieces in; every piece of it needed rework, and
 *   the ones it scrapped are lost from the step's good ones;
 * - a step done again after that: no new pieces in, no failure of this step; pieces it scrapped
 *   are lost from its good ones.
 * Pieces are conserved over a step's runs: in = good + scrap.
 * reports.repository.ts sums the same in SQL (`yieldSums`); its tests hold both to this.
 */
export function stepRunYieldCounts(r: Pick<StepRun, 'pass' | 'qtyIn' | 'goodQty' | 'scrapQty' | 'reworkQty'>): {
  inQty: number;
  goodQty: number;
  scrapQty: number;
  reworkQty: number;
} {
  if (r.pass === 'first') return { inQty: r.qtyIn, goodQty: r.goodQty, scrapQty: r.scrapQty, reworkQty: r.reworkQty };
  return { inQty: 0, goodQty: r.goodQty - r.qtyIn, scrapQty: r.scrapQty, reworkQty: r.pass === 'rework' ? r.goodQty : r.reworkQty };
}

/** A tray's milestones and its process and cure minutes, from its runs. */
export interface TrayFlow {
  trayId: string;
  orderId: string;
  releasedAt: number;
  startedAt: number | null;
  inspectedAt: number | null;
  packedAt: number | null;
  shippedAt: number | null;
  shippedQty: number | null;
  lastFinishAt: number | null;
  /** calendar minutes of its process steps (start to finish), cure steps apart */
  processMinutes: number;
  cureMinutes: number;
  /** the same, in working minutes of the factory's calendar */
  processWorkingMinutes: number;
  cureWorkingMinutes: number;
}

/**
 * The flow of one tray from its runs. `working(from, to)` gives the factory's working minutes
 * between two instants (the unit flow time is measured in); without it they are 0.
 */
export function trayFlowOf(
  tray: { id: string; orderId: string; releasedAt: number },
  runs: readonly StepRun[],
  working?: (from: number, to: number) => number,
): TrayFlow {
  const f: TrayFlow = {
    trayId: tray.id,
    orderId: tray.orderId,
    releasedAt: tray.releasedAt,
    startedAt: null,
    inspectedAt: null,
    packedAt: null,
    shippedAt: null,
    shippedQty: null,
    lastFinishAt: null,
    processMinutes: 0,
    cureMinutes: 0,
    processWorkingMinutes: 0,
    cureWorkingMinutes: 0,
  };
  const later = (a: number | null, b: number) => (a === null || b > a ? b : a);
  for (const r of runs) {
    if (r.startedAt != null && (f.startedAt === null || r.startedAt < f.startedAt)) f.startedAt = r.startedAt;
    f.lastFinishAt = later(f.lastFinishAt, r.finishedAt);
    const traits = kindTraits(r.stationKind);
    if (traits.stage === 'inspection') f.inspectedAt = later(f.inspectedAt, r.finishedAt);
    if (traits.milestone === 'packed') f.packedAt = later(f.packedAt, r.finishedAt);
    if (traits.milestone === 'dispatched') {
      f.shippedAt = later(f.shippedAt, r.finishedAt);
      f.shippedQty = (f.shippedQty ?? 0) + r.goodQty;
    }
    const w = working && r.startedAt != null ? working(r.startedAt, r.finishedAt) : 0;
    if (r.cureMinutes != null) {
      f.cureMinutes += r.processMinutes ?? 0;
      f.cureWorkingMinutes += w;
    } else {
      f.processMinutes += r.processMinutes ?? 0;
      f.processWorkingMinutes += w;
    }
  }
  return f;
}
