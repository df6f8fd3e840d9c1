// The sales view: find any order, say where it stands in plain words, when it will ship, what
// has shipped, and what happened to it.
import type { AppDeps } from '../app-deps';
import { calendarService } from './calendar.service';
import { shippingRepository } from '../repositories/shipping.repository';
import { auditRepository } from '../repositories/audit.repository';
import { AppError, badInput, notFound } from '../errors';
import { CUSTOMER_STAGE_NAMES } from '@shared/domain/stages';
import type { HistoryEntry, OrderContactInput, SalesHistoryCode, SalesOrderDetail, SalesOrderRow } from '@shared/schemas/shipping';
import { loadProgress, quantities, unshippedCartonPieces, type OrderProgress } from './order-progress.service';
import { shareLinksService } from './share-links.service';
import { shippingService } from './shipping.service';
import { measuredShipDates } from './ship-date.service';
import { projectionNoteEnglish, type ProjectionNote } from '@shared/domain/projection-note';
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
    stageTextCode: p.stageNote,
    projectedShipAt: p.status === 'shipped' || p.status === 'cancelled' ? null : iso(p.projection.expectedAt),
    late: p.late,
    shippedAt: iso(p.shippedAt),
    trackingNumbers: p.shipments.map((s) => s.trackingNumber),
  };
}

type Params = HistoryEntry['params'];

/** Each history line in English (the API's `what`); screens say it from `code` and `params`. */
const HISTORY_WORDS: Record<SalesHistoryCode, (d: Params) => string> = {
  entered: () => 'Order entered',
  payment: () => 'Payment recorded',
  payment_exception: () => 'Released without payment by a manager’s exception',
  proof_uploaded: (d) => `Proof revision ${d.revision} uploaded`,
  proof_approved: (d) => `Proof revision ${d.revision} approved by the customer`,
  released: (d) => `Released to the floor in ${d.trays} ${d.trays === 1 ? 'tray' : 'trays'}`,
  started: () => 'Production started',
  tray_hold: (d) => `Tray ${d.tray} put on hold${d.note ? `: ${d.note}` : ''}`,
  tray_release: (d) => `Tray ${d.tray} released from hold`,
  tray_scrap: (d) => `Tray ${d.tray} written off${d.reason ? ` (${d.reason})` : ''}`,
  shipment: (d) =>
    `Shipment ${d.shipment} left with ${d.carrier}, tracking ${d.trackingNumber} (${d.pieces} pieces)${d.short ? ', shipped short by decision' : ''}`,
  pack: (d) => `Packed ${d.cartons ?? ''} cartons`,
  unpack: () => 'A packed carton was taken apart',
  link_for_mail: () => 'Status link made for the shipped mail',
  link_made: () => 'Status link made for the customer',
  links_withdrawn: (d) => `Status links withdrawn (${d.count})`,
  contact: (d) => `Customer contact set to ${d.email}`,
  proof_sent: (d) => `Proof ${d.revision} sent to ${d.to} for approval`,
  packed: () => 'Every tray packed',
  shipped: () => 'Shipped: the last tray left dispatch',
};

const str = (x: unknown): string | null => (x == null ? null : String(x));
const num = (x: unknown): number | null => (typeof x === 'number' ? x : x == null ? null : Number(x));

/** The audit rows sales sees, as a history code and its parameters. */
const AUDIT_LINES: Record<string, (d: Record<string, unknown>) => [SalesHistoryCode, Params]> = {
  'order.ship': (d) => [
    'shipment',
    { shipment: str(d.shipment), carrier: str(d.carrier), trackingNumber: str(d.trackingNumber), pieces: num(d.pieces), short: !!d.acceptShort },
  ],
  'order.pack': (d) => ['pack', { cartons: (d.cartons as { count: number }[] | undefined)?.reduce((a, c) => a + c.count, 0) ?? null }],
  'order.unpack': () => ['unpack', {}],
  'share_link.create': (d) => [d.purpose === 'shipped_mail' ? 'link_for_mail' : 'link_made', {}],
  'share_link.revoke': (d) => ['links_withdrawn', { count: num(d.revoked) }],
  'order.contact': (d) => ['contact', { email: str(d.contactEmail) }],
  'mail.proof_ready': (d) => ['proof_sent', { revision: num(d.revision), to: str(d.to) }],
};

function history(deps: AppDeps, p: OrderProgress): HistoryEntry[] {
  const db = deps.db;
  const o = p.order;
  const out: HistoryEntry[] = [];
  const add = (at: number, code: SalesHistoryCode, params: Params, who: string | null) =>
    out.push({ at: iso(at)!, what: HISTORY_WORDS[code](params), code, params, who });
  add(o.createdAt, 'entered', {}, null);
  for (const pay of shippingRepository.payments(db, o.id)) add(pay.recordedAt, pay.isException ? 'payment_exception' : 'payment', {}, pay.by ?? null);
  for (const pr of shippingRepository.proofs(db, o.id)) {
    add(pr.uploadedAt, 'proof_uploaded', { revision: pr.revision }, null);
    if (pr.approvedAt != null) add(pr.approvedAt, 'proof_approved', { revision: pr.revision }, null);
  }
  if (o.releasedAt != null) add(o.releasedAt, 'released', { trays: p.trays.length }, null);
  const ids = p.travellers.map((t) => t.id);
  const first = shippingRepository.firstStart(db, ids);
  if (first != null) add(first, 'started', {}, null);
  const numbers = new Map(p.travellers.map((t) => [t.id, t.number]));
  for (const e of shippingRepository.holdEvents(db, ids)) {
    const tray = numbers.get(e.trayId) ?? null;
    if (e.type === 'hold') add(e.at, 'tray_hold', { tray, note: e.note || null }, e.by ?? null);
    else if (e.type === 'release') add(e.at, 'tray_release', { tray }, e.by ?? null);
    else add(e.at, 'tray_scrap', { tray, reason: e.scrapReason || null }, e.by ?? null);
  }
  for (const a of shippingRepository.auditFor(db, 'order', o.id)) {
    const line = AUDIT_LINES[a.action];
    if (line) {
      const [code, params] = line((a.detail ?? {}) as Record<string, unknown>);
      add(a.at, code, params, a.by ?? null);
    }
  }
  if (o.packedAt != null) add(o.packedAt, 'packed', {}, null);
  if (p.shippedAt != null) add(p.shippedAt, 'shipped', {}, null);
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
    const note: ProjectionNote = p.projection.expectedAt != null ? p.projection.note : released ? { code: 'all_done' } : { code: 'after_release' };
    const owner = order.salesOwnerId ? shippingRepository.user(deps.db, order.salesOwnerId) : undefined;
    return {
      ...row(p),
      stages: p.stage.stages.map((s) => ({ name: s.name, done: s.done })),
      projectionNote: p.projection.expectedAt != null ? p.projection.basis : projectionNoteEnglish(note, 'UTC'),
      projectionNoteCode: note,
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
