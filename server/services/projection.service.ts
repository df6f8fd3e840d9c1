import type { AppDeps } from '../app-deps';
import { projectionRepository as repo, type OpenOrderRow, type TrayStateRow } from '../repositories/projection.repository';
import { reportFactsService } from './report-facts.service';
import { calendarService } from './calendar.service';
import { measureFloor, projectFloor, type OrderOutlook } from '@shared/domain/floor-projection';
import { measuredFromRuns, type FloorSnapshot, type MeasuredHistory, type StepRunFact } from '@shared/domain/floor-history';
import { type WorkingCalendar } from '@shared/domain/calendar';
import { DAY, dayNumberOfDate, dateOfDayNumber, localDate, startOfLocalDate } from '@shared/domain/time-zone';
import { projectionNoteEnglish, type ProjectionNote } from '@shared/domain/projection-note';
import { type RoutingStep, type StationKind, type TrayState } from '@shared/domain/vocabulary';
import type { LateRiskOrder, OrderProjection } from '@shared/schemas/reports';
import { projectionHistoryRepository as history, type ProjectionHistoryRow } from '../repositories/projection-history.repository';

// Projected ship dates for open orders. Other features call:
//   projectionService.forOrder(deps, orderId)      -> OrderProjection | null
//   projectionService.forOrders(deps, orderIds?)   -> Map<orderId, OrderProjection>
//   projectionService.lateRisk(deps)               -> LateRiskOrder[] (late first)
// expectedAt is the projected ship date to show; p85At the date it ships by with 85 % confidence.

const HISTORY_DAYS = 90;
/**
 * Runs of the floor per projection. 50: the backtest on out-of-sample floors gave the same
 * coverage with 50 as with 100 (within a point at each cut; see docs/decisions), at half the time.
 */
export const PROJECTION_RUNS = 50;
const CACHE_MS = 60_000;

interface Cache {
  key: string;
  at: number;
  byOrder: Map<string, OrderProjection>;
  outlooks: Map<string, OrderOutlook>;
  orders: OpenOrderRow[];
}
const caches = new WeakMap<object, Cache>();

/**
 * What the floor measured changes slowly (a day's scans are a fraction of 90 days), and reading
 * it is the heaviest part of a projection on a long history: it is kept per database and read
 * again after 10 minutes, when the clock goes back, or when the scan log folded into step_runs
 * has grown by more than 1 % (at once on a young floor, where each scan matters).
 */
const MEASURED_MAX_AGE_MS = 10 * 60_000;
const MEASURED_GROWTH = 0.01;
interface MeasuredCache {
  at: number;
  foldedUpTo: number;
  measured: MeasuredHistory;
}
const measuredCaches = new WeakMap<object, MeasuredCache>();

const iso = (x: number | null) => (x == null ? null : new Date(x).toISOString());

function stateOf(r: TrayStateRow): TrayState {
  return {
    trayId: r.trayId,
    kind: r.kind,
    phase: r.phase as TrayState['phase'],
    stepSeq: r.stepSeq,
    quantity: r.quantity,
    stationId: null,
    startedAt: iso(r.startedAt),
    waitingSince: iso(r.waitingSince),
    cureReadyAt: iso(r.cureReadyAt),
    onHold: !!r.onHold,
    holdReason: null,
    releasedAt: iso(r.releasedAt)!,
    lastEventAt: iso(r.lastEventAt),
  };
}

/** The open floor now, as the domain's as-of projection takes it: stored tray states and measured step runs. */
export function floorSnapshot(deps: AppDeps, now: number): { snapshot: FloorSnapshot; orders: OpenOrderRow[] } {
  const db = deps.db;
  const orders = repo.openOrders(db);
  const trays = repo.openTrays(db);
  const steps = repo.openSteps(db);
  const traysOf = new Map<string, TrayStateRow[]>();
  for (const t of trays) (traysOf.get(t.orderId) ?? traysOf.set(t.orderId, []).get(t.orderId)!).push(t);
  const routingOf = new Map<string, { tray: RoutingStep[]; mould: RoutingStep[] }>();
  for (const st of steps) {
    const r = routingOf.get(st.orderId) ?? routingOf.set(st.orderId, { tray: [], mould: [] }).get(st.orderId)!;
    r[st.kind].push({
      seq: st.seq,
      name: st.name,
      stationKind: st.stationKind as StationKind,
      trayMinutes: st.trayMinutes,
      pieceMinutes: st.pieceMinutes,
      cureMinutes: st.cureMinutes,
      colour: st.colour,
    });
  }
  const snapshot: FloorSnapshot = {
    now,
    orders: orders.map((o) => ({
      id: o.id,
      number: o.number,
      dueDate: o.dueDate,
      releasedAt: o.releasedAt ?? now,
      travellers: (traysOf.get(o.id) ?? []).map((t) => ({ id: t.trayId, kind: t.kind, state: stateOf(t) })),
      routing: routingOf.get(o.id) ?? { tray: [], mould: [] },
    })),
    measured: measuredNow(deps, now),
  };
  return { snapshot, orders };
}

/** Whether a kept measured history still stands for the floor at `now` with the log folded in up to `foldedUpTo`. */
export function measuredStillFresh(kept: { at: number; foldedUpTo: number }, now: number, foldedUpTo: number): boolean {
  if (now < kept.at || now - kept.at >= MEASURED_MAX_AGE_MS) return false;
  // a rebuild starts the cursor again from 0; a grown log by more than 1 % is read again
  return foldedUpTo >= kept.foldedUpTo && foldedUpTo - kept.foldedUpTo <= kept.foldedUpTo * MEASURED_GROWTH;
}

/** The measured history of the last HISTORY_DAYS, kept per database (see MEASURED_MAX_AGE_MS). */
function measuredNow(deps: AppDeps, now: number): MeasuredHistory {
  const foldedUpTo = reportFactsService.foldedUpTo(deps);
  const hit = measuredCaches.get(deps.db);
  if (hit && measuredStillFresh(hit, now, foldedUpTo)) return hit.measured;
  const since = now - HISTORY_DAYS * DAY;
  const measured = measuredFromRuns(readRuns(deps, since), repo.holdsSince(deps.db, since));
  measuredCaches.set(deps.db, { at: now, foldedUpTo, measured });
  return measured;
}

/** The step runs since `since`, read as plain arrays; ids and kinds repeat, so each is kept once. */
function readRuns(deps: AppDeps, since: number): StepRunFact[] {
  const strings = new Map<string, string>();
  const once = (x: string) => {
    const seen = strings.get(x);
    if (seen !== undefined) return seen;
    strings.set(x, x);
    return x;
  };
  const runs: StepRunFact[] = [];
  for (const [
    orderId,
    trayId,
    travellerKind,
    stepSeq,
    stationKind,
    stationId,
    readyAt,
    startedAt,
    finishedAt,
    implicit,
    standardMinutes,
    cure,
  ] of repo.runsSinceRaw(deps.db, since))
    runs.push({
      orderId: once(orderId),
      trayId: once(trayId),
      travellerKind,
      stepSeq,
      stationKind: once(stationKind),
      stationId: stationId == null ? null : once(stationId),
      readyAt,
      startedAt,
      finishedAt,
      implicit: !!implicit,
      standardMinutes,
      cure: !!cure,
    });
  return runs;
}

/** The measured model of the floor now (cached with the projections). */
export function modelOf(deps: AppDeps, snapshot: FloorSnapshot, cal: WorkingCalendar) {
  const stations = repo.stations(deps.db).map((s) => ({ kind: s.kind, capacityTrays: s.capacityTrays, active: !!s.active }));
  return measureFloor(snapshot.measured, cal, stations);
}

function explain(p: OrderOutlook): ProjectionNote {
  if (p.expectedAt === null) return { code: 'none' };
  if (p.traysOpen === 0) return { code: 'all_done' };
  return {
    code: 'measured',
    params: {
      expectedAt: iso(p.expectedAt)!,
      p85At: iso(p.p85At ?? p.expectedAt)!,
      runs: p.runs,
      historyDays: HISTORY_DAYS,
      remainingSteps: p.remainingSteps,
      standardMinutes: p.standardMinutes,
      drivingKind: (p.drivingKind as StationKind | null) ?? null,
      drivingWaitMinutes: p.drivingWaitMinutes,
      traysOnHold: p.traysOnHold,
    },
  };
}

function toProjection(o: { id: string; dueDate: string }, p: OrderOutlook, tz: string): OrderProjection {
  const note = explain(p);
  const dueEnd = startOfLocalDate(tz, dateOfDayNumber(dayNumberOfDate(o.dueDate) + 1));
  return {
    orderId: o.id,
    expectedAt: iso(p.expectedAt),
    p85At: iso(p.p85At),
    dueDate: o.dueDate,
    late: p.expectedAt !== null && p.expectedAt > dueEnd,
    explanation: projectionNoteEnglish(note, tz),
    explanationNote: note,
  };
}

/** Projects a floor snapshot with the server's settings. */
export function projectSnapshot(deps: AppDeps, snapshot: FloorSnapshot, cal: WorkingCalendar): Map<string, OrderOutlook> {
  return projectFloor(snapshot, { calendar: cal, model: modelOf(deps, snapshot, cal), runs: PROJECTION_RUNS });
}

function compute(deps: AppDeps): Cache {
  const key = repo.fingerprint(deps.db);
  const hit = caches.get(deps.db);
  const now = deps.now();
  if (hit && hit.key === key && now - hit.at < CACHE_MS && now >= hit.at) return hit;
  reportFactsService.catchUp(deps);
  const cal = calendarService.calendar(deps);
  const { snapshot, orders } = floorSnapshot(deps, now);
  const outlooks = projectSnapshot(deps, snapshot, cal);
  const byOrder = new Map<string, OrderProjection>();
  for (const o of orders) {
    const p = outlooks.get(o.id);
    if (p) byOrder.set(o.id, toProjection(o, p, cal.timeZone));
  }
  const fresh = { key, at: now, byOrder, outlooks, orders };
  caches.set(deps.db, fresh);
  keepDaily(deps, outlooks, now, cal.timeZone);
  return fresh;
}

function historyRow(p: OrderOutlook, reason: ProjectionHistoryRow['reason'], now: number, timeZone: string): ProjectionHistoryRow {
  return { orderId: p.orderId, day: localDate(timeZone, now), reason, at: now, expectedAt: p.expectedAt, p85At: p.p85At, drivingKind: p.drivingKind };
}

/** The first projection of each factory day is kept for every open order (the order page draws how it moved). */
function keepDaily(deps: AppDeps, outlooks: Map<string, OrderOutlook>, now: number, timeZone: string) {
  try {
    const kept = history.ordersWithDailyRow(deps.db, localDate(timeZone, now));
    const rows = [...outlooks.values()]
      .filter((p) => p.traysOpen > 0 && p.expectedAt != null && !kept.has(p.orderId))
      .map((p) => historyRow(p, 'daily', now, timeZone));
    history.insertIgnoring(deps.db, rows);
  } catch (err) {
    // the dates on the screen matter more than their history: never fail a projection for it
    deps.log.warn({ err: (err as Error).message }, 'projected dates not kept in the history');
  }
}

export const projectionService = {
  forOrders(deps: AppDeps, orderIds?: string[]): Map<string, OrderProjection> {
    const all = compute(deps).byOrder;
    if (!orderIds) return all;
    return new Map(orderIds.filter((id) => all.has(id)).map((id) => [id, all.get(id) as OrderProjection]));
  },

  forOrder(deps: AppDeps, orderId: string): OrderProjection | null {
    return compute(deps).byOrder.get(orderId) ?? null;
  },

  /** Keeps the order's projected dates as the floor stands right after its release (its first point). */
  keepRelease(deps: AppDeps, orderId: string): void {
    try {
      const p = compute(deps).outlooks.get(orderId);
      if (p && p.expectedAt != null) history.insertIgnoring(deps.db, [historyRow(p, 'release', deps.now(), calendarService.calendar(deps).timeZone)]);
    } catch (err) {
      deps.log.warn({ err: (err as Error).message, orderId }, 'projected dates at release not kept');
    }
  },

  /** Open orders whose expected date (late) or 85th-percentile date (at risk) passes the due date. */
  lateRisk(deps: AppDeps): LateRiskOrder[] {
    const c = compute(deps);
    const cal = calendarService.calendar(deps);
    const out: LateRiskOrder[] = [];
    for (const o of c.orders) {
      const p = c.byOrder.get(o.id);
      if (!p || !p.expectedAt) continue;
      const dueEnd = startOfLocalDate(cal.timeZone, dateOfDayNumber(dayNumberOfDate(o.dueDate) + 1));
      const expected = Date.parse(p.expectedAt);
      const p85 = Date.parse(p.p85At ?? p.expectedAt);
      if (p85 <= dueEnd) continue;
      out.push({
        ...p,
        number: o.number,
        customer: o.customer,
        title: o.title,
        status: o.status,
        slackHours: Math.round((cal.factory.workingMinutesBetween(dueEnd, expected) / 60) * 10) / 10,
        risk: expected > dueEnd ? 'late' : 'at_risk',
      });
    }
    return out.sort((a, b) => (a.risk === b.risk ? (b.slackHours ?? 0) - (a.slackHours ?? 0) : a.risk === 'late' ? -1 : 1));
  },
};
