// "What if we take this order?": the open floor projected twice, as it is and with the new
// order released on it, with the same clock, the same measured model and the same seeds. The
// new order's dates come from the second run; an open order is listed when its 85th-percentile
// date moves later. Nothing is written: the order, its trays and moulds exist only in memory.
import type { AppDeps } from '../app-deps';
import { DAY, iso } from '@shared/domain/time-zone';
import { projectFloor } from '@shared/domain/floor-projection';
import type { SnapshotOrder, SnapshotTraveller } from '@shared/domain/floor-history';
import { mouldRouting, requiredMoulds } from '@shared/domain/routing';
import { MAX_TRAYS_PER_RELEASE, releasedQuantity, splitIntoTrays } from '@shared/domain/trays';
import { kindTraits } from '@shared/domain/traveller';
import { initialTrayState } from '@shared/domain/vocabulary';
import { quantile } from '@shared/domain/stats';
import type { WhatIfBody, WhatIfImpact, WhatIfResult } from '@shared/schemas/projections';
import { badInput } from '../errors';
import { ordersRepository } from '../repositories/orders.repository';
import { mouldsRepository } from '../repositories/moulds.repository';
import { projectionRepository } from '../repositories/projection.repository';
import { calendarService } from './calendar.service';
import { floorSnapshot, modelOf, PROJECTION_RUNS } from './projection.service';
import { DEFAULT_TRAY_SIZE } from './orders.service';
import { routingFromSpec } from './order-spec.service';

/** The id the imagined order carries in the simulation (never stored). */
export const WHAT_IF_ORDER_ID = 'what-if';
const TRAY_SIZE_DAYS = 180;

/** The tray size planners chose lately for badges of about this size (median), else the default. */
export function typicalTraySize(deps: AppDeps, sizeMm: number): number {
  const rows = projectionRepository.traySizesSince(deps.db, deps.now() - TRAY_SIZE_DAYS * DAY);
  const near = rows.filter((r) => Math.abs(r.sizeMm - sizeMm) <= 5).map((r) => r.traySize);
  return near.length ? Math.max(1, Math.round(quantile(near, 0.5))) : DEFAULT_TRAY_SIZE;
}

/** The order as it would stand on the floor the moment it is released: trays and moulds waiting for their first step. */
export function imaginedOrder(deps: AppDeps, spec: WhatIfBody, releasedAt: number): SnapshotOrder {
  const db = deps.db;
  let designKey: string | null = null;
  if (spec.reorderOf) {
    const earlier = ordersRepository.byId(db, spec.reorderOf);
    if (!earlier) throw badInput('The order to repeat does not exist.', [{ path: ['reorderOf'], message: 'Unknown order' }], 'unknown_order');
    designKey = earlier.designKey;
  }
  if (spec.customerId && !ordersRepository.customerById(db, spec.customerId)) {
    throw badInput('There is no customer with that id.', [{ path: ['customerId'], message: 'Unknown customer' }], 'unknown_customer');
  }
  const tray = routingFromSpec(db, spec);
  const stored = requiredMoulds(spec).map((side) => ({ side, reuse: designKey != null && !!mouldsRepository.reusable(db, designKey, side) }));
  const mould = mouldRouting({ reuse: stored.every((m) => m.reuse), process: spec.process });
  const checkSeq = mould.find((s) => kindTraits(s.stationKind).mouldShop === 'check')?.seq ?? 1;
  const at = new Date(releasedAt).toISOString();
  const travellers: SnapshotTraveller[] = stored.map(({ side, reuse }) => {
    const id = `${WHAT_IF_ORDER_ID}-M${side === 'front' ? 'F' : 'B'}`;
    return { id, kind: 'mould', state: { ...initialTrayState({ trayId: id, kind: 'mould', quantity: 1, releasedAt: at }), stepSeq: reuse ? checkSeq : 1 } };
  });
  const total = releasedQuantity(spec.quantity, spec.overrunPct);
  const size = Math.max(typicalTraySize(deps, spec.sizeMm), Math.ceil(total / MAX_TRAYS_PER_RELEASE));
  splitIntoTrays(total, size).forEach((quantity, i) => {
    const id = `${WHAT_IF_ORDER_ID}-${String(i + 1).padStart(2, '0')}`;
    travellers.push({ id, kind: 'tray', state: initialTrayState({ trayId: id, kind: 'tray', quantity, releasedAt: at }) });
  });
  return { id: WHAT_IF_ORDER_ID, number: 'what-if', dueDate: spec.dueDate, releasedAt, travellers, routing: { tray, mould } };
}

/** A spec as the what-if takes it, without the quantity and due date (a quote's spec). */
export type WhatIfSpec = Omit<WhatIfBody, 'quantity' | 'dueDate' | 'releaseAt'>;

/**
 * Ship dates of one spec at several quantities: for each quantity the open floor is projected
 * with the order released on it now, exactly as the what-if's "with" projection (same snapshot,
 * measured model, calendar and seeds), so a quote break and a what-if of the same spec and
 * quantity give the same dates. The snapshot and model are built once for all quantities.
 * Without a due date the order queues behind every open order's due date (the latest one;
 * ties go to whoever asked first). Nothing is written.
 */
type QuantityDates = { expectedAt: string | null; p85At: string | null }[];

// A quote is read again and again (its page, the PDF, the mail, the customer's link): the same
// question on the same floor gets the same answer for a minute, as the projection service's cache.
const QUANTITY_CACHE_MS = 60_000;
const QUANTITY_CACHE_SIZE = 200;
const quantityCaches = new WeakMap<object, Map<string, { at: number; value: QuantityDates }>>();

export function projectQuantities(deps: AppDeps, spec: WhatIfSpec, quantities: readonly number[], o: { dueDate?: string; runs?: number } = {}): QuantityDates {
  const now = deps.now();
  const key = JSON.stringify([projectionRepository.fingerprint(deps.db), spec, quantities, o.dueDate ?? null, o.runs ?? null]);
  const cache = quantityCaches.get(deps.db) ?? quantityCaches.set(deps.db, new Map()).get(deps.db)!;
  const hit = cache.get(key);
  if (hit && now >= hit.at && now - hit.at < QUANTITY_CACHE_MS) return hit.value;
  const value = projectQuantitiesNow(deps, spec, quantities, o, now);
  if (cache.size >= QUANTITY_CACHE_SIZE) cache.clear();
  cache.set(key, { at: now, value });
  return value;
}

function projectQuantitiesNow(
  deps: AppDeps,
  spec: WhatIfSpec,
  quantities: readonly number[],
  o: { dueDate?: string; runs?: number },
  now: number,
): QuantityDates {
  const cal = calendarService.calendar(deps);
  const { snapshot } = floorSnapshot(deps, now);
  const model = modelOf(deps, snapshot, cal);
  const options = { calendar: cal, model, runs: o.runs ?? PROJECTION_RUNS };
  const dueDate = o.dueDate ?? latestDueDate(snapshot.orders.map((x) => x.dueDate)) ?? new Date(now).toISOString().slice(0, 10);
  return quantities.map((quantity) => {
    const imagined = imaginedOrder(deps, { ...spec, quantity, dueDate }, now);
    const mine = projectFloor({ ...snapshot, orders: [...snapshot.orders, imagined] }, options).get(WHAT_IF_ORDER_ID);
    return { expectedAt: iso(mine?.expectedAt ?? null), p85At: iso(mine?.p85At ?? null) };
  });
}

function latestDueDate(dates: string[]): string | null {
  return dates.reduce<string | null>((a, d) => (a == null || d > a ? d : a), null);
}

export const whatIfService = {
  project(deps: AppDeps, spec: WhatIfBody): WhatIfResult {
    const now = deps.now();
    const releaseAt = spec.releaseAt ? Math.max(now, Date.parse(spec.releaseAt)) : now;
    if (releaseAt > now + 365 * DAY)
      throw badInput('The release time is more than a year ahead.', [{ path: ['releaseAt'], message: 'Too far ahead' }], 'bad_release_at');
    const cal = calendarService.calendar(deps);
    const { snapshot, orders } = floorSnapshot(deps, now);
    const model = modelOf(deps, snapshot, cal);
    const options = { calendar: cal, model, runs: PROJECTION_RUNS };
    const before = projectFloor(snapshot, options);
    const imagined = imaginedOrder(deps, spec, releaseAt);
    const after = projectFloor({ ...snapshot, orders: [...snapshot.orders, imagined] }, options);
    const mine = after.get(WHAT_IF_ORDER_ID);
    const impacts: (WhatIfImpact & { by: number })[] = [];
    for (const o of orders) {
      const b = before.get(o.id)?.p85At ?? null;
      const a = after.get(o.id)?.p85At ?? null;
      if (b == null || a == null || a <= b) continue;
      impacts.push({ orderId: o.id, number: o.number, p85Before: iso(b)!, p85After: iso(a)!, by: a - b });
    }
    impacts.sort((x, y) => y.by - x.by || x.number.localeCompare(y.number));
    return {
      expectedAt: iso(mine?.expectedAt ?? null),
      p85At: iso(mine?.p85At ?? null),
      impacts: impacts.map(({ by: _by, ...rest }) => rest),
    };
  },
};
