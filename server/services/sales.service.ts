// The sales view: find any order, say where it stands in plain words, when it will ship, what
// has shipped, and what happened to it.
import type { AppDeps } from '../app-deps';
import { calendarService } from './calendar.service';
import { shippingRepository } from '../repositories/shipping.repository';
import { auditRepository } from '../repositories/audit.repository';
import { AppError, badInput, notFound } from '../errors';
import { CUSTOMER_STAGE_NAMES } from '@shared/domain/stages';
import type { HistoryEntry, OrderContactInput, SalesOrderDetail, SalesOrderRow } from '@shared/schemas/shipping';
import { loadProgress, quantities, unshippedCartonPieces, type OrderProgress } from './order-progress.service';
import { shareLinksService } from './share-links.service';
import { shippingService } from './shipping.service';
import { measuredShipDates } from './ship-date.service';
import { iso } from '@shared/domain/time-zone';

function row(p: OrderProgress): SalesOrderRow {
  return {
    id: p.order.id,
    number: p.order.number,
    customer: p.order.customer,
    title: p.order.title,
    quantity: p.order.quantity,
    status: p.status,
    dueDate: p.order.dueDate,
    stage: p.stage.stage ? CUSTOMER_STAGE_NAMES[p.stage.stage] : 'Cancelled',
    stageText: p.stageText,
    projectedShipAt: p.status === 'shipped' || p.status === 'cancelled' ? null : iso(p.projection.expectedAt),
    late: p.late,
    shippedAt: iso(p.shippedAt),
    trackingNumbers: p.shipments.map((s) => s.trackingNumber),
  };
}

const AUDIT_WORDS: Record<string, (d: Record<string, unknown>) => string> = {
  'order.ship': (d) =>
    `Shipment ${d.shipment} left with ${d.carrier}, tracking ${d.trackingNumber} (${d.pieces} pieces)${d.acceptShort ? ', shipped short by decision' : ''}`,
  'order.pack': (d) => `Packed ${(d.cartons as { count: number }[] | undefined)?.reduce((a, c) => a + c.count, 0) ?? ''} cartons`,
  'order.unpack': () => 'A packed carton was taken apart',
  'share_link.create': (d) => (d.purpose === 'shipped_mail' ? 'Status link made for the shipped mail' : 'Status link made for the customer'),
  'share_link.revoke': (d) => `Status links withdrawn (${d.revoked})`,
  'order.contact': (d) => `Customer contact set to ${d.contactEmail}`,
  'mail.proof_ready': (d) => `Proof ${d.revision} sent to ${d.to} for approval`,
};

function history(deps: AppDeps, p: OrderProgress): HistoryEntry[] {
  const db = deps.db;
  const o = p.order;
  const out: HistoryEntry[] = [{ at: iso(o.createdAt)!, what: 'Order entered', who: null }];
  for (const pay of shippingRepository.payments(db, o.id)) {
    out.push({
      at: iso(pay.recordedAt)!,
      what: pay.isException ? 'Released without payment by a manager’s exception' : 'Payment recorded',
      who: pay.by ?? null,
    });
  }
  for (const pr of shippingRepository.proofs(db, o.id)) {
    out.push({ at: iso(pr.uploadedAt)!, what: `Proof revision ${pr.revision} uploaded`, who: null });
    if (pr.approvedAt != null) out.push({ at: iso(pr.approvedAt)!, what: `Proof revision ${pr.revision} approved by the customer`, who: null });
  }
  if (o.releasedAt != null)
    out.push({ at: iso(o.releasedAt)!, what: `Released to the floor in ${p.trays.length} ${p.trays.length === 1 ? 'tray' : 'trays'}`, who: null });
  const ids = p.travellers.map((t) => t.id);
  const first = shippingRepository.firstStart(db, ids);
  if (first != null) out.push({ at: iso(first)!, what: 'Production started', who: null });
  const numbers = new Map(p.travellers.map((t) => [t.id, t.number]));
  for (const e of shippingRepository.holdEvents(db, ids)) {
    const what =
      e.type === 'hold'
        ? `Tray ${numbers.get(e.trayId)} put on hold${e.note ? `: ${e.note}` : ''}`
        : e.type === 'release'
          ? `Tray ${numbers.get(e.trayId)} released from hold`
          : `Tray ${numbers.get(e.trayId)} written off${e.scrapReason ? ` (${e.scrapReason})` : ''}`;
    out.push({ at: iso(e.at)!, what, who: e.by ?? null });
  }
  for (const a of shippingRepository.auditFor(db, 'order', o.id)) {
    const words = AUDIT_WORDS[a.action];
    if (words) out.push({ at: iso(a.at)!, what: words((a.detail ?? {}) as Record<string, unknown>), who: a.by ?? null });
  }
  if (o.packedAt != null) out.push({ at: iso(o.packedAt)!, what: 'Every tray packed', who: null });
  if (p.shippedAt != null) out.push({ at: iso(p.shippedAt)!, what: 'Shipped: the last tray left dispatch', who: null });
  return out.sort((a, b) => a.at.localeCompare(b.at));
}

export const salesService = {
  search(deps: AppDeps, q: string | undefined, limit: number): SalesOrderRow[] {
    const list = shippingRepository.search(deps.db, q, limit);
    const progress = loadProgress(deps.db, list, deps.now(), shippingRepository.factory(deps.db).timeZone, {
      shipDates: measuredShipDates(
        deps,
        list.map((o) => o.id),
      ),
      calendar: calendarService.calendar(deps),
    });
    return list.map((o) => row(progress.get(o.id)!));
  },

  detail(deps: AppDeps, orderId: string): SalesOrderDetail {
    const order = shippingRepository.order(deps.db, orderId);
    if (!order) throw notFound('That order');
    const p = loadProgress(deps.db, [order], deps.now(), shippingRepository.factory(deps.db).timeZone, {
      shipDates: measuredShipDates(deps, [orderId]),
      calendar: calendarService.calendar(deps),
    }).get(orderId)!;
    const cartons = shippingRepository.cartons(deps.db, orderId);
    const released = ['released', 'in_production', 'packed', 'shipped', 'on_hold'].includes(p.status);
    const owner = order.salesOwnerId ? shippingRepository.user(deps.db, order.salesOwnerId) : undefined;
    return {
      ...row(p),
      stages: p.stage.stages.map((s) => ({ name: s.name, done: s.done })),
      projectionNote:
        p.projection.expectedAt != null
          ? p.projection.basis
          : released
            ? 'Every tray is finished.'
            : 'A ship date is projected once the order is released to the floor.',
      overrunPct: order.overrunPct,
      contact: { customerId: order.customerId, contactName: order.contactName, contactEmail: order.contactEmail },
      salesOwner: owner ? { id: owner.id, name: owner.name, email: owner.email } : null,
      quantities: released ? quantities(p, unshippedCartonPieces(cartons)) : null,
      shipments: shippingService.shipments(deps, orderId),
      shareLinks: shareLinksService.list(deps, orderId),
      proofs: shippingRepository
        .proofs(deps.db, orderId)
        .map((pr) => ({ revision: pr.revision, uploadedAt: iso(pr.uploadedAt)!, approvedAt: iso(pr.approvedAt) })),
      history: history(deps, p),
    };
  },

  /** Who hears about the order: the customer's contact (validated address) and the sales owner. */
  setContact(deps: AppDeps, orderId: string, body: OrderContactInput, userId: string): SalesOrderDetail {
    const order = shippingRepository.order(deps.db, orderId);
    if (!order) throw notFound('That order');
    if (body.salesOwnerId) {
      const u = shippingRepository.user(deps.db, body.salesOwnerId);
      if (!u || !u.active) throw badInput('The sales owner must be an active person.', [{ path: ['salesOwnerId'], message: 'Unknown person' }]);
      if (!['sales', 'planner', 'manager', 'admin'].includes(u.role))
        throw new AppError(409, 'not_office', `${u.name} works on the floor and cannot own an order.`);
    }
    const now = deps.now();
    deps.db.transaction((tx) => {
      shippingRepository.setCustomerContact(
        tx,
        order.customerId,
        { contactEmail: body.contactEmail, ...(body.contactName !== undefined ? { contactName: body.contactName || null } : {}) },
        now,
      );
      if (body.salesOwnerId !== undefined) shippingRepository.setSalesOwner(tx, orderId, body.salesOwnerId, now);
      auditRepository.record(tx, now, {
        userId,
        action: 'order.contact',
        entity: 'order',
        entityId: orderId,
        detail: { contactEmail: body.contactEmail, salesOwnerId: body.salesOwnerId },
      });
    });
    return salesService.detail(deps, orderId);
  },

  /** People who can own an order on the sales side. */
  owners(deps: AppDeps) {
    return shippingRepository.activeUsersWithRoles(deps.db, ['sales', 'planner', 'manager', 'admin']).map((u) => ({ id: u.id, name: u.name, role: u.role }));
  },
};
