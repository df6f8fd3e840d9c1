// Packing and dispatch: cartons, shipments with carrier and tracking number, the quantity
// checks, the packing list, the shipped mail, and the order's packed / shipped status.
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { calendarService } from './calendar.service';
import type { DbLike } from '../db/client';
import { shippingRepository, type CartonRow, type ShipmentRow } from '../repositories/shipping.repository';
import { auditRepository } from '../repositories/audit.repository';
import { conflict, notFound } from '../errors';
import { cartonTotals, checkShipmentQuantity, trayIsPacked, type CartonLine } from '@shared/domain/shipping';
import type { CartonView, CreateShipment, CreatedShipment, DispatchRow, PackCartonsInput, PackingView, ShipmentView } from '@shared/schemas/shipping';
import { loadProgress, packedAndOnFloor, quantities, trayView, unshippedCartonPieces, type OrderProgress } from './order-progress.service';
import { createLinkIn } from './share-links.service';
import { enqueueMail, kickMail } from './mail.service';
import { shippedMail } from '../lib/mail-templates';
import { renderPackingList } from '../lib/packing-list-pdf';
import { printWords } from '../lib/print-words';
import { factorySettingsService } from './factory-settings.service';
import type { AcceptedScan } from './scan-ingest.service';
import { iso } from '@shared/domain/time-zone';

/** Orders in these states can be packed and shipped. */
const SHIPPABLE = ['released', 'in_production', 'packed', 'shipped'];

export function cartonView(c: CartonRow): CartonView {
  return { id: c.id, count: c.count, piecesPerCarton: c.piecesPerCarton, weightKg: c.weightKg, shipmentId: c.shipmentId, createdAt: iso(c.createdAt)! };
}

function shipmentViews(db: DbLike, rows: ShipmentRow[], cartons: CartonRow[]): ShipmentView[] {
  const owners = shippingRepository.trackingOwners(db, [...new Set(rows.map((r) => r.trackingNumber))]);
  const names = new Map(
    shippingRepository.usersByName(db, [...new Set(rows.map((r) => r.createdBy).filter((x): x is string => !!x))]).map((u) => [u.id, u.name]),
  );
  return rows.map((s) => {
    const own = cartons.filter((c) => c.shipmentId === s.id);
    const totals = own.length
      ? cartonTotals(own.map((c) => ({ count: c.count, piecesPerCarton: c.piecesPerCarton, weightKg: c.weightKg ?? 0 })))
      : { cartons: 0, weightKg: 0 };
    return {
      id: s.id,
      orderId: s.orderId,
      number: s.number,
      carrier: s.carrier,
      trackingNumber: s.trackingNumber,
      pieces: s.pieces,
      cartonCount: totals.cartons,
      weightKg: totals.weightKg,
      cartons: own.map(cartonView),
      shippedAt: iso(s.shippedAt)!,
      shortAccepted: s.shortAccepted,
      note: s.note,
      createdBy: s.createdBy ? (names.get(s.createdBy) ?? null) : null,
      sharedWith: [...new Set(owners.filter((o) => o.trackingNumber === s.trackingNumber && o.orderId !== s.orderId).map((o) => o.number))],
    };
  });
}

function progressOf(deps: AppDeps, orderId: string): OrderProgress {
  const order = shippingRepository.order(deps.db, orderId);
  if (!order) throw notFound('That order');
  return loadProgress(deps.db, [order], deps.now(), shippingRepository.factory(deps.db).timeZone, { calendar: calendarService.calendar(deps) }).get(orderId)!;
}

function assertShippable(p: OrderProgress) {
  if (p.status === 'cancelled') throw conflict('order_cancelled', `Order ${p.order.number} is cancelled.`);
  if (p.status === 'on_hold') throw conflict('order_on_hold', `Order ${p.order.number} is on hold; release the hold before packing or shipping.`);
  if (!SHIPPABLE.includes(p.status)) throw conflict('not_released', `Order ${p.order.number} has not been released to the floor yet.`);
}

/**
 * Brings the stored order status in line with its trays: packed once every tray has finished
 * packing, shipped (with the time of the last dispatch scan) once every tray has finished
 * dispatch. Trays written off count as done. Runs inside the scan's transaction.
 */
export function syncOrderStatus(tx: DbLike, orderId: string, now: number): 'shipped' | 'packed' | null {
  const order = shippingRepository.order(tx, orderId);
  if (!order || order.status === 'cancelled' || order.status === 'shipped') return null;
  const p = loadProgress(tx, [order], now, shippingRepository.factory(tx).timeZone, { project: false }).get(orderId)!;
  if (p.shipped.shipped && p.shipped.shippedAt) {
    const at = Date.parse(p.shipped.shippedAt);
    const ok = shippingRepository.setOrderStatus(tx, orderId, ['released', 'in_production', 'packed', 'on_hold'], {
      status: 'shipped',
      shippedAt: at,
      updatedAt: now,
    });
    return ok ? 'shipped' : null;
  }
  const live = p.trays.filter((t) => t.phase !== 'scrapped' && t.phase !== 'merged');
  if (live.length > 0 && live.every((t) => trayIsPacked(t)) && (order.status === 'released' || order.status === 'in_production')) {
    const ok = shippingRepository.setOrderStatus(tx, orderId, ['released', 'in_production'], { status: 'packed', packedAt: now, updatedAt: now });
    return ok ? 'packed' : null;
  }
  return null;
}

/**
 * After accepted scans, in their transaction: an order becomes packed or shipped as its trays
 * finish packing and dispatch (a finish with every piece scrapped can complete an order too).
 */
export function statusAfterScans(tx: DbLike, accepted: AcceptedScan[], deps: AppDeps): void {
  // Only a finish at packing or dispatch, or one that ends a tray (done, or every piece scrapped),
  // can change the order's status: other finishes skip the order's progress read.
  const orderIds = new Set(
    accepted
      .filter(
        (a) => a.type === 'finish' && (a.stationKind === 'pack' || a.stationKind === 'dispatch' || a.state.phase === 'done' || a.state.phase === 'scrapped'),
      )
      .map((a) => a.orderId),
  );
  for (const orderId of orderIds) syncOrderStatus(tx, orderId, deps.now());
}

export const shippingService = {
  /** Orders with pieces ready for packing or dispatch (or every match of `q`). */
  dispatchList(deps: AppDeps, q: string | undefined): DispatchRow[] {
    const list = q?.trim() ? shippingRepository.search(deps.db, q, 50) : shippingRepository.openOrders(deps.db);
    const progress = loadProgress(deps.db, list, deps.now(), shippingRepository.factory(deps.db).timeZone, { project: false });
    const rows: DispatchRow[] = [];
    for (const o of list) {
      const p = progress.get(o.id)!;
      const cartons = shippingRepository.cartons(deps.db, o.id);
      const qv = quantities(p, unshippedCartonPieces(cartons));
      const nearPacking = p.trays.some(
        (t) => t.stationKind === 'bag' || t.stationKind === 'clutch' || t.stationKind === 'pack' || t.stationKind === 'dispatch',
      );
      if (!q?.trim() && qv.availableToShip === 0 && !nearPacking) continue;
      rows.push({
        id: o.id,
        number: o.number,
        customer: o.customer,
        title: o.title,
        dueDate: o.dueDate,
        status: p.status,
        ordered: qv.ordered,
        finished: qv.finished,
        onFloor: qv.onFloor,
        shipped: qv.shipped,
        inCartons: qv.inCartons,
        availableToShip: qv.availableToShip,
        needsDecision: qv.needsDecision,
      });
    }
    return rows;
  },

  packing(deps: AppDeps, orderId: string): PackingView {
    const p = progressOf(deps, orderId);
    const cartons = shippingRepository.cartons(deps.db, orderId);
    const { packed, onFloor } = packedAndOnFloor(p);
    return {
      order: {
        id: p.order.id,
        number: p.order.number,
        title: p.order.title,
        customer: p.order.customer,
        status: p.status,
        quantity: p.order.quantity,
        dueDate: p.order.dueDate,
      },
      quantities: quantities(p, unshippedCartonPieces(cartons)),
      packedTrays: packed.map(trayView),
      onFloor: onFloor.map(trayView),
      cartons: cartons.filter((c) => c.shipmentId == null).map(cartonView),
      shipments: shipmentViews(deps.db, p.shipments, cartons),
      shipped: p.status === 'shipped',
      shippedAt: iso(p.shippedAt),
    };
  },

  /** Records cartons packed and waiting for dispatch. */
  pack(deps: AppDeps, orderId: string, body: PackCartonsInput, userId: string): PackingView {
    const p = progressOf(deps, orderId);
    assertShippable(p);
    const cartons = shippingRepository.cartons(deps.db, orderId);
    const q = quantities(p, unshippedCartonPieces(cartons));
    const adding = cartonTotals(body.cartons).pieces;
    if (q.inCartons + adding > q.availableToShip) {
      throw conflict(
        'more_than_made',
        `These cartons hold ${adding} pieces, but only ${Math.max(0, q.availableToShip - q.inCartons)} finished pieces are not yet in a carton or shipped.`,
        { pieces: adding, available: Math.max(0, q.availableToShip - q.inCartons) },
      );
    }
    const now = deps.now();
    deps.db.transaction((tx) => {
      for (const c of body.cartons) {
        shippingRepository.insertCarton(tx, {
          id: crypto.randomUUID(),
          orderId,
          shipmentId: null,
          count: c.count,
          piecesPerCarton: c.piecesPerCarton,
          weightKg: c.weightKg,
          createdBy: userId,
          createdAt: now,
        });
      }
      auditRepository.record(tx, now, { userId, action: 'order.pack', entity: 'order', entityId: orderId, detail: { cartons: body.cartons } });
    });
    return shippingService.packing(deps, orderId);
  },

  unpack(deps: AppDeps, orderId: string, cartonId: string, userId: string): PackingView {
    if (!shippingRepository.order(deps.db, orderId)) throw notFound('That order');
    const now = deps.now();
    deps.db.transaction((tx) => {
      if (shippingRepository.deleteUnshippedCarton(tx, orderId, cartonId) === 0) {
        throw conflict('carton_not_open', 'That carton is not a packed carton of this order waiting for dispatch.');
      }
      auditRepository.record(tx, now, { userId, action: 'order.unpack', entity: 'order', entityId: orderId, detail: { cartonId } });
    });
    return shippingService.packing(deps, orderId);
  },

  /**
   * Records a shipment: its carrier and tracking number and the cartons in it. Refuses more
   * pieces than were made and not yet shipped; asks for a decision before an order ships short;
   * warns when another order already carries the tracking number. Queues the shipped mail.
   */
  createShipment(deps: AppDeps, orderId: string, body: CreateShipment, userId: string): CreatedShipment {
    const p = progressOf(deps, orderId);
    assertShippable(p);
    const now = deps.now();
    const cartons = shippingRepository.cartons(deps.db, orderId);
    const q = quantities(p, unshippedCartonPieces(cartons));

    const packedIds: string[] = [];
    const lines: CartonLine[] = [];
    for (const c of body.cartons) {
      if ('cartonId' in c) {
        const row = cartons.find((r) => r.id === c.cartonId);
        if (!row || row.shipmentId != null)
          throw conflict('carton_not_open', 'A carton in this shipment is not a packed carton of this order waiting for dispatch.', { cartonId: c.cartonId });
        if (packedIds.includes(row.id)) continue;
        packedIds.push(row.id);
        lines.push({ count: row.count, piecesPerCarton: row.piecesPerCarton, weightKg: row.weightKg ?? 0 });
      } else lines.push(c);
    }
    // A tracking number twice on one order is a double scan of the same parcel.
    if (shippingRepository.sameOrderTracking(deps.db, body.trackingNumber, orderId)) {
      throw conflict('tracking_already_recorded', `Tracking number ${body.trackingNumber} is already recorded on this order. Scan the next parcel's barcode.`);
    }
    const totals = cartonTotals(lines);
    const allowed = checkShipmentQuantity({ made: q.finished, alreadyShipped: q.shipped, pieces: totals.pieces });
    if (!allowed.ok) {
      throw conflict(
        'more_than_made',
        `This shipment holds ${totals.pieces} pieces, but only ${allowed.available} finished pieces of order ${p.order.number} have not been shipped yet.`,
        { pieces: totals.pieces, available: allowed.available },
      );
    }
    if (q.needsDecision && !body.acceptShort) {
      throw conflict(
        'short_quantity',
        `Order ${p.order.number} will be ${q.shortBy} pieces short of the ${q.ordered} ordered (${q.reachable} made or still on the floor). Decide to ship short, or make more before shipping.`,
        { shortBy: q.shortBy, ordered: q.ordered, reachable: q.reachable },
      );
    }
    const others = shippingRepository.ordersWithTracking(deps.db, body.trackingNumber, orderId);
    if (others.length > 0 && !body.confirmDuplicate) {
      throw conflict(
        'duplicate_tracking',
        `Tracking number ${body.trackingNumber} is already recorded on order ${others.join(', ')}. Check the barcode; if the orders really travel together, confirm to record it again.`,
        { orders: others },
      );
    }

    const shipmentId = crypto.randomUUID();
    const factory = shippingRepository.factory(deps.db);
    const salesOwner = p.order.salesOwnerId ? shippingRepository.user(deps.db, p.order.salesOwnerId) : undefined;
    const missing: string[] = [];
    let queued = 0;
    const number = deps.db.transaction((tx) => {
      const n = shippingRepository.nextShipmentNumber(tx, orderId);
      shippingRepository.insertShipment(tx, {
        id: shipmentId,
        orderId,
        number: n,
        carrier: body.carrier,
        trackingNumber: body.trackingNumber,
        pieces: totals.pieces,
        shippedAt: now,
        shortAccepted: !!body.acceptShort && q.verdict === 'under',
        note: body.note ?? null,
        createdBy: userId,
        createdAt: now,
      });
      if (shippingRepository.assignCartons(tx, packedIds, shipmentId) !== packedIds.length) {
        throw conflict('carton_not_open', 'A packed carton was shipped by someone else a moment ago. Reload and try again.');
      }
      for (const c of body.cartons) {
        if ('cartonId' in c) continue;
        shippingRepository.insertCarton(tx, {
          id: crypto.randomUUID(),
          orderId,
          shipmentId,
          count: c.count,
          piecesPerCarton: c.piecesPerCarton,
          weightKg: c.weightKg,
          createdBy: userId,
          createdAt: now,
        });
      }
      auditRepository.record(tx, now, {
        userId,
        action: 'order.ship',
        entity: 'order',
        entityId: orderId,
        detail: {
          shipment: n,
          carrier: body.carrier,
          trackingNumber: body.trackingNumber,
          pieces: totals.pieces,
          acceptShort: !!body.acceptShort,
          duplicateOf: others,
        },
      });

      // The shipped mail, queued in the same transaction: it goes out once the shipment is on record.
      const link = createLinkIn(tx, deps, orderId, userId, 'shipped_mail');
      const remaining = Math.max(0, q.reachable - q.shipped - totals.pieces);
      const base = {
        factory: factory.name,
        timeZone: factory.timeZone,
        orderNumber: p.order.number,
        title: p.order.title,
        contactName: p.order.contactName,
        carrier: body.carrier,
        trackingNumber: body.trackingNumber,
        shipmentNumber: n,
        cartons: totals.cartons,
        pieces: totals.pieces,
        piecesToFollow: remaining,
        shippedAt: now,
        statusUrl: link.url,
      };
      if (p.order.contactEmail) {
        enqueueMail(tx, now, { kind: 'order_shipped', to: p.order.contactEmail, orderId, ...shippedMail(base) });
        queued++;
      } else missing.push('customer contact');
      if (salesOwner?.active && salesOwner.email) {
        enqueueMail(tx, now, { kind: 'order_shipped', to: salesOwner.email, orderId, ...shippedMail({ ...base, forSales: { customer: p.order.customer } }) });
        queued++;
      } else missing.push('sales owner');
      return n;
    });
    kickMail(deps);
    const rows = shippingRepository.shipments(deps.db, [orderId]);
    const view = shipmentViews(deps.db, rows, shippingRepository.cartons(deps.db, orderId)).find((s) => s.number === number)!;
    return { ...view, mail: { queued, missing } };
  },

  shipments(deps: AppDeps, orderId: string): ShipmentView[] {
    if (!shippingRepository.order(deps.db, orderId)) throw notFound('That order');
    return shipmentViews(deps.db, shippingRepository.shipments(deps.db, [orderId]), shippingRepository.cartons(deps.db, orderId));
  },

  /** The packing list of one shipment as a PDF. */
  async packingList(deps: AppDeps, orderId: string, shipmentId: string): Promise<{ pdf: Buffer; filename: string }> {
    const p = progressOf(deps, orderId);
    const row = shippingRepository.shipmentById(deps.db, shipmentId);
    if (!row || row.orderId !== orderId) throw notFound('That shipment');
    const cartons = shippingRepository.cartons(deps.db, orderId);
    const view = shipmentViews(deps.db, [row], cartons)[0];
    const factory = shippingRepository.factory(deps.db);
    const allShipped = p.shipments.filter((s) => s.number <= row.number).reduce((a, s) => a + s.pieces, 0);
    const pdf = await renderPackingList(
      {
        factory: factory.name,
        timeZone: factory.timeZone,
        orderNumber: p.order.number,
        title: p.order.title,
        customer: p.order.customer,
        contactName: p.order.contactName,
        ordered: p.order.quantity,
        shipment: view,
        shippedSoFar: allShipped,
      },
      printWords(factorySettingsService.language(deps)),
    );
    return { pdf, filename: `packing-list-${p.order.number}-${row.number}.pdf` };
  },
};
