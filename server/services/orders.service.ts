// Orders: entry and change of the spec, the list and the order page, hold, resume and cancel.
// The jobs around them live beside this file: order-spec (the spec ↔ row mapping and the routing
// made from it), order-gates (payment and proofs), order-routing (the planner's routing edits),
// order-release (release, trays and moulds), order-import (CSV) and routing-templates.
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { calendarService } from './calendar.service';
import type { DbLike } from '../db/client';
import { ordersRepository, type OrderRow } from '../repositories/orders.repository';
import { traysRepository, type TrayRow, type TrayStateRow } from '../repositories/trays.repository';
import { mouldsRepository } from '../repositories/moulds.repository';
import { auditRepository } from '../repositories/audit.repository';
import { badInput, conflict, notFound } from '../errors';
import {
  orderSpecSchema,
  specWarnings,
  type HistoryEntry,
  type OrderDetail,
  type OrderGate,
  type OrderListItem,
  type OrderMouldView,
  type OrderSpec,
  type OrderSpecPatch,
  type TravellerSummary,
} from '@shared/schemas/orders';
import { mouldRouting, mouldStepsFor, mouldTool, requiredMoulds, type MouldSide } from '@shared/domain/routing';
import { releasedQuantity } from '@shared/domain/trays';
import { factoryToday, iso } from '@shared/domain/time-zone';
import { makeTravellerCode } from '@shared/domain/traveller-code';
import { loadProgress } from './order-progress.service';
import { openGates, paymentSummaryOf, preReleaseStatus } from './order-gates';
import { shipDateService } from './ship-date.service';
import { routingFromSpec, routingOf, routingShape, specColumns, specOf, stepRows } from './order-spec.service';
import { standardMinutes, type OrderStatus, type Process, type RoutingStep, type TrayPhase } from '@shared/domain/vocabulary';

export const FIRST_ORDER_NUMBER = 1001;
/** Tray size used for standard minutes before the planner has chosen one. */
export const DEFAULT_TRAY_SIZE = 100;

/** Kept here for the callers that read the template through the orders service. */

/** today on the factory's clock (shared/domain/calendar.ts), never the UTC date */
export const today = (now: number, zone: string) => factoryToday(now, zone);

// ---------------------------------------------------------------------------------------
// Small helpers

export function getOrder(db: DbLike, id: string): OrderRow {
  const order = ordersRepository.byId(db, id);
  if (!order) throw notFound('That order');
  return order;
}

export function isReleased(order: OrderRow): boolean {
  return order.releasedAt != null;
}

export function refuseIfReleased(order: OrderRow, what: string) {
  if (isReleased(order)) {
    throw conflict('already_released', `Order ${order.number} is released to the floor; ${what} can no longer be changed.`);
  }
  if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
}

function isLate(order: OrderRow, now: number, zone: string): boolean {
  if (order.status === 'cancelled') return false;
  if (order.shippedAt != null) return today(order.shippedAt, zone) > order.dueDate;
  return today(now, zone) > order.dueDate;
}

export function customerFor(db: DbLike, spec: { customer?: string; customerId?: string }, now: number): string {
  if (spec.customerId) {
    const c = ordersRepository.customerById(db, spec.customerId);
    if (!c) throw badInput('There is no customer with that id.', [{ path: ['customerId'], message: 'Unknown customer' }], 'unknown_customer');
    return c.id;
  }
  const name = spec.customer!.trim();
  const existing = ordersRepository.customerByName(db, name);
  if (existing) return existing.id;
  const id = crypto.randomUUID();
  ordersRepository.insertCustomer(db, { id, name, createdAt: now, updatedAt: now });
  return id;
}

export function auditOrder(db: DbLike, now: number, userId: string | null, action: string, orderId: string, text: string, extra: Record<string, unknown> = {}) {
  auditRepository.record(db, now, { userId, action, entity: 'order', entityId: orderId, detail: { text, ...extra } });
}

export function travellerCode(deps: AppDeps, tray: Pick<TrayRow, 'number' | 'revision'>): string {
  return makeTravellerCode({ number: tray.number, revision: tray.revision }, deps.keys.traveller);
}

export function summariseTraveller(deps: AppDeps, tray: TrayRow, state: TrayStateRow | null, routing: RoutingStep[]): TravellerSummary {
  const step = state?.stepSeq != null ? routing.find((s) => s.seq === state.stepSeq) : undefined;
  return {
    id: tray.id,
    number: tray.number,
    code: travellerCode(deps, tray),
    kind: tray.kind,
    quantity: state?.quantity ?? tray.quantity,
    revision: tray.revision,
    phase: (state?.phase ?? 'waiting') as TrayPhase,
    onHold: state?.onHold ?? false,
    stepSeq: state?.stepSeq ?? null,
    stepName: step?.name ?? null,
    stationKind: state?.stationKind ?? null,
    parentTrayId: tray.parentTrayId,
    mergedIntoId: tray.mergedIntoId,
  };
}

/** Projected ship date, lateness and the shown status (shipped once the last dispatch finished), from the shared progress model. */
function progressOf(deps: AppDeps, rows: { order: OrderRow; customer: string }[]) {
  const list = rows.map(({ order, customer }) => ({
    id: order.id,
    number: order.number,
    title: order.title,
    quantity: order.quantity,
    overrunPct: order.overrunPct,
    status: order.status,
    dueDate: order.dueDate,
    releasedAt: order.releasedAt,
    packedAt: order.packedAt,
    shippedAt: order.shippedAt,
    createdAt: order.createdAt,
    salesOwnerId: order.salesOwnerId,
    customerId: order.customerId,
    customer,
    contactName: null,
    contactEmail: null,
  }));
  // ship dates from the projection service (measured queues on the working calendar)
  return loadProgress(deps.db, list, deps.now(), shipDateService.timeZone(deps), {
    project: true,
    shipDates: shipDateService.measuredShipDates(
      deps,
      list.map((o) => o.id),
    ),
    calendar: calendarService.calendar(deps),
  });
}

// ---------------------------------------------------------------------------------------

export const ordersService = {
  customers: (deps: AppDeps) => ordersRepository.customers(deps.db),

  list(deps: AppDeps): OrderListItem[] {
    const rows = ordersRepository.list(deps.db);
    const progress = progressOf(deps, rows);
    return rows.map(({ order, customer, trays }) => {
      const p = progress.get(order.id);
      const gates: OrderGate[] = isReleased(order) || order.status === 'cancelled' ? [] : openGates(deps.db, order.id);
      return {
        id: order.id,
        number: order.number,
        customer,
        customerId: order.customerId,
        title: order.title,
        process: order.process,
        quantity: order.quantity,
        status: p?.status ?? (order.status as OrderStatus),
        openGates: gates,
        dueDate: order.dueDate,
        projectedShipAt: iso(p?.projection.expectedAt),
        late: p?.late ?? isLate(order, deps.now(), shipDateService.timeZone(deps)),
        releasedAt: iso(order.releasedAt),
        trays,
        createdAt: iso(order.createdAt)!,
      };
    });
  },

  get(deps: AppDeps, id: string): OrderDetail {
    const { db } = deps;
    const order = getOrder(db, id);
    const customer = ordersRepository.customerById(db, order.customerId)!;
    const routing = routingOf(db, id, 'tray');
    const mouldSteps = routingOf(db, id, 'mould');
    const traySize = order.traySize ?? Math.min(DEFAULT_TRAY_SIZE, releasedQuantity(order.quantity, order.overrunPct));
    const payments = ordersRepository.payments(db, id);
    const summary = paymentSummaryOf(db, order);
    const proofs = ordersRepository.proofs(db, id);
    const names = new Map(
      ordersRepository
        .userNames(db, [...new Set(proofs.flatMap((p) => [p.uploadedBy, p.approvedBy].filter((x): x is string => !!x)))])
        .map((u) => [u.id, u.name]),
    );
    const travellers = traysRepository.forOrder(db, id);
    const trays = travellers.filter((t) => t.tray.kind === 'tray').map((t) => summariseTraveller(deps, t.tray, t.state, routing));
    const moulds: OrderMouldView[] = travellers
      .filter((t) => t.tray.kind === 'mould')
      .map((t) => {
        const mould = t.tray.mouldId ? mouldsRepository.byId(db, t.tray.mouldId) : undefined;
        const side = (mould?.side ?? 'front') as MouldSide;
        const tool = mouldTool(order.process as Process, side);
        return {
          ...summariseTraveller(deps, t.tray, t.state, mouldStepsFor(mouldSteps, tool)),
          mouldId: mould?.id ?? '',
          mouldNumber: mould?.number ?? '',
          side,
          tool,
          reused: mould ? mould.firstOrderId !== id : false,
          storageLocation: mould?.storageLocation ?? null,
        };
      });
    const firstOfDesign = ordersRepository.firstWithDesign(db, order.designKey);
    const spec = specOf(order);
    const progress = progressOf(deps, [{ order, customer: customer.name }]).get(id);
    const history = ordersRepository
      .history(
        db,
        id,
        travellers.map((t) => t.tray.id),
      )
      .map(({ entry, by }) => ({
        at: iso(entry.at)!,
        action: entry.action,
        by: by ?? null,
        text: (entry.detail as { text?: string } | null)?.text ?? entry.action,
        params: (entry.detail as { params?: HistoryEntry['params'] } | null)?.params ?? null,
      }));
    return {
      id: order.id,
      number: order.number,
      customer: { id: customer.id, name: customer.name },
      spec,
      status: progress?.status ?? (order.status as OrderStatus),
      holdReason: order.holdReason,
      reorderOf: firstOfDesign && firstOfDesign.id !== order.id ? { id: firstOfDesign.id, number: firstOfDesign.number } : null,
      releasedQuantity: releasedQuantity(order.quantity, order.overrunPct),
      traySize: order.traySize,
      releasedAt: iso(order.releasedAt),
      shippedAt: iso(progress?.shippedAt ?? order.shippedAt),
      createdAt: iso(order.createdAt)!,
      late: progress?.late ?? isLate(order, deps.now(), shipDateService.timeZone(deps)),
      projectedShipAt: iso(progress?.projection.expectedAt),
      projectionNote: progress?.projection.basis || null,
      projectionNoteCode: progress?.projection.basis ? progress.projection.note : null,
      warnings: specWarnings(spec),
      openGates: isReleased(order) ? [] : openGates(db, id),
      payments: payments.map(({ payment: p, by }) => ({
        id: p.id,
        amount: p.amount,
        currency: p.currency ?? (p.isException ? null : summary.currency),
        reference: p.reference,
        source: p.source,
        at: iso(p.recordedAt)!,
        isException: p.isException,
        note: p.note,
        recordedBy: p.source === 'checkout' ? 'Online checkout' : (by ?? ''),
        recordedAt: iso(p.recordedAt)!,
      })),
      paidTotal: summary.paidTotal,
      payment: summary,
      proofs: proofs.map((p) => ({
        revision: p.revision,
        mime: p.mime,
        sizeBytes: p.sizeBytes,
        originalName: p.originalName,
        uploadedBy: names.get(p.uploadedBy) ?? '',
        uploadedAt: iso(p.uploadedAt)!,
        approvedAt: iso(p.approvedAt),
        approvedBy: p.approvedBy ? (names.get(p.approvedBy) ?? null) : p.approvedByName ? `${p.approvedByName} (on the order page)` : null,
        approvalNote: p.approvalNote,
        changesRequestedAt: iso(p.changesRequestedAt),
        changesComment: p.changesComment,
      })),
      routing: routing.map((s) => ({ ...s, standardMinutes: Math.round(standardMinutes(s, traySize) * 10) / 10 })),
      mouldRouting: mouldSteps.length ? mouldSteps : mouldRouting({ reuse: false, process: spec.process }),
      mouldPlan: requiredMoulds(spec).map((side) => {
        const tool = mouldTool(spec.process, side);
        const linked = moulds.find((m) => m.side === side);
        if (linked) return { side, tool, reuse: linked.reused, mouldNumber: linked.mouldNumber };
        const stored = mouldsRepository.reusable(db, order.designKey, side);
        return { side, tool, reuse: !!stored, mouldNumber: stored?.number ?? null };
      }),
      trays,
      moulds,
      history,
    };
  },

  create(deps: AppDeps, input: OrderSpec, actorId: string | null): OrderDetail {
    const id = ordersService.createInTx(deps, deps.db, input, actorId);
    return ordersService.get(deps, id);
  },

  /** Creates an order inside the caller's transaction (the import adds many in one). */
  createInTx(deps: AppDeps, db: DbLike, input: OrderSpec, actorId: string | null): string {
    const now = deps.now();
    const run = (tx: DbLike) => {
      let designKey: string = crypto.randomUUID();
      if (input.reorderOf) {
        const earlier = ordersRepository.byId(tx, input.reorderOf);
        if (!earlier) throw badInput('The order to repeat does not exist.', [{ path: ['reorderOf'], message: 'Unknown order' }], 'unknown_order');
        designKey = earlier.designKey;
      }
      const id = crypto.randomUUID();
      const number = String(Math.max(FIRST_ORDER_NUMBER - 1, ordersRepository.maxNumber(tx) ?? 0) + 1);
      const customerId = customerFor(tx, input, now);
      ordersRepository.insert(tx, {
        id,
        number,
        customerId,
        ...specColumns(input),
        status: 'awaiting_payment',
        designKey,
        createdBy: actorId,
        createdAt: now,
        updatedAt: now,
      });
      ordersRepository.replaceSteps(tx, id, 'tray', stepRows(id, 'tray', routingFromSpec(tx, input)));
      auditOrder(tx, now, actorId, 'order.create', id, `Order ${number} entered${input.reorderOf ? ' as a repeat of an earlier design' : ''}`, {
        params: { variant: input.reorderOf ? 'repeat' : 'new', number },
      });
      return id;
    };
    return db === deps.db ? deps.db.transaction((tx) => run(tx)) : run(db);
  },

  update(deps: AppDeps, id: string, patch: OrderSpecPatch, actorId: string): OrderDetail {
    const { db } = deps;
    const now = deps.now();
    db.transaction((tx) => {
      const order = getOrder(tx, id);
      refuseIfReleased(order, 'its spec');
      const current = { ...specOf(order), customerId: order.customerId };
      const merged = { ...current, ...patch };
      if (patch.customer) delete (merged as { customerId?: string }).customerId;
      const parsed = orderSpecSchema.safeParse(merged);
      if (!parsed.success) {
        throw badInput(
          'The changed spec is not valid.',
          parsed.error.issues.map((i) => ({ path: i.path as (string | number)[], message: i.message, code: i.code })),
        );
      }
      const spec = parsed.data;
      const customerId = customerFor(tx, spec, now);
      ordersRepository.update(tx, id, {
        customerId,
        ...specColumns(spec),
        updatedAt: now,
      });
      // a change that shapes the routing makes it again from the template (the planner's edits go)
      const before = routingShape(current);
      const after = routingShape(spec);
      const changed = Object.keys(patch).join(', ');
      if (before !== after) {
        ordersRepository.replaceSteps(tx, id, 'tray', stepRows(id, 'tray', routingFromSpec(tx, spec)));
        auditOrder(tx, now, actorId, 'order.update', id, `Spec changed (${changed}); routing made again from the template`, {
          params: { variant: 'remade', fields: Object.keys(patch) },
        });
      } else {
        auditOrder(tx, now, actorId, 'order.update', id, `Spec changed (${changed})`, { params: { variant: 'kept', fields: Object.keys(patch) } });
      }
    });
    return ordersService.get(deps, id);
  },

  /** Puts an order that is not on the floor yet on hold (after release, trays are held one by one on the floor). */
  hold(deps: AppDeps, id: string, reason: string, actorId: string) {
    const now = deps.now();
    deps.db.transaction((tx) => {
      const order = getOrder(tx, id);
      if (isReleased(order)) throw conflict('already_released', `Order ${order.number} is on the floor: hold its trays at the stations instead.`);
      if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
      if (order.status === 'on_hold') throw conflict('already_on_hold', `Order ${order.number} is on hold already.`);
      ordersRepository.update(tx, id, { status: 'on_hold', holdReason: reason, updatedAt: now });
      auditOrder(tx, now, actorId, 'order.hold', id, `Put on hold: ${reason}`, { params: { reason } });
    });
    return ordersService.get(deps, id);
  },

  resume(deps: AppDeps, id: string, actorId: string) {
    const now = deps.now();
    deps.db.transaction((tx) => {
      const order = getOrder(tx, id);
      if (order.status !== 'on_hold') throw conflict('not_on_hold', `Order ${order.number} is not on hold.`);
      const status = order.releasedAt != null ? 'released' : preReleaseStatus(openGates(tx, id));
      ordersRepository.update(tx, id, { status, holdReason: null, updatedAt: now });
      auditOrder(tx, now, actorId, 'order.resume', id, 'Hold lifted', { params: {} });
    });
    return ordersService.get(deps, id);
  },

  /** Cancels an order before release; released work is written off tray by tray instead. */
  cancel(deps: AppDeps, id: string, reason: string, actorId: string) {
    const now = deps.now();
    deps.db.transaction((tx) => {
      const order = getOrder(tx, id);
      if (isReleased(order)) throw conflict('already_released', `Order ${order.number} is on the floor: write off its trays instead.`);
      if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled already.`);
      ordersRepository.update(tx, id, { status: 'cancelled', cancelledAt: now, holdReason: reason, updatedAt: now });
      auditOrder(tx, now, actorId, 'order.cancel', id, `Cancelled: ${reason}`, { params: { reason } });
    });
    return ordersService.get(deps, id);
  },
};
