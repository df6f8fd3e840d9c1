import type { AppDeps } from '../app-deps';
import { reportFactsRepository as repo, type EventRow, type StepRunInsert, type TrayFlowInsert, type TrayInfo } from '../repositories/report-facts.repository';
import { onFloorChanged } from './live-bus';

// Keeps step_runs in step with the append-only scan log. Each tray's runs are rebuilt from all of
// its events whenever it has new ones, so a late event from an offline tablet lands correctly.
//
// How events become steps (the same rules as the scan guards in shared/domain/guards.ts):
// - a start opens the step; its queue time runs from when the tray became ready for it (the
//   previous step's finish, the end of the previous cure, or the tray's release);
// - a finish closes the open step with its counts;
// - a start while a cure step is open closes that cure on its own at the end of its minimum cure
//   time (or at the start, when a supervisor let the start through early), every piece good.

const CURSOR = 'step_runs';
const MINUTE = 60_000;
/** more trays than this with new events: stream the whole log once instead */
const FULL_REBUILD_THRESHOLD = 2000;
const TRAYS_PER_PAGE = 500;

export function runsOfTray(tray: TrayInfo, events: readonly EventRow[], cure: Map<string, number>): StepRunInsert[] {
  const runs: StepRunInsert[] = [];
  let ready = tray.releasedAt;
  let qty = tray.quantity;
  let open: { seq: number; kind: string; station: string | null; start: number; ready: number; qtyIn: number; cure: number | null } | null = null;
  const base = { trayId: tray.id, orderId: tray.orderId, travellerKind: tray.kind };
  const close = (finishedAt: number, counts: { good: number; scrap: number; rework: number; reason: string | null }, implicit: boolean) => {
    if (!open) return;
    runs.push({
      ...base,
      stepSeq: open.seq,
      stationKind: open.kind,
      stationId: open.station,
      readyAt: open.ready,
      startedAt: open.start,
      finishedAt,
      queueMinutes: Math.max(0, (open.start - open.ready) / MINUTE),
      processMinutes: Math.max(0, (finishedAt - open.start) / MINUTE),
      cureMinutes: open.cure,
      qtyIn: open.qtyIn,
      goodQty: counts.good,
      scrapQty: counts.scrap,
      reworkQty: counts.rework,
      scrapReason: counts.reason,
      implicit,
    });
    ready = finishedAt;
    qty = counts.good;
    open = null;
  };
  for (const ev of events) {
    if (ev.type === 'start' && ev.stepSeq != null && ev.stationKind) {
      if (open && open.cure) {
        const cureEnd = open.start + open.cure * MINUTE;
        close(Math.min(ev.occurredAt, cureEnd), { good: open.qtyIn, scrap: 0, rework: 0, reason: null }, true);
      }
      open = {
        seq: ev.stepSeq,
        kind: ev.stationKind,
        station: ev.stationId,
        start: ev.occurredAt,
        ready: Math.min(ready, ev.occurredAt),
        qtyIn: ev.qtyIn ?? qty,
        cure: cure.get(`${tray.orderId}|${tray.kind}|${ev.stepSeq}`) ?? null,
      };
    } else if (ev.type === 'finish' && open) {
      const good = ev.goodQty ?? open.qtyIn - (ev.scrapQty ?? 0);
      close(ev.occurredAt, { good, scrap: ev.scrapQty ?? 0, rework: ev.reworkQty ?? 0, reason: ev.scrapReason }, false);
    }
  }
  return runs;
}

/** A tray's milestones and its process and cure minutes, from its runs. */
export function flowOfTray(tray: TrayInfo, runs: readonly StepRunInsert[]): TrayFlowInsert {
  const f: TrayFlowInsert = {
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
  };
  const later = (a: number | null, b: number) => (a === null || b > a ? b : a);
  for (const r of runs) {
    if (r.startedAt != null && (f.startedAt === null || r.startedAt < f.startedAt)) f.startedAt = r.startedAt;
    f.lastFinishAt = later(f.lastFinishAt, r.finishedAt);
    if (r.stationKind === 'inspect') f.inspectedAt = later(f.inspectedAt, r.finishedAt);
    if (r.stationKind === 'pack') f.packedAt = later(f.packedAt, r.finishedAt);
    if (r.stationKind === 'dispatch') {
      f.shippedAt = later(f.shippedAt, r.finishedAt);
      f.shippedQty = (f.shippedQty ?? 0) + r.goodQty;
    }
    if (r.cureMinutes != null) f.cureMinutes += r.processMinutes ?? 0;
    else f.processMinutes += r.processMinutes ?? 0;
  }
  return f;
}

function rebuildAll(deps: AppDeps, upTo: number) {
  const db = deps.db;
  const trays = new Map(repo.trays(db).map((t) => [t.id, t]));
  const cure = repo.cureSteps(db);
  repo.deleteAllRuns(db);
  const ids = repo.trayIdsWithEvents(db);
  repo.withoutIndexes(db, () => fillAll(db, ids, trays, cure, upTo));
}

function fillAll(db: AppDeps['db'], ids: string[], trays: Map<string, TrayInfo>, cure: Map<string, number>, upTo: number) {
  const insert = repo.inserter(db);
  const insertFlow = repo.flowInserter(db);
  // a few hundred trays at a time keeps memory flat on a year of events
  for (let i = 0; i < ids.length; i += TRAYS_PER_PAGE) {
    const page = ids.slice(i, i + TRAYS_PER_PAGE);
    const events = repo.eventsOfTrayRange(db, page[0], page[page.length - 1], upTo);
    let start = 0;
    for (let j = 1; j <= events.length; j++) {
      if (j === events.length || events[j].trayId !== events[start].trayId) {
        const tray = trays.get(events[start].trayId);
        if (tray && tray.kind === 'tray') {
          const runs = runsOfTray(tray, events.slice(start, j), cure);
          for (const r of runs) insert(r);
          insertFlow(flowOfTray(tray, runs));
        } else if (tray) for (const r of runsOfTray(tray, events.slice(start, j), cure)) insert(r);
        start = j;
      }
    }
  }
}

function rebuildTrays(deps: AppDeps, trayIds: string[]) {
  const db = deps.db;
  const trays = repo.trays(db, trayIds);
  const cure = repo.cureSteps(db, [...new Set(trays.map((t) => t.orderId))]);
  const insert = repo.inserter(db);
  const insertFlow = repo.flowInserter(db);
  for (const t of trays) {
    repo.deleteRunsOfTray(db, t.id);
    const runs = runsOfTray(t, repo.eventsOfTray(db, t.id), cure);
    for (const r of runs) insert(r);
    if (t.kind === 'tray') insertFlow(flowOfTray(t, runs));
  }
}

const subscribed = new WeakSet<object>();

export const reportFactsService = {
  /**
   * Brings step_runs up to date with the scan log. Cheap when nothing is new (one indexed
   * lookup); called before every report and after floor changes.
   */
  catchUp(deps: AppDeps, options: { full?: boolean } = {}): { trays: number; full: boolean } {
    const db = deps.db;
    const last = repo.cursor(db, CURSOR);
    const max = repo.maxEventRowid(db);
    if (max <= last && !options.full) return { trays: 0, full: false };
    return repo.transaction(db, () => {
      const trays = options.full ? [] : repo.traysWithEventsAfter(db, last, FULL_REBUILD_THRESHOLD + 1);
      const full = options.full || trays.length > FULL_REBUILD_THRESHOLD || last === 0;
      if (full) rebuildAll(deps, max);
      else rebuildTrays(deps, trays);
      repo.setCursor(db, CURSOR, max, deps.now());
      return { trays: trays.length, full };
    });
  },

  /** Keeps step_runs fresh in the background while the server runs (after floor changes). */
  follow(deps: AppDeps) {
    if (subscribed.has(deps.db)) return;
    subscribed.add(deps.db);
    let timer: NodeJS.Timeout | null = null;
    onFloorChanged(deps, () => {
      if (timer) return;
      timer = setTimeout(() => {
        timer = null;
        try {
          reportFactsService.catchUp(deps);
        } catch (error) {
          deps.log.warn({ err: error }, 'report facts catch-up failed');
        }
      }, 250);
      timer.unref?.();
    });
  },
};
