// The demo factory's floor, simulated: a small discrete-event simulation that moves every
// traveller through its routing, station by station, and writes down the scans an operator
// would have made. Every scan goes through the product's own guard (see floor/scan-writer.ts),
// so the history can never hold a sequence the product would refuse, and the final tray states
// are the guard's own.
//
// The model (invented, but shaped like a small badge factory), one job per module:
// - floor/demo-clock.ts: the shifts on the factory calendar, plating loads and the courier;
// - floor/job-queue.ts: travellers wait by the moment they are ready (first come, first served);
// - floor/station-pool.ts: each station works on as many trays at once as its capacity; the oven
//   cures around the clock but is loaded during shifts only;
// - floor/piece-counts.ts: process times scatter around the standard minutes (log-normal); some
//   pieces are scrapped with a reason, a few reworked;
// - this file: the step a traveller takes next, and the floor's incidents: a few trays put on
//   hold and released, some orders held, a supervisor's overrides and a few refused scans.
import { standardMinutes, initialTrayState, type RoutingStep, type StationKind } from '@shared/domain/vocabulary';
import { cures } from '@shared/domain/traveller';
import { DAY, iso } from '@shared/domain/time-zone';
import { MINUTE } from '@shared/domain/calendar';
import type { Rng } from './prng';
import { addWorking, COURIER_PICKUP, HOUR, nextFixed, nextWorking, PLATING_LOADS, toSecond } from './floor/demo-clock';
import { JobQueue } from './floor/job-queue';
import { ONE_MOULD, pieceCounts } from './floor/piece-counts';
import { ScanWriter } from './floor/scan-writer';
import { StationPool, type Slot } from './floor/station-pool';
import type { Live, OrderRun, SimInput, SimOverride, SimResult } from './floor/types';

// The backtest's demo floor (server/backtest/demo-floor.ts) takes the demo clock from here.
export { DAY } from '@shared/domain/time-zone';
export { MINUTE } from '@shared/domain/calendar';
export { DEMO_SHIFTS, DEMO_WORKDAYS, HOUR, nextWorking } from './floor/demo-clock';
export type { SimEvent, SimInput, SimOrder, SimOverride, SimPeople, SimRejection, SimResult, SimStation, SimTraveller } from './floor/types';

/** Everything one run of the simulation carries along. */
interface Floor {
  rng: Rng;
  now: number;
  holdReasons: string[];
  orders: Map<string, OrderRun>;
  pool: StationPool;
  writer: ScanWriter;
  queue: JobQueue;
  overrides: SimOverride[];
  packedAt: Map<string, number>;
  finishedAt: Map<string, number>;
  /** refused scans made so far, by kind (each kind is made a few times only) */
  rejected: Record<string, number>;
  curingOverrideUsed: boolean;
  wrongStationOverrideUsed: boolean;
}

export function simulateFloor(input: SimInput): SimResult {
  const { rng, now } = input;
  const orders = new Map<string, OrderRun>();
  for (const o of input.orders) orders.set(o.id, { ...o, trays: [], moulds: [], mouldsLeft: 0, mouldsReadyAt: null, dispatchWaiting: new Map() });
  const pool = new StationPool(input.stations, input.people, rng);
  const floor: Floor = {
    rng,
    now,
    holdReasons: input.reasonCodes.filter((r) => r.kind === 'hold').map((r) => r.code),
    orders,
    pool,
    writer: new ScanWriter(rng, now, input.people, pool, orders, input.reasonCodes),
    queue: new JobQueue(),
    overrides: [],
    packedAt: new Map(),
    finishedAt: new Map(),
    rejected: {},
    curingOverrideUsed: false,
    wrongStationOverrideUsed: false,
  };
  const live = input.travellers.map(toLive);
  for (const t of live) {
    const o = orders.get(t.orderId)!;
    if (t.kind === 'mould') {
      o.moulds.push(t);
      o.mouldsLeft += 1;
    } else o.trays.push(t);
  }
  // the moulds are made first; an order's trays start when all its moulds are ready
  for (const o of orders.values()) {
    if (!o.startsOnFloor) continue;
    for (const m of o.moulds) floor.queue.push(o.releasedAt + rng.int(5, 60) * MINUTE, m);
  }

  for (let job = floor.queue.pop(); job; job = floor.queue.pop()) if (!job.t.stopped) nextStep(floor, job.t, job.at);
  holdOrders(floor);

  const { writer, overrides, packedAt, finishedAt } = floor;
  return { events: writer.events, states: new Map(live.map((t) => [t.id, t.state])), rejections: writer.rejections, overrides, packedAt, finishedAt };
}

function toLive(t: SimInput['travellers'][number]): Live {
  return {
    ...t,
    state: t.initial ?? initialTrayState({ trayId: t.id, kind: t.kind, quantity: t.quantity, releasedAt: iso(t.releasedAt) }),
    nextSeq: t.initial?.stepSeq ?? 1,
    stopped: false,
    hadHold: false,
    dispatchCleared: false,
    last: t.releasedAt,
    lastReceived: t.releasedAt,
  };
}

const recent = (f: Floor, at: number, days: number) => at >= f.now - days * DAY && at <= f.now;
const count = (f: Floor, kind: string) => (f.rejected[kind] = (f.rejected[kind] ?? 0) + 1);
const stop = (t: Live) => void (t.stopped = true);

/** The traveller `t`, ready at `ready`, takes its next step (or waits, or stops at the end of the history). */
function nextStep(f: Floor, t: Live, ready: number): void {
  const o = f.orders.get(t.orderId)!;
  const step = t.routing[t.nextSeq - 1];
  if (t.kind === 'tray' && step.stationKind === 'dispatch' && !t.dispatchCleared) return waitForCourier(f, t, o, ready);

  const released = holdNowAndThen(f, t, o, step, ready);
  if (released == null) return;
  ready = released;

  const trim = trimOnPostBench(f, t, step, ready);
  const slot = f.pool.freestSlot(trim ? 'post' : step.stationKind);
  const person = f.pool.crewFor(step.stationKind);
  const personHeld = f.pool.personMinutes(step.stationKind);
  let start = Math.max(ready, slot.freeAt, personHeld === 0 ? 0 : f.pool.personFreeAt(person));
  start = toSecond(step.stationKind === 'plate' ? nextFixed(start, PLATING_LOADS) : nextWorking(start));

  const byHand = trim ? null : cureCheckedByHand(f, t, step, ready, slot);
  if (byHand) start = byHand.at;
  const override = trim ?? byHand?.override ?? null;

  if ((o.holdAt != null && start >= o.holdAt) || start > f.now) return stop(t);
  refusedNearNow(f, t, step, start, slot);

  if (override) {
    override.stationId = slot.station.id;
    if (override.kind === 'wrong_station') {
      override.createdAt = start - 3 * MINUTE;
      override.expiresAt = start + 12 * MINUTE;
    }
    f.overrides.push(override);
  }
  const started = f.writer.scan(t, 'start', start, slot.station, { override, userId: person });
  if (started.ok && started.facts.stepSeq !== step.seq)
    throw new Error(`demo history: ${t.number} started step ${started.facts.stepSeq}, expected ${step.seq}`);
  t.nextSeq = step.seq;
  if (personHeld != null) f.pool.setPersonBusy(person, toSecond(addWorking(start, personHeld)));

  if (cures(step.stationKind)) cureStep(f, t, step, start, slot);
  else workStep(f, t, step, start, slot, person, personHeld);
}

/** The courier takes an order when every living tray of it is packed (not one kept back). */
function waitForCourier(f: Floor, t: Live, o: OrderRun, ready: number): void {
  o.dispatchWaiting.set(t.id, ready);
  const living = o.trays.filter((x) => x.state.phase !== 'scrapped');
  if (!living.every((x) => o.dispatchWaiting.has(x.id)) || o.keepFromCourier) return;
  const allPacked = Math.max(...o.dispatchWaiting.values());
  const pickup = nextFixed(allPacked + 10 * MINUTE, [COURIER_PICKUP]);
  for (const x of living) {
    x.dispatchCleared = true;
    f.queue.push(pickup, x);
  }
}

/**
 * A tray now and then waits for a decision (quality, material) and is released. Returns when
 * the tray is ready again, or null when it is still on hold at the end of the history.
 */
function holdNowAndThen(f: Floor, t: Live, o: OrderRun, step: RoutingStep, ready: number): number | null {
  const { rng, writer, pool } = f;
  if (!(t.kind === 'tray' && o.holdAt == null && t.nextSeq > 1 && !t.hadHold && step.stationKind !== 'dispatch' && rng.chance(0.004))) return ready;
  const holdAt = toSecond(nextWorking(ready + rng.int(2, 40) * MINUTE));
  if (holdAt > f.now || t.state.phase !== 'waiting') return ready;
  t.hadHold = true;
  const reason = rng.pick(f.holdReasons.filter((r) => r !== 'hold_customer'));
  const where = pool.firstStation(step.stationKind);
  writer.scan(t, 'hold', holdAt, where, {
    userId: pool.supervisor(),
    reason,
    note: reason === 'hold_material' ? 'Backing stock short; waiting for delivery' : 'Shade looks off against the proof',
  });
  const releaseAt = toSecond(addWorking(holdAt, rng.int(60, 900)));
  if (releaseAt > f.now) {
    stop(t);
    // an operator tries to start the held tray
    if (rng.chance(0.6) && !(f.rejected.on_hold >= 1)) {
      const tryAt = toSecond(nextWorking(holdAt + rng.int(30, 120) * MINUTE));
      if (writer.refused(t, 'start', tryAt, where)) count(f, 'on_hold');
    }
    return null;
  }
  writer.scan(t, 'release', releaseAt, where, { userId: pool.supervisor() });
  return releaseAt + rng.int(1, 20) * MINUTE;
}

/**
 * A supervisor lets one tray be trimmed at the post bench (the trimming bench was down): a
 * wrong-station override does the awaited step at another station, it never skips one.
 */
function trimOnPostBench(f: Floor, t: Live, step: RoutingStep, ready: number): SimOverride | null {
  if (f.wrongStationOverrideUsed || t.kind !== 'tray' || step.stationKind !== 'trim' || !recent(f, ready, 20) || ready >= f.now - 3 * DAY) return null;
  if (t.routing[t.nextSeq]?.stationKind !== 'post') return null;
  f.wrongStationOverrideUsed = true;
  return {
    id: f.rng.uuid(),
    trayId: t.id,
    stationId: '',
    kind: 'wrong_station',
    supervisorId: f.pool.supervisor(),
    reason: 'Trimming bench down; trimmed on the post bench',
    createdAt: 0,
    expiresAt: 0,
    usedEventId: '',
  };
}

/** The cure interlock, overridden once by a supervisor (oven ran hot, cure checked by hand): the tray starts 15 minutes early. */
function cureCheckedByHand(f: Floor, t: Live, step: RoutingStep, ready: number, slot: Slot): { override: SimOverride; at: number } | null {
  const { state } = t;
  if (f.curingOverrideUsed || t.kind !== 'tray' || step.stationKind !== 'fill' || state.phase !== 'curing' || !state.cureReadyAt) return null;
  if (!recent(f, ready, 21) || ready >= f.now - 6 * HOUR) return null;
  const early = Date.parse(state.cureReadyAt) - 15 * MINUTE;
  if (nextWorking(early) !== early || slot.freeAt > early || early <= t.last) return null;
  f.curingOverrideUsed = true;
  const override: SimOverride = {
    id: f.rng.uuid(),
    trayId: t.id,
    stationId: slot.station.id,
    kind: 'curing',
    supervisorId: f.pool.supervisor(),
    reason: 'Oven ran hot this load; cure checked by hand',
    createdAt: early - 2 * MINUTE,
    expiresAt: early + 13 * MINUTE,
    usedEventId: '',
  };
  return { override, at: early };
}

/** A few refused scans in the last days, as operators make them: too early out of the oven, at the wrong bench. */
function refusedNearNow(f: Floor, t: Live, step: RoutingStep, start: number, slot: Slot): void {
  const { rng, writer, rejected } = f;
  const { state } = t;
  if (t.kind !== 'tray' || !recent(f, start, 10)) return;
  if (step.stationKind === 'fill' && state.phase === 'curing' && state.cureReadyAt && !(rejected.curing >= 3) && rng.chance(0.4)) {
    const early = toSecond(Date.parse(state.cureReadyAt) - rng.int(20, 55) * MINUTE);
    if (nextWorking(early) === early && writer.refused(t, 'start', early, slot.station)) count(f, 'curing');
  } else if ((step.stationKind === 'stone' || step.stationKind === 'polish') && !(rejected.wrong_station >= 2) && rng.chance(0.3)) {
    const other = f.pool.firstStation(step.stationKind === 'stone' ? 'polish' : 'plate');
    if (writer.refused(t, 'start', toSecond(start - rng.int(3, 9) * MINUTE), other)) count(f, 'wrong_station');
  }
}

/** A curing step: the oven holds the tray for the cure time; now and then it is scanned out by hand. */
function cureStep(f: Floor, t: Live, step: RoutingStep, start: number, slot: Slot): void {
  const { rng, writer } = f;
  const readyAt = start + (step.cureMinutes ?? 0) * MINUTE;
  slot.freeAt = readyAt;
  const last = step.seq === t.routing.length;
  if (last || rng.chance(0.3)) {
    // scanned out of the oven by hand (cracked pieces counted there)
    const out = toSecond(nextWorking(readyAt + rng.int(0, 30) * MINUTE));
    if (out <= f.now) {
      slot.freeAt = out;
      const c = pieceCounts(rng, step.stationKind, t.state.quantity);
      writer.scan(t, 'finish', out, slot.station, { good: c.good, scrap: c.scrap, reason: c.reason });
      if (last) return travellerDone(f, t, out);
      t.nextSeq = step.seq + 1;
      f.queue.push(out + rng.int(1, 25) * MINUTE, t);
      return;
    }
    if (last) return stop(t);
  }
  t.nextSeq = step.seq + 1;
  f.queue.push(readyAt + rng.int(0, 25) * MINUTE, t);
}

/** A step at a bench: the person works the standard minutes (scattered) in working time. */
function workStep(f: Floor, t: Live, step: RoutingStep, start: number, slot: Slot, person: string, personHeld: number | null): void {
  const { rng, writer } = f;
  const qty = t.kind === 'mould' ? 1 : t.state.quantity;
  const minutes = standardMinutes(step, qty) * rng.spread(0.25);
  const finish = toSecond(addWorking(start, minutes));
  slot.freeAt = finish;
  if (personHeld == null) f.pool.setPersonBusy(person, finish);
  if (finish > f.now) return stop(t);
  const c = t.kind === 'mould' ? ONE_MOULD : pieceCounts(rng, step.stationKind, qty);
  if (t.kind === 'tray' && step.stationKind === 'inspect' && recent(f, finish, 10) && !(f.rejected.quantity_mismatch >= 1) && rng.chance(0.4)) {
    // a typo on the count pad: good + scrap does not add up
    if (writer.refused(t, 'finish', finish - MINUTE, slot.station, { goodQty: c.good + 10, scrapQty: c.scrap, reworkQty: 0, scrapReason: c.reason }))
      count(f, 'quantity_mismatch');
  }
  writer.scan(t, 'finish', finish, slot.station, { good: c.good, scrap: c.scrap, rework: c.rework, reason: c.reason, note: c.note, userId: person });
  if (step.stationKind === 'pack') f.packedAt.set(t.id, finish);
  if (t.state.phase === 'done' || t.state.phase === 'scrapped') return travellerDone(f, t, finish);
  t.nextSeq = step.seq + 1;
  f.queue.push(finish + rng.int(1, 30) * MINUTE, t);
}

/** A traveller's last step is done; the last mould of an order lets its trays start. */
function travellerDone(f: Floor, t: Live, at: number): void {
  f.finishedAt.set(t.id, at);
  if (t.kind !== 'mould') return;
  const o = f.orders.get(t.orderId)!;
  o.mouldsLeft -= 1;
  if (o.mouldsLeft > 0) return;
  o.mouldsReadyAt = at;
  for (const tray of o.trays) f.queue.push(at + f.rng.int(5, 45) * MINUTE, tray);
}

const awaitedKind = (t: Live): StationKind => (t.routing[(t.state.stepSeq ?? 1) - 1] ?? t.routing[0]).stationKind;

/** Held orders: every traveller still on the floor is held (the customer asked to wait). */
function holdOrders(f: Floor): void {
  const { rng, writer, pool } = f;
  for (const o of f.orders.values()) {
    if (o.holdAt == null) continue;
    for (const t of [...o.moulds, ...o.trays]) {
      if (t.state.phase === 'done' || t.state.phase === 'scrapped' || t.state.onHold) continue;
      const at = toSecond(Math.max(o.holdAt, t.last + MINUTE));
      if (at > f.now) continue;
      writer.scan(t, 'hold', at, pool.firstStation(awaitedKind(t)), { userId: pool.supervisor(), reason: 'hold_customer', note: o.holdNote });
    }
    const held = o.trays.find((t) => t.state.onHold && t.state.phase === 'waiting');
    if (held && !(f.rejected.on_hold >= 2)) {
      const at = toSecond(nextWorking(held.last + rng.int(60, 240) * MINUTE));
      if (writer.refused(held, 'start', at, pool.firstStation(awaitedKind(held)))) count(f, 'on_hold');
    }
  }
}
