// The floor as it stood at a moment t, from the scan history up to t and nothing after it.
//
// The history is replayed through the scan guards (`evaluateScan`), in the order the scans
// happened, so each traveller's state at t is exactly the state the server would have kept;
// what the guards report about each accepted scan (queue before a start, the steps it closed)
// is what the floor measured up to t. A projection made from this snapshot is the projection
// the product would have shown at t. The server builds the same snapshot from its stored tray
// states and step runs; a backtest replays the past with it.
import { evaluateScan, type ValidOverride } from './guards';
import { MOULD_USING_KINDS } from './routing';
import { standardMinutes, type Role, type RoutingStep, type ScanType, type StationKind, type TrayState, type TravellerKind } from './vocabulary';

const MINUTE = 60_000;
const DAY = 86_400_000;

export interface HistoryOrder {
  id: string;
  number: string;
  /** YYYY-MM-DD */
  dueDate: string;
  releasedAt: number;
}

export interface HistoryTraveller {
  id: string;
  orderId: string;
  kind: TravellerKind;
  quantity: number;
  releasedAt: number;
  routing: readonly RoutingStep[];
  /** the state the release wrote (a reused mould starts at its check) */
  initial: TrayState;
}

export interface HistoryEvent {
  trayId: string;
  type: ScanType;
  stationId: string;
  stationKind: StationKind;
  userId: string;
  occurredAt: number;
  goodQty?: number | null;
  scrapQty?: number | null;
  reworkQty?: number | null;
  scrapReason?: string | null;
  note?: string | null;
  overrideId?: string | null;
}

export interface FloorHistory {
  orders: readonly HistoryOrder[];
  travellers: readonly HistoryTraveller[];
  events: readonly HistoryEvent[];
  overrides?: ReadonlyMap<string, ValidOverride>;
  roleOf?: ReadonlyMap<string, Role>;
  reasonCodes?: readonly string[];
}

/** One measured wait: a traveller ready for a step (previous finish, end of cure, release) until it started. */
export interface QueueRecord {
  stationKind: string;
  travellerKind: TravellerKind;
  orderId: string;
  stationId: string | null;
  readyAt: number;
  startedAt: number;
  /** the traveller was the first of its order to start this step (the head of the order's trays) */
  lead?: boolean;
}

/** One measured step: started, finished, against its standard minutes. */
export interface ProcessRecord {
  stationKind: string;
  stationId: string | null;
  startedAt: number;
  finishedAt: number;
  standardMinutes: number;
  /** an oven step: the place is held for the cure, its time says nothing about the standard */
  cure?: boolean;
}

/** An order's wait before dispatch, measured once: from its last packed tray to the first dispatch start. */
export interface DispatchRecord {
  orderId: string;
  lastPackedAt: number;
  startedAt: number;
}

/** A traveller put on hold while it waited, and released. */
export interface HoldRecord {
  trayId: string;
  heldAt: number;
  releasedAt: number;
}

export interface MeasuredHistory {
  queues: QueueRecord[];
  processes: ProcessRecord[];
  dispatches: DispatchRecord[];
  /** holds released in the window (their time is taken out of the queue it interrupted) */
  holds: HoldRecord[];
}

export interface SnapshotTraveller {
  id: string;
  kind: TravellerKind;
  state: TrayState;
}

export interface SnapshotOrder {
  id: string;
  number: string;
  dueDate: string;
  releasedAt: number;
  travellers: SnapshotTraveller[];
  routing: { tray: readonly RoutingStep[]; mould: readonly RoutingStep[] };
}

export interface FloorSnapshot {
  now: number;
  /** released and not yet shipped */
  orders: SnapshotOrder[];
  measured: MeasuredHistory;
}

/** The step kinds where an order's trays are gathered and leave together. */
export const ORDER_LEVEL_KINDS: readonly string[] = ['dispatch'];

const closed = (s: TrayState) => s.phase === 'done' || s.phase === 'scrapped' || s.phase === 'merged';

/**
 * Replays a history forward in time. `advanceTo(t)` applies every scan that happened at or
 * before t (once: cuts are taken in ascending order), and `snapshot()` gives the floor at t.
 */
export class FloorReplay {
  private readonly states = new Map<string, TrayState>();
  private readonly travellerById = new Map<string, HistoryTraveller>();
  private readonly ordersSorted: HistoryOrder[];
  private readonly travellersOf = new Map<string, HistoryTraveller[]>();
  private readonly events: HistoryEvent[];
  private cursor = 0;
  private at = -Infinity;
  private readonly queues: QueueRecord[] = [];
  private readonly processes: ProcessRecord[] = [];
  private readonly dispatches: DispatchRecord[] = [];
  private readonly lastPack = new Map<string, number>();
  private readonly dispatched = new Set<string>();
  private readonly mouldsLeft = new Map<string, number>();
  private readonly mouldsDone = new Map<string, number>();
  private readonly led = new Set<string>();
  private readonly holds: HoldRecord[] = [];
  private readonly heldAt = new Map<string, number>();
  private readonly heldMs = new Map<string, number>();
  /** when each traveller ended (done or scrapped), for the order's ship time */
  readonly endedAt = new Map<string, number>();

  constructor(
    private readonly history: FloorHistory,
    private readonly windowDays = 90,
  ) {
    this.ordersSorted = [...history.orders].sort((a, b) => a.releasedAt - b.releasedAt);
    for (const t of history.travellers) {
      this.travellerById.set(t.id, t);
      const list = this.travellersOf.get(t.orderId) ?? [];
      list.push(t);
      this.travellersOf.set(t.orderId, list);
      if (t.kind === 'mould') this.mouldsLeft.set(t.orderId, (this.mouldsLeft.get(t.orderId) ?? 0) + 1);
    }
    this.events = [...history.events].sort((a, b) => a.occurredAt - b.occurredAt);
  }

  get now(): number {
    return this.at;
  }

  advanceTo(t: number): void {
    if (t < this.at) throw new RangeError('a replay only moves forward');
    this.at = t;
    const reasonCodes = this.history.reasonCodes ?? null;
    while (this.cursor < this.events.length && this.events[this.cursor].occurredAt <= t) {
      const ev = this.events[this.cursor++];
      const trav = this.travellerById.get(ev.trayId);
      if (!trav) continue;
      const state = this.states.get(ev.trayId) ?? trav.initial;
      const res = evaluateScan({
        state,
        routing: trav.routing,
        station: { id: ev.stationId, kind: ev.stationKind },
        event: {
          type: ev.type,
          occurredAt: new Date(ev.occurredAt).toISOString(),
          goodQty: ev.goodQty,
          scrapQty: ev.scrapQty,
          reworkQty: ev.reworkQty,
          scrapReason: ev.scrapReason,
          note: ev.note,
        },
        now: ev.occurredAt,
        // accepted scans only reach the history; the mould gate was open when a strike started
        mouldReady: true,
        override: ev.overrideId ? (this.history.overrides?.get(ev.overrideId) ?? null) : null,
        actorRole: this.history.roleOf?.get(ev.userId) ?? null,
        reasonCodes,
      });
      if (!res.ok) throw new Error(`replay: scan ${ev.type} of ${ev.trayId} at ${new Date(ev.occurredAt).toISOString()} refused (${res.code})`);
      this.states.set(ev.trayId, res.next);
      this.record(trav, ev, res.facts.queueMinutes, res.facts.completed);
      if (closed(res.next)) {
        this.endedAt.set(trav.id, ev.occurredAt);
        if (trav.kind === 'mould') {
          const left = (this.mouldsLeft.get(trav.orderId) ?? 1) - 1;
          this.mouldsLeft.set(trav.orderId, left);
          if (left === 0) this.mouldsDone.set(trav.orderId, ev.occurredAt);
        }
      }
    }
  }

  private record(
    trav: HistoryTraveller,
    ev: HistoryEvent,
    queueMinutes: number | undefined,
    completed: readonly { seq: number; stationKind: StationKind; startedAt: string | null; finishedAt: string; quantityIn: number; implicit: boolean }[],
  ) {
    if (ev.type === 'hold') this.heldAt.set(trav.id, ev.occurredAt);
    if (ev.type === 'release') {
      const from = this.heldAt.get(trav.id);
      this.heldAt.delete(trav.id);
      if (from != null) {
        this.holds.push({ trayId: trav.id, heldAt: from, releasedAt: ev.occurredAt });
        this.heldMs.set(trav.id, (this.heldMs.get(trav.id) ?? 0) + (ev.occurredAt - from));
      }
    }
    for (const c of completed) {
      const finished = Date.parse(c.finishedAt);
      if (c.stationKind === 'pack' && trav.kind === 'tray') this.lastPack.set(trav.orderId, Math.max(this.lastPack.get(trav.orderId) ?? 0, finished));
      if (c.implicit || !c.startedAt) continue;
      const step = trav.routing.find((s) => s.seq === c.seq);
      if (!step) continue;
      this.processes.push({
        cure: (step.cureMinutes ?? 0) > 0,
        stationKind: c.stationKind,
        stationId: ev.stationId,
        startedAt: Date.parse(c.startedAt),
        finishedAt: finished,
        standardMinutes: standardMinutes(step, trav.kind === 'mould' ? 1 : c.quantityIn),
      });
    }
    if (ev.type === 'start' && queueMinutes != null) {
      // time on hold is the hold's, not the queue's
      let readyAt = Math.min(ev.occurredAt, ev.occurredAt - queueMinutes * MINUTE + (this.heldMs.get(trav.id) ?? 0));
      this.heldMs.delete(trav.id);
      // a strike or cast waits for the order's moulds first: that wait is the moulds', not the press's
      const moulds = this.mouldsDone.get(trav.orderId);
      if (trav.kind === 'tray' && MOULD_USING_KINDS.includes(ev.stationKind) && moulds != null) readyAt = Math.min(ev.occurredAt, Math.max(readyAt, moulds));
      const seq = this.states.get(trav.id)?.stepSeq;
      const key = `${trav.orderId}|${trav.kind}|${seq}`;
      const lead = !this.led.has(key);
      this.led.add(key);
      this.queues.push({
        stationKind: ev.stationKind,
        travellerKind: trav.kind,
        orderId: trav.orderId,
        stationId: ev.stationId,
        readyAt,
        startedAt: ev.occurredAt,
        lead,
      });
      if (ORDER_LEVEL_KINDS.includes(ev.stationKind) && trav.kind === 'tray' && !this.dispatched.has(trav.orderId)) {
        this.dispatched.add(trav.orderId);
        const packed = this.lastPack.get(trav.orderId);
        if (packed != null) this.dispatches.push({ orderId: trav.orderId, lastPackedAt: packed, startedAt: ev.occurredAt });
      }
    }
  }

  stateOf(id: string): TrayState | undefined {
    const t = this.travellerById.get(id);
    return t ? (this.states.get(id) ?? t.initial) : undefined;
  }

  /** The floor at the last `advanceTo`: open orders and what was measured in the window before it. */
  snapshot(): FloorSnapshot {
    const t = this.at;
    const orders: SnapshotOrder[] = [];
    for (const o of this.ordersSorted) {
      if (o.releasedAt > t) break;
      const list = this.travellersOf.get(o.id) ?? [];
      const travellers = list.filter((x) => x.releasedAt <= t).map((x) => ({ id: x.id, kind: x.kind, state: this.states.get(x.id) ?? x.initial }));
      const trays = travellers.filter((x) => x.kind === 'tray');
      if (trays.length === 0 || trays.every((x) => closed(x.state))) continue;
      orders.push({
        id: o.id,
        number: o.number,
        dueDate: o.dueDate,
        releasedAt: o.releasedAt,
        travellers,
        routing: {
          tray: list.find((x) => x.kind === 'tray')?.routing ?? [],
          mould: list.find((x) => x.kind === 'mould')?.routing ?? [],
        },
      });
    }
    const since = t - this.windowDays * DAY;
    return {
      now: t,
      orders,
      measured: {
        queues: this.queues.filter((q) => q.startedAt >= since),
        processes: this.processes.filter((p) => p.finishedAt >= since),
        dispatches: this.dispatches.filter((d) => d.startedAt >= since),
        holds: this.holds.filter((h) => h.releasedAt >= since),
      },
    };
  }
}

/** A stored step run (the server keeps them beside the scan log), for `measuredFromRuns`. */
export interface StepRunFact {
  orderId: string;
  trayId: string;
  travellerKind: TravellerKind;
  stepSeq: number;
  stationKind: string;
  stationId: string | null;
  readyAt: number;
  startedAt: number;
  finishedAt: number;
  implicit: boolean;
  /** the step's standard minutes for the pieces that went in; null when its routing is gone */
  standardMinutes: number | null;
  cure: boolean;
}

/**
 * What the floor measured, from stored step runs and hold scans: the same records the replay
 * makes (waits net of holds, strikes and casts waiting from the moulds' readiness, the head of
 * each order's trays marked, one dispatch wait per order from its last packed tray).
 */
export function measuredFromRuns(
  runs: readonly StepRunFact[],
  holdScans: readonly { trayId: string; type: 'hold' | 'release'; occurredAt: number }[],
): MeasuredHistory {
  const holds: HoldRecord[] = [];
  const open = new Map<string, number>();
  for (const h of holdScans) {
    if (h.type === 'hold') open.set(h.trayId, h.occurredAt);
    else {
      const from = open.get(h.trayId);
      open.delete(h.trayId);
      if (from != null) holds.push({ trayId: h.trayId, heldAt: from, releasedAt: h.occurredAt });
    }
  }
  const holdsOf = new Map<string, HoldRecord[]>();
  for (const h of holds) (holdsOf.get(h.trayId) ?? holdsOf.set(h.trayId, []).get(h.trayId)!).push(h);
  const mouldsDone = new Map<string, number>();
  const lastPack = new Map<string, number>();
  const firstDispatch = new Map<string, number>();
  const leadStart = new Map<string, number>();
  for (const r of runs) {
    if (r.travellerKind === 'mould' && r.stationKind === 'mould_check') mouldsDone.set(r.orderId, Math.max(mouldsDone.get(r.orderId) ?? 0, r.finishedAt));
    if (r.travellerKind === 'tray' && r.stationKind === 'pack') lastPack.set(r.orderId, Math.max(lastPack.get(r.orderId) ?? 0, r.finishedAt));
    if (r.travellerKind === 'tray' && ORDER_LEVEL_KINDS.includes(r.stationKind))
      firstDispatch.set(r.orderId, Math.min(firstDispatch.get(r.orderId) ?? Infinity, r.startedAt));
    const key = `${r.orderId}|${r.travellerKind}|${r.stepSeq}`;
    leadStart.set(key, Math.min(leadStart.get(key) ?? Infinity, r.startedAt));
  }
  const queues: QueueRecord[] = [];
  const processes: ProcessRecord[] = [];
  const led = new Set<string>();
  for (const r of [...runs].sort((a, b) => a.startedAt - b.startedAt)) {
    let held = 0;
    for (const h of holdsOf.get(r.trayId) ?? []) if (h.heldAt >= r.readyAt && h.releasedAt <= r.startedAt) held += h.releasedAt - h.heldAt;
    let readyAt = Math.min(r.startedAt, r.readyAt + held);
    const moulds = mouldsDone.get(r.orderId);
    if (r.travellerKind === 'tray' && MOULD_USING_KINDS.includes(r.stationKind as StationKind) && moulds != null)
      readyAt = Math.min(r.startedAt, Math.max(readyAt, moulds));
    const key = `${r.orderId}|${r.travellerKind}|${r.stepSeq}`;
    const lead = !led.has(key) && leadStart.get(key) === r.startedAt;
    if (lead) led.add(key);
    queues.push({
      stationKind: r.stationKind,
      travellerKind: r.travellerKind,
      orderId: r.orderId,
      stationId: r.stationId,
      readyAt,
      startedAt: r.startedAt,
      lead,
    });
    if (!r.implicit && r.standardMinutes != null)
      processes.push({
        stationKind: r.stationKind,
        stationId: r.stationId,
        startedAt: r.startedAt,
        finishedAt: r.finishedAt,
        standardMinutes: r.standardMinutes,
        cure: r.cure,
      });
  }
  const dispatches: DispatchRecord[] = [];
  for (const [orderId, startedAt] of firstDispatch) {
    const packed = lastPack.get(orderId);
    if (packed != null && packed <= startedAt) dispatches.push({ orderId, lastPackedAt: packed, startedAt });
  }
  return { queues, processes, dispatches, holds };
}
