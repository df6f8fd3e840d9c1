// One invented floor for the backtest: the demo factory's order book (planOrders), routed and
// split into trays as a release does it, run through the demo floor simulator (simulateFloor,
// every scan through the product's scan guards). Nothing touches a database: a floor of about
// ten weeks takes well under a second, so many floors can be made.
import { DEFAULT_ROUTING_TEMPLATES, expandRouting, mouldRouting, requiredMoulds } from '@shared/domain/routing';
import { releasedQuantity, splitIntoTrays } from '@shared/domain/trays';
import { initialTrayState, type Role, type RoutingStep, type StationKind, type TrayState } from '@shared/domain/vocabulary';
import { compileCalendar, type WorkingCalendar } from '@shared/domain/calendar';
import type { FloorHistory, HistoryOrder, HistoryTraveller } from '@shared/domain/floor-history';
import { DEFAULT_REASON_CODES, DEFAULT_STATIONS } from '../seed/base';
import { planOrders } from '../seed/demo-catalogue';
import { STATION_CREW } from '../seed/demo-crew';
import { makeRng } from '../seed/prng';
import { DAY, HOUR, MINUTE, nextWorking, simulateFloor, type SimOrder, type SimTraveller } from '../seed/simulate-floor';
import { demoCalendarConfig, factoryDate } from '../seed/floor/demo-clock';

export interface DemoFloor {
  seed: string;
  /** the simulated "now": the end of the history */
  end: number;
  start: number;
  history: FloorHistory;
  calendar: WorkingCalendar;
  stations: { id: string; kind: StationKind; capacityTrays: number }[];
  /** each traveller's state at the end, as the simulator's guards left it */
  finalStates: Map<string, TrayState>;
  /** orders that shipped inside the history: release and ship times */
  shipped: { orderId: string; releasedAt: number; shippedAt: number }[];
}

export function makeDemoFloor(seed: string, end: number, historyDays = 70): DemoFloor {
  const rng = makeRng(seed);
  const ids = rng.fork('ids');
  const plans = planOrders(rng.fork('orders'), end, historyDays);
  const stations = DEFAULT_STATIONS.map((s) => ({
    id: `st-${s.code}`,
    code: s.code,
    name: s.name,
    kind: s.kind,
    capacity: s.capacityTrays,
    deviceId: `dev-${s.code}`,
  }));
  const operatorsByKind: Partial<Record<StationKind, string[]>> = {};
  const roleOf = new Map<string, Role>();
  for (const [kind, crew] of Object.entries(STATION_CREW)) {
    operatorsByKind[kind as StationKind] = crew;
    for (const c of crew) roleOf.set(c, 'operator');
  }
  const supervisors = ['supervisor-1@floor', 'supervisor-2@floor'];
  for (const s of supervisors) roleOf.set(s, 'supervisor');

  const orders: HistoryOrder[] = [];
  const simOrders: SimOrder[] = [];
  const travellers: HistoryTraveller[] = [];
  const designs = new Set<string>();
  const released = plans.filter((p) => p.releasedAt != null).sort((a, b) => a.releasedAt! - b.releasedAt!);
  for (const plan of released) {
    const r = nextWorking(plan.releasedAt!);
    const releasedAt = r <= end - 10 * MINUTE ? r : plan.releasedAt!;
    const orderId = `o-${plan.number}`;
    orders.push({ id: orderId, number: plan.number, dueDate: factoryDate(releasedAt + 14 * DAY), releasedAt });
    const holdAt = plan.target === 'on_hold' ? Math.min(end - HOUR, nextWorking(end - ids.int(18, 36) * HOUR)) : null;
    simOrders.push({
      id: orderId,
      releasedAt,
      startsOnFloor: plan.target !== 'released',
      holdAt,
      holdNote: holdAt ? 'Customer asked us to wait' : null,
      keepFromCourier: plan.target === 'packed',
    });
    const routing: RoutingStep[] = expandRouting(DEFAULT_ROUTING_TEMPLATES[plan.process], plan);
    const reuse = designs.has(plan.designKey);
    designs.add(plan.designKey);
    const mould = mouldRouting({ reuse });
    const checkSeq = mould.find((s) => s.stationKind === 'mould_check')!.seq;
    requiredMoulds(plan).forEach((side) => {
      const id = `${orderId}-M${side[0].toUpperCase()}`;
      const init = initialTrayState({ trayId: id, kind: 'mould', quantity: 1, releasedAt: new Date(releasedAt).toISOString() });
      travellers.push({ id, orderId, kind: 'mould', quantity: 1, releasedAt, routing: mould, initial: { ...init, stepSeq: reuse ? checkSeq : 1 } });
    });
    splitIntoTrays(releasedQuantity(plan.quantity, plan.overrunPct), plan.traySize).forEach((quantity, i) => {
      const id = `${orderId}-${String(i + 1).padStart(2, '0')}`;
      travellers.push({
        id,
        orderId,
        kind: 'tray',
        quantity,
        releasedAt,
        routing,
        initial: initialTrayState({ trayId: id, kind: 'tray', quantity, releasedAt: new Date(releasedAt).toISOString() }),
      });
    });
  }
  const simTravellers: SimTraveller[] = travellers.map((t) => ({
    id: t.id,
    number: t.id,
    kind: t.kind,
    orderId: t.orderId,
    mouldId: null,
    quantity: t.quantity,
    releasedAt: t.releasedAt,
    routing: [...t.routing],
    initial: t.initial,
  }));
  const sim = simulateFloor({
    rng: rng.fork('floor'),
    now: end,
    stations,
    people: { operatorsByKind, supervisors, roleOf },
    orders: simOrders,
    travellers: simTravellers,
    reasonCodes: DEFAULT_REASON_CODES.map((r) => ({ code: r.code, kind: r.kind, stationKind: r.stationKind ?? null })),
  });
  const overrides = new Map(sim.overrides.map((o) => [o.id, { id: o.id, supervisorId: o.supervisorId, reason: o.reason, kind: o.kind }]));
  const history: FloorHistory = {
    orders,
    travellers,
    events: sim.events.map((e) => ({
      trayId: e.trayId,
      type: e.type,
      stationId: e.stationId,
      stationKind: e.stationKind,
      userId: e.userId,
      occurredAt: e.occurredAt,
      goodQty: e.goodQty,
      scrapQty: e.scrapQty,
      reworkQty: e.reworkQty,
      scrapReason: e.scrapReason,
      note: e.note,
      overrideId: e.overrideId,
    })),
    overrides,
    roleOf,
    reasonCodes: DEFAULT_REASON_CODES.map((r) => r.code),
  };
  const shipped: DemoFloor['shipped'] = [];
  for (const o of orders) {
    const trays = travellers.filter((t) => t.orderId === o.id && t.kind === 'tray');
    const living = trays.filter((t) => sim.states.get(t.id)!.phase !== 'scrapped');
    if (living.length && living.every((t) => sim.states.get(t.id)!.phase === 'done')) {
      shipped.push({ orderId: o.id, releasedAt: o.releasedAt, shippedAt: Math.max(...living.map((t) => sim.finishedAt.get(t.id)!)) });
    }
  }
  return {
    seed,
    end,
    start: end - historyDays * DAY,
    history,
    calendar: compileCalendar(demoCalendarConfig()),
    stations: stations.map((s) => ({ id: s.id, kind: s.kind, capacityTrays: s.capacity })),
    shipped,
    finalStates: sim.states,
  };
}
