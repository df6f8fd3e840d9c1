// The demo factory's floor, simulated: a small discrete-event simulation that moves every
// traveller through its routing, station by station, and writes down the scans an operator
// would have made. Every scan goes through the product's own guard (`evaluateScan`, with
// `now` = the moment of the scan), so the history can never hold a sequence the product
// would refuse, and the final tray states are the guard's own.
//
// The model (invented, but shaped like a small badge factory):
// - Shifts Mon–Sat 08:00–12:00 and 13:00–17:30 factory time (Asia/Shanghai, no daylight
//   saving). Work started near the end of a shift carries on the next morning.
// - Each station works on as many trays at once as its capacity; a tray waits for the first
//   free place (first come, first served). The oven cures around the clock but is loaded
//   during shifts only; plating runs in loads at fixed times of day; the courier collects at
//   16:30, once every tray of the order is packed.
// - Process times scatter around the standard minutes (log-normal); cure times are respected.
// - Some pieces are scrapped with a reason, a few reworked; a few trays are put on hold and
//   released; some orders are held.
import { PriorityQueue } from '@shared/domain/priority-queue';
import type { GuardInput, ValidOverride } from '@shared/domain/guards';
import { evaluateScan } from '@shared/domain/guards';
import { refusalText } from '@shared/domain/scan-messages';
import type { Role, RoutingStep, ScanType, StationKind, TrayState } from '@shared/domain/vocabulary';
import { initialTrayState, standardMinutes } from '@shared/domain/vocabulary';
import type { Rng } from './prng';
import { DEFAULT_REASON_CODES } from './base';
import { cures } from '@shared/domain/traveller';

const REASON_NAMES = new Map(DEFAULT_REASON_CODES.map((r) => [r.code, r.name]));
/** Refusal texts name a hold reason, as the scan service writes them. */
const named = (params: Record<string, string | number | null>) =>
  typeof params.holdReason === 'string' && REASON_NAMES.has(params.holdReason) ? { ...params, holdReason: REASON_NAMES.get(params.holdReason)! } : params;

export const MINUTE = 60_000;
export const HOUR = 60 * MINUTE;
export const DAY = 24 * HOUR;
/** Asia/Shanghai: UTC+8 all year (no daylight saving since 1991). */
export const FACTORY_UTC_OFFSET_MS = 8 * HOUR;
/** Shifts in minutes after local midnight, Monday to Saturday (weekday 1–6; 0 = Sunday). */
export const DEMO_SHIFTS = [
  { start: 8 * 60, end: 12 * 60 },
  { start: 13 * 60, end: 17 * 60 + 30 },
];
export const DEMO_WORKDAYS = [1, 2, 3, 4, 5, 6];
const PLATING_LOADS = [8 * 60 + 30, 10 * 60 + 30, 14 * 60, 16 * 60];
const COURIER_PICKUP = 16 * 60 + 30;

function local(t: number) {
  const l = t + FACTORY_UTC_OFFSET_MS;
  const day = Math.floor(l / DAY);
  return { dayStart: day * DAY - FACTORY_UTC_OFFSET_MS, minute: (l - day * DAY) / MINUTE, weekday: (day + 4) % 7 };
}

/** The first working moment at or after `t`. */
export function nextWorking(t: number): number {
  let cur = t;
  for (let i = 0; i < 14; i++) {
    const { dayStart, minute, weekday } = local(cur);
    if (DEMO_WORKDAYS.includes(weekday)) {
      for (const s of DEMO_SHIFTS) if (minute < s.end) return Math.max(cur, dayStart + s.start * MINUTE);
    }
    cur = dayStart + DAY;
  }
  throw new Error('no working time within two weeks');
}

function shiftEnd(t: number): number {
  const { dayStart, minute } = local(t);
  const s = DEMO_SHIFTS.find((x) => minute >= x.start && minute < x.end);
  if (!s) throw new Error('not in a shift');
  return dayStart + s.end * MINUTE;
}

/** `minutes` of working time after `t` (work stops between shifts and carries on). */
export function addWorking(t: number, minutes: number): number {
  let cur = nextWorking(t);
  let left = minutes * MINUTE;
  for (;;) {
    const end = shiftEnd(cur);
    if (cur + left <= end) return cur + left;
    left -= end - cur;
    cur = nextWorking(end);
  }
}

/** The next of the day's fixed times (plating loads, courier) at or after `t`, on a working day. */
function nextFixed(t: number, times: readonly number[]): number {
  let cur = nextWorking(t);
  for (let i = 0; i < 14; i++) {
    const { dayStart, minute, weekday } = local(cur);
    if (DEMO_WORKDAYS.includes(weekday)) {
      const m = times.find((x) => x >= minute);
      if (m != null) return dayStart + m * MINUTE;
    }
    cur = nextWorking(dayStart + DAY);
  }
  throw new Error('no fixed time within two weeks');
}

const sec = (t: number) => Math.round(t / 1000) * 1000;
const iso = (t: number) => new Date(t).toISOString();

// ---------------------------------------------------------------------------------------

export interface SimStation {
  id: string;
  code: string;
  name: string;
  kind: StationKind;
  capacity: number;
  deviceId: string;
}

export interface SimTraveller {
  id: string;
  number: string;
  kind: 'tray' | 'mould';
  orderId: string;
  /** for a mould traveller: the mould it makes or checks */
  mouldId?: string | null;
  quantity: number;
  releasedAt: number;
  routing: RoutingStep[];
  /** the state the release wrote (default: waiting for step 1) */
  initial?: TrayState;
}

export interface SimOrder {
  id: string;
  releasedAt: number;
  /** false: released but nothing scanned yet */
  startsOnFloor: boolean;
  /** the whole order is put on hold from this moment */
  holdAt: number | null;
  holdNote: string | null;
  /** packed and kept back (not collected by the courier) */
  keepFromCourier: boolean;
}

export interface SimPeople {
  operatorsByKind: Partial<Record<StationKind, string[]>>;
  supervisors: string[];
  roleOf: ReadonlyMap<string, Role>;
}

export interface SimEvent {
  id: string;
  trayId: string;
  type: ScanType;
  stepSeq: number | null;
  stationId: string;
  stationKind: StationKind;
  deviceId: string;
  userId: string;
  occurredAt: number;
  receivedAt: number;
  qtyIn: number | null;
  goodQty: number | null;
  scrapQty: number | null;
  reworkQty: number | null;
  scrapReason: string | null;
  overrideId: string | null;
  note: string | null;
}

export interface SimRejection {
  id: string;
  eventId: string;
  trayId: string;
  stationId: string;
  deviceId: string;
  userId: string;
  code: string;
  message: string;
  payload: Record<string, unknown>;
  occurredAt: number;
  receivedAt: number;
}

export interface SimOverride {
  id: string;
  trayId: string;
  stationId: string;
  kind: 'wrong_station' | 'curing';
  supervisorId: string;
  reason: string;
  createdAt: number;
  expiresAt: number;
  usedEventId: string;
}

export interface SimResult {
  events: SimEvent[];
  states: Map<string, TrayState>;
  rejections: SimRejection[];
  overrides: SimOverride[];
  /** per traveller: when its pack step finished and when its last step finished */
  packedAt: Map<string, number>;
  finishedAt: Map<string, number>;
}

export interface SimInput {
  rng: Rng;
  now: number;
  stations: SimStation[];
  people: SimPeople;
  orders: SimOrder[];
  travellers: SimTraveller[];
  /** every reason code the admin has (scrap, rework and hold) */
  reasonCodes: readonly { code: string; kind: 'scrap' | 'rework' | 'hold'; stationKind?: StationKind | null }[];
}

interface Live extends SimTraveller {
  state: TrayState;
  /** seq of the next step to do */
  nextSeq: number;
  stopped: boolean;
  hadHold: boolean;
  dispatchCleared: boolean;
  last: number;
  lastReceived: number;
}

interface OrderRun extends SimOrder {
  trays: Live[];
  moulds: Live[];
  mouldsLeft: number;
  mouldsReadyAt: number | null;
  dispatchWaiting: Map<string, number>;
}

/** Chance that a step scraps some pieces, and how many (fraction of the pieces in). */
const SCRAP: Partial<Record<StationKind, { p: number; max: number; reasons: string[] }>> = {
  strike: { p: 0.3, max: 0.02, reasons: ['misstrike'] },
  cast: { p: 0.45, max: 0.035, reasons: ['casting_porosity'] },
  trim: { p: 0.1, max: 0.01, reasons: ['scratch'] },
  post: { p: 0.25, max: 0.015, reasons: ['bent_post'] },
  solder: { p: 0.2, max: 0.015, reasons: ['solder_joint'] },
  fill: { p: 0.12, max: 0.015, reasons: ['colour_bleed', 'wrong_colour'] },
  cure: { p: 0.3, max: 0.01, reasons: ['colour_bleed'] },
  stone: { p: 0.2, max: 0.015, reasons: ['over_stoned'] },
  polish: { p: 0.1, max: 0.01, reasons: ['scratch'] },
  sandblast: { p: 0.12, max: 0.01, reasons: ['blast_uneven'] },
  plate: { p: 0.25, max: 0.03, reasons: ['plating_defect'] },
  antique: { p: 0.2, max: 0.015, reasons: ['antique_uneven'] },
  print: { p: 0.25, max: 0.025, reasons: ['print_misregister'] },
  epoxy: { p: 0.3, max: 0.02, reasons: ['epoxy_bubble'] },
  inspect: { p: 0.55, max: 0.02, reasons: ['scratch', 'colour_bleed', 'plating_defect'] },
  pack: { p: 0.04, max: 0.004, reasons: ['counting_loss'] },
};

/** Minutes a station's work holds the person (absent: the whole process time). The oven and the
 * plating bath work on their own once loaded; the courier collects. */
const PERSON_MINUTES: Partial<Record<StationKind, number>> = { cure: 5, plate: 0, dispatch: 0 };

/** The simulator's clock: jobs by time, ties in the order they were queued. */
class Heap {
  private queue = new PriorityQueue<{ at: number; n: number; t: Live }>((x, y) => x.at < y.at || (x.at === y.at && x.n < y.n));
  private counter = 0;
  get size() {
    return this.queue.size;
  }
  push(at: number, t: Live) {
    this.queue.push({ at, n: this.counter++, t });
  }
  pop() {
    return this.queue.pop()!;
  }
}

export function simulateFloor(input: SimInput): SimResult {
  const { rng, now, people } = input;
  const reasonList = input.reasonCodes.map((r) => r.code);
  const holdReasons = input.reasonCodes.filter((r) => r.kind === 'hold').map((r) => r.code);
  const events: SimEvent[] = [];
  const rejections: SimRejection[] = [];
  const overrides: SimOverride[] = [];
  const packedAt = new Map<string, number>();
  const finishedAt = new Map<string, number>();

  const slots = new Map<StationKind, { station: SimStation; freeAt: number }[]>();
  for (const s of input.stations) {
    const list = slots.get(s.kind) ?? [];
    for (let i = 0; i < s.capacity; i++) list.push({ station: s, freeAt: 0 });
    slots.set(s.kind, list);
  }
  const firstStation = (kind: StationKind) => {
    const list = slots.get(kind);
    if (!list?.length) throw new Error(`no station of kind ${kind}`);
    return list[0].station;
  };

  const orders = new Map<string, OrderRun>();
  for (const o of input.orders) orders.set(o.id, { ...o, trays: [], moulds: [], mouldsLeft: 0, mouldsReadyAt: null, dispatchWaiting: new Map() });
  const live: Live[] = input.travellers.map((t) => ({
    ...t,
    state: t.initial ?? initialTrayState({ trayId: t.id, kind: t.kind, quantity: t.quantity, releasedAt: iso(t.releasedAt) }),
    nextSeq: t.initial?.stepSeq ?? 1,
    stopped: false,
    hadHold: false,
    dispatchCleared: false,
    last: t.releasedAt,
    lastReceived: t.releasedAt,
  }));
  for (const t of live) {
    const o = orders.get(t.orderId)!;
    if (t.kind === 'mould') {
      o.moulds.push(t);
      o.mouldsLeft += 1;
    } else o.trays.push(t);
  }

  const operatorFor = (kind: StationKind) => rng.pick(people.operatorsByKind[kind] ?? people.supervisors);
  const busyUntil = new Map<string, number>();
  /** the crew member of this station kind who is free first */
  const crewFor = (kind: StationKind) => {
    const crew = people.operatorsByKind[kind] ?? people.supervisors;
    let best = crew[0];
    for (const c of crew) if ((busyUntil.get(c) ?? 0) < (busyUntil.get(best) ?? 0)) best = c;
    return best;
  };
  const supervisor = () => rng.pick(people.supervisors);

  function guardInput(
    t: Live,
    type: ScanType,
    at: number,
    station: SimStation,
    extra: Partial<GuardInput['event']>,
    userId: string,
    override: ValidOverride | null,
  ): GuardInput {
    const o = orders.get(t.orderId)!;
    return {
      state: t.state,
      routing: t.routing,
      station: { id: station.id, kind: station.kind, name: station.name },
      event: { type, occurredAt: iso(at), ...extra },
      now: at,
      mouldReady: o.mouldsReadyAt != null && o.mouldsReadyAt <= at,
      override,
      actorRole: people.roleOf.get(userId) ?? null,
      reasonCodes: reasonList,
    };
  }

  function emit(
    t: Live,
    type: ScanType,
    at: number,
    station: SimStation,
    opts: { userId?: string; good?: number; scrap?: number; rework?: number; reason?: string | null; note?: string | null; override?: SimOverride | null } = {},
  ) {
    if ((type === 'hold' || type === 'release') && at <= t.last) at = t.last + 1000;
    if (at < t.last) throw new Error(`demo history: ${t.number} ${type} at ${iso(at)} is before its last event ${iso(t.last)}`);
    const userId = opts.userId ?? operatorFor(station.kind);
    const extra: Partial<GuardInput['event']> = {};
    if (type === 'finish')
      Object.assign(extra, { goodQty: opts.good, scrapQty: opts.scrap ?? 0, reworkQty: opts.rework ?? 0, scrapReason: opts.reason ?? null });
    if (type === 'hold') Object.assign(extra, { scrapReason: opts.reason ?? null, note: opts.note ?? null });
    const override = opts.override
      ? { id: opts.override.id, supervisorId: opts.override.supervisorId, reason: opts.override.reason, kind: opts.override.kind }
      : null;
    const qtyIn = t.state.quantity;
    const res = evaluateScan(guardInput(t, type, at, station, extra, userId, override));
    if (!res.ok) {
      throw new Error(`demo history: ${t.number} ${type} at ${station.code} ${iso(at)} refused: ${res.code} ${JSON.stringify(res.params)}`);
    }
    t.state = res.next;
    t.last = at;
    const id = rng.uuid();
    if (opts.override) opts.override.usedEventId = id;
    // most scans reach the server within seconds; now and then a tablet was offline for a while
    // (a traveller's scans still arrive in the order they happened)
    const receivedAt = Math.max(t.lastReceived, Math.min(now, at + (rng.chance(0.02) ? rng.int(5, 75) * MINUTE : rng.int(1, 25) * 1000)));
    t.lastReceived = receivedAt;
    events.push({
      id,
      trayId: t.id,
      type,
      stepSeq: res.facts.stepSeq,
      stationId: station.id,
      stationKind: station.kind,
      deviceId: station.deviceId,
      userId,
      occurredAt: at,
      receivedAt,
      qtyIn: type === 'start' || type === 'finish' ? qtyIn : null,
      goodQty: type === 'finish' ? (opts.good ?? null) : null,
      scrapQty: type === 'finish' ? (opts.scrap ?? 0) : null,
      reworkQty: type === 'finish' ? (opts.rework ?? 0) : null,
      scrapReason: type === 'finish' ? (opts.reason ?? null) : type === 'hold' ? (opts.reason ?? null) : null,
      overrideId: opts.override?.id ?? null,
      note: opts.note ?? null,
    });
    return res;
  }

  /** A scan an operator tried that the guard refuses: kept, unresolved, for the supervisor. */
  function attempt(t: Live, type: ScanType, at: number, station: SimStation, extra: Partial<GuardInput['event']> = {}): boolean {
    if (at > now || at < t.last) return false;
    const userId = operatorFor(station.kind);
    const res = evaluateScan(guardInput(t, type, at, station, extra, userId, null));
    if (res.ok) return false;
    const eventId = rng.uuid();
    rejections.push({
      id: rng.uuid(),
      eventId,
      trayId: t.id,
      stationId: station.id,
      deviceId: station.deviceId,
      userId,
      code: res.code,
      message: refusalText(res.code, named(res.params)),
      payload: { event: { id: eventId, code: t.number, stationId: station.id, type, occurredAt: iso(at), ...extra }, params: res.params },
      occurredAt: at,
      receivedAt: at + rng.int(1, 20) * 1000,
    });
    return true;
  }

  function counts(kind: StationKind, qty: number): { good: number; scrap: number; rework: number; reason: string | null; note: string | null } {
    const rule = SCRAP[kind];
    let scrap = 0;
    let reason: string | null = null;
    if (rule && qty > 1 && rng.chance(rule.p)) {
      scrap = Math.min(qty - 1, Math.max(1, Math.round(qty * rule.max * rng.next())));
      reason = rng.pick(rule.reasons);
    }
    const good = qty - scrap;
    let rework = 0;
    let note: string | null = null;
    if ((kind === 'fill' || kind === 'inspect') && good > 4 && rng.chance(0.07)) {
      rework = Math.min(good, rng.int(1, 4));
      note = kind === 'fill' ? 'Underfilled cells topped up' : 'Touched up and passed';
    }
    return { good, scrap, rework, reason, note };
  }

  const heap = new Heap();
  for (const o of orders.values()) {
    if (!o.startsOnFloor) continue;
    for (const m of o.moulds) heap.push(o.releasedAt + rng.int(5, 60) * MINUTE, m);
  }

  let curingOverrideUsed = false;
  let wrongStationOverrideUsed = false;
  const rejected: Record<string, number> = {};
  const recent = (at: number, days: number) => at >= now - days * DAY && at <= now;

  function travellerDone(t: Live, at: number) {
    finishedAt.set(t.id, at);
    const o = orders.get(t.orderId)!;
    if (t.kind === 'mould') {
      o.mouldsLeft -= 1;
      if (o.mouldsLeft === 0) {
        o.mouldsReadyAt = at;
        for (const tray of o.trays) heap.push(at + rng.int(5, 45) * MINUTE, tray);
      }
    }
  }

  while (heap.size) {
    const job = heap.pop();
    const t = job.t;
    if (t.stopped) continue;
    const o = orders.get(t.orderId)!;
    let ready = job.at;
    const step = t.routing[t.nextSeq - 1];

    // The courier takes an order when every tray of it is packed.
    if (t.kind === 'tray' && step.stationKind === 'dispatch' && !t.dispatchCleared) {
      o.dispatchWaiting.set(t.id, ready);
      const living = o.trays.filter((x) => x.state.phase !== 'scrapped');
      if (living.every((x) => o.dispatchWaiting.has(x.id)) && !o.keepFromCourier) {
        const allPacked = Math.max(...o.dispatchWaiting.values());
        const pickup = nextFixed(allPacked + 10 * MINUTE, [COURIER_PICKUP]);
        for (const x of living) {
          x.dispatchCleared = true;
          heap.push(pickup, x);
        }
      }
      continue;
    }

    // A tray now and then waits for a decision (quality, material) and is released.
    if (t.kind === 'tray' && o.holdAt == null && t.nextSeq > 1 && !t.hadHold && step.stationKind !== 'dispatch' && rng.chance(0.004)) {
      const holdAt = sec(nextWorking(ready + rng.int(2, 40) * MINUTE));
      if (holdAt <= now && t.state.phase === 'waiting') {
        t.hadHold = true;
        const reason = rng.pick(holdReasons.filter((r) => r !== 'hold_customer'));
        const where = firstStation(step.stationKind);
        emit(t, 'hold', holdAt, where, {
          userId: supervisor(),
          reason,
          note: reason === 'hold_material' ? 'Backing stock short; waiting for delivery' : 'Shade looks off against the proof',
        });
        const releaseAt = sec(addWorking(holdAt, rng.int(60, 900)));
        if (releaseAt > now) {
          t.stopped = true;
          if (rng.chance(0.6) && !(rejected.on_hold >= 1)) {
            const tryAt = sec(nextWorking(holdAt + rng.int(30, 120) * MINUTE));
            if (attempt(t, 'start', tryAt, where)) rejected.on_hold = (rejected.on_hold ?? 0) + 1;
          }
          continue;
        }
        emit(t, 'release', releaseAt, where, { userId: supervisor() });
        ready = releaseAt + rng.int(1, 20) * MINUTE;
      }
    }

    // A supervisor lets one tray be trimmed at the post bench (the trimming bench was down): a
    // wrong-station override does the awaited step at another station, it never skips one.
    let override: SimOverride | null = null;
    let standIn: StationKind | null = null;
    if (
      !wrongStationOverrideUsed &&
      t.kind === 'tray' &&
      step.stationKind === 'trim' &&
      recent(ready, 20) &&
      ready < now - 3 * DAY &&
      t.routing[t.nextSeq]?.stationKind === 'post'
    ) {
      wrongStationOverrideUsed = true;
      standIn = 'post';
      override = {
        id: rng.uuid(),
        trayId: t.id,
        stationId: '',
        kind: 'wrong_station',
        supervisorId: supervisor(),
        reason: 'Trimming bench down; trimmed on the post bench',
        createdAt: 0,
        expiresAt: 0,
        usedEventId: '',
      };
    }

    const candidates = slots.get(standIn ?? step.stationKind);
    if (!candidates?.length) throw new Error(`no station of kind ${standIn ?? step.stationKind}`);
    let slot = candidates[0];
    for (const c of candidates) if (c.freeAt < slot.freeAt) slot = c;
    const person = crewFor(step.stationKind);
    const personHeld = PERSON_MINUTES[step.stationKind];
    let start = Math.max(ready, slot.freeAt, personHeld === 0 ? 0 : (busyUntil.get(person) ?? 0));
    start = sec(step.stationKind === 'plate' ? nextFixed(start, PLATING_LOADS) : nextWorking(start));

    // The cure interlock, overridden once by a supervisor (oven ran hot, cure checked by hand).
    if (
      !override &&
      !curingOverrideUsed &&
      t.kind === 'tray' &&
      step.stationKind === 'fill' &&
      t.state.phase === 'curing' &&
      t.state.cureReadyAt &&
      recent(ready, 21) &&
      ready < now - 6 * HOUR
    ) {
      const early = Date.parse(t.state.cureReadyAt) - 15 * MINUTE;
      if (nextWorking(early) === early && slot.freeAt <= early && early > t.last) {
        curingOverrideUsed = true;
        start = early;
        override = {
          id: rng.uuid(),
          trayId: t.id,
          stationId: slot.station.id,
          kind: 'curing',
          supervisorId: supervisor(),
          reason: 'Oven ran hot this load; cure checked by hand',
          createdAt: early - 2 * MINUTE,
          expiresAt: early + 13 * MINUTE,
          usedEventId: '',
        };
      }
    }

    if (o.holdAt != null && start >= o.holdAt) {
      t.stopped = true;
      continue;
    }
    if (start > now) {
      t.stopped = true;
      continue;
    }

    // A few refused scans in the last days, as operators make them.
    if (t.kind === 'tray' && recent(start, 10)) {
      if (step.stationKind === 'fill' && t.state.phase === 'curing' && t.state.cureReadyAt && !(rejected.curing >= 3) && rng.chance(0.4)) {
        const early = sec(Date.parse(t.state.cureReadyAt) - rng.int(20, 55) * MINUTE);
        if (nextWorking(early) === early && attempt(t, 'start', early, slot.station)) rejected.curing = (rejected.curing ?? 0) + 1;
      } else if ((step.stationKind === 'stone' || step.stationKind === 'polish') && !(rejected.wrong_station >= 2) && rng.chance(0.3)) {
        const other = firstStation(step.stationKind === 'stone' ? 'polish' : 'plate');
        if (attempt(t, 'start', sec(start - rng.int(3, 9) * MINUTE), other)) rejected.wrong_station = (rejected.wrong_station ?? 0) + 1;
      }
    }

    if (override) {
      override.stationId = slot.station.id;
      if (override.kind === 'wrong_station') {
        override.createdAt = start - 3 * MINUTE;
        override.expiresAt = start + 12 * MINUTE;
      }
      overrides.push(override);
    }
    const started = emit(t, 'start', start, slot.station, { override, userId: person });
    if (started.ok && started.facts.stepSeq !== step.seq)
      throw new Error(`demo history: ${t.number} started step ${started.facts.stepSeq}, expected ${step.seq}`);
    t.nextSeq = step.seq;

    if (personHeld != null) busyUntil.set(person, sec(addWorking(start, personHeld)));

    if (cures(step.stationKind)) {
      const readyAt = start + (step.cureMinutes ?? 0) * MINUTE;
      slot.freeAt = readyAt;
      const last = step.seq === t.routing.length;
      if (last || rng.chance(0.3)) {
        // scanned out of the oven by hand (cracked pieces counted there)
        const out = sec(nextWorking(readyAt + rng.int(0, 30) * MINUTE));
        if (out > now) {
          if (last) {
            t.stopped = true;
            continue;
          }
        } else {
          slot.freeAt = out;
          const c = counts(step.stationKind, t.state.quantity);
          emit(t, 'finish', out, slot.station, { good: c.good, scrap: c.scrap, reason: c.reason });
          if (last) {
            travellerDone(t, out);
            continue;
          }
          t.nextSeq = step.seq + 1;
          heap.push(out + rng.int(1, 25) * MINUTE, t);
          continue;
        }
      }
      t.nextSeq = step.seq + 1;
      heap.push(readyAt + rng.int(0, 25) * MINUTE, t);
      continue;
    }

    const qty = t.kind === 'mould' ? 1 : t.state.quantity;
    const minutes = standardMinutes(step, qty) * rng.spread(0.25);
    const finish = sec(addWorking(start, minutes));
    slot.freeAt = finish;
    if (personHeld == null) busyUntil.set(person, finish);
    if (finish > now) {
      t.stopped = true;
      continue;
    }
    const c = t.kind === 'mould' ? { good: 1, scrap: 0, rework: 0, reason: null, note: null } : counts(step.stationKind, qty);
    if (t.kind === 'tray' && step.stationKind === 'inspect' && recent(finish, 10) && !(rejected.quantity_mismatch >= 1) && rng.chance(0.4)) {
      // a typo on the count pad: good + scrap does not add up
      if (attempt(t, 'finish', finish - MINUTE, slot.station, { goodQty: c.good + 10, scrapQty: c.scrap, reworkQty: 0, scrapReason: c.reason }))
        rejected.quantity_mismatch = (rejected.quantity_mismatch ?? 0) + 1;
    }
    emit(t, 'finish', finish, slot.station, { good: c.good, scrap: c.scrap, rework: c.rework, reason: c.reason, note: c.note, userId: person });
    if (step.stationKind === 'pack') packedAt.set(t.id, finish);
    if (t.state.phase === 'done' || t.state.phase === 'scrapped') {
      travellerDone(t, finish);
      continue;
    }
    t.nextSeq = step.seq + 1;
    heap.push(finish + rng.int(1, 30) * MINUTE, t);
  }

  // Held orders: every traveller still on the floor is held (the customer asked to wait).
  for (const o of orders.values()) {
    if (o.holdAt == null) continue;
    for (const t of [...o.moulds, ...o.trays]) {
      if (t.state.phase === 'done' || t.state.phase === 'scrapped' || t.state.onHold) continue;
      const at = sec(Math.max(o.holdAt, t.last + MINUTE));
      if (at > now) continue;
      const kind = (t.routing[(t.state.stepSeq ?? 1) - 1] ?? t.routing[0]).stationKind;
      emit(t, 'hold', at, firstStation(kind), { userId: supervisor(), reason: 'hold_customer', note: o.holdNote });
    }
    const held = o.trays.find((t) => t.state.onHold && t.state.phase === 'waiting');
    if (held && !(rejected.on_hold >= 2)) {
      const kind = t0Kind(held);
      const at = sec(nextWorking(held.last + rng.int(60, 240) * MINUTE));
      if (attempt(held, 'start', at, firstStation(kind))) rejected.on_hold = (rejected.on_hold ?? 0) + 1;
    }
  }

  function t0Kind(t: Live): StationKind {
    return (t.routing[(t.state.stepSeq ?? 1) - 1] ?? t.routing[0]).stationKind;
  }

  const states = new Map(live.map((t) => [t.id, t.state]));
  return { events, states, rejections, overrides, packedAt, finishedAt };
}
