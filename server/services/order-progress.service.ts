// Where orders stand, read in one go for many orders: travellers, routing, dispatch scans,
// shipments; from these the customer stage, the plain-words text, the quantities and the
// projected ship date.
import type { DbLike } from '../db/client';
import type { WorkingCalendar } from '@shared/domain/calendar';
import { shippingRepository, type ShipmentRow, type ShippingOrder } from '../repositories/shipping.repository';
import { describeStage, stageNote, type StageNote, orderStage, type OrderStage, type TravellerProgress } from '@shared/domain/stages';
import {
  cartonTotals,
  checkFinishedQuantity,
  orderShipped,
  projectedPastDue,
  trayIsPacked,
  trayReachedPacking,
  type ShippedVerdict,
  type TrayPackState,
} from '@shared/domain/shipping';
import type { OrderStatus, StationKind, TrayPhase } from '@shared/domain/vocabulary';
import type { QuantityCheckView, TrayOnFloor } from '@shared/schemas/shipping';
import { projectOrder, type ProjectionStep, type ProjectionTraveller, type ShipDate } from './ship-date.service';

export interface TravellerInfo extends ProjectionTraveller, TrayPackState {
  number: string;
  orderId: string;
  stepName: string | null;
  stationKind: StationKind | null;
}

export interface OrderProgress {
  order: ShippingOrder;
  /** the status to show: a stored status, or shipped once the last dispatch scan says so */
  status: OrderStatus;
  travellers: TravellerInfo[];
  trays: TravellerInfo[];
  steps: ProjectionStep[];
  stage: OrderStage;
  stageText: string;
  stageNote: StageNote;
  shipped: ShippedVerdict;
  shippedAt: number | null;
  shipments: ShipmentRow[];
  projection: ShipDate;
  late: boolean;
}

const WRITTEN_OFF: TrayPhase[] = ['scrapped', 'merged'];

export interface ProgressOptions {
  /** false: skip ship dates (status checks inside a scan) */
  project?: boolean;
  /** measured ship dates by order (the projection service); others get the simple projection */
  shipDates?: Map<string, ShipDate>;
  /** the factory's working calendar for the simple projection (default: the default week in `timeZone`) */
  calendar?: WorkingCalendar;
}

export function loadProgress(db: DbLike, list: ShippingOrder[], now: number, timeZone: string, options: ProgressOptions = {}): Map<string, OrderProgress> {
  const ids = list.map((o) => o.id);
  const rows = shippingRepository.travellers(db, ids);
  const steps = shippingRepository.steps(db, ids);
  const dispatch = new Map(
    shippingRepository
      .dispatchFinishes(
        db,
        rows.filter((r) => r.kind === 'tray').map((r) => r.id),
      )
      .map((d) => [d.trayId, d.at]),
  );
  const shipments = shippingRepository.shipments(db, ids);
  const stepsByOrder = groupBy(steps, (s) => s.orderId);
  const rowsByOrder = groupBy(rows, (r) => r.orderId);
  const shipmentsByOrder = groupBy(shipments, (s) => s.orderId);
  const out = new Map<string, OrderProgress>();
  for (const order of list) {
    const orderSteps = (stepsByOrder.get(order.id) ?? []) as (ProjectionStep & { name: string; orderId: string })[];
    const routing = {
      tray: orderSteps.filter((s) => s.travellerKind === 'tray'),
      mould: orderSteps.filter((s) => s.travellerKind === 'mould'),
    };
    const travellers: TravellerInfo[] = (rowsByOrder.get(order.id) ?? []).map((r) => {
      const phase: TrayPhase = r.writtenOffAt != null ? 'scrapped' : ((r.phase ?? 'waiting') as TrayPhase);
      const stepSeq = phase === 'done' || WRITTEN_OFF.includes(phase) ? null : (r.stepSeq ?? (r.phase ? null : 1));
      const own = routing[r.kind];
      const step = stepSeq == null ? undefined : own.find((s) => s.seq === stepSeq);
      return {
        id: r.id,
        orderId: r.orderId,
        number: r.number,
        kind: r.kind,
        phase,
        stepSeq,
        quantity: r.stateQuantity ?? r.quantity,
        onHold: !!r.onHold,
        startedAt: r.startedAt ?? null,
        waitingSince: r.waitingSince ?? null,
        cureReadyAt: r.cureReadyAt ?? null,
        lastEventAt: r.lastEventAt ?? null,
        routing: own.map((s) => ({ seq: s.seq, stationKind: s.stationKind as StationKind })),
        stepName: step?.name ?? null,
        stationKind: (step?.stationKind as StationKind | undefined) ?? null,
      };
    });
    const trays = travellers.filter((t) => t.kind === 'tray');
    const verdict = orderShipped(
      trays.map((t) => ({ phase: t.phase, dispatchFinishedAt: dispatch.has(t.id) ? new Date(dispatch.get(t.id) as number).toISOString() : null })),
    );
    const stored = order.status as OrderStatus;
    const status: OrderStatus = stored !== 'cancelled' && verdict.shipped ? 'shipped' : stored;
    const progressInput: TravellerProgress[] = travellers.map((t) => ({
      kind: t.kind,
      phase: t.phase,
      stepSeq: t.stepSeq,
      routing: t.routing,
      onHold: t.onHold,
    }));
    const stage = orderStage({ status, travellers: progressInput });
    const stageText = describeStage({ status, travellers: progressInput });
    const note = stageNote({ status, travellers: progressInput });
    const shippedAt = status === 'shipped' ? (order.shippedAt ?? (verdict.shippedAt ? Date.parse(verdict.shippedAt) : null)) : null;
    const measured = options.shipDates?.get(order.id);
    const open = status !== 'shipped' && status !== 'cancelled';
    const projection: ShipDate =
      options.project === false
        ? { expectedAt: null, basis: '', note: { code: 'after_release' } }
        : open && measured
          ? measured
          : projectOrder({ status, travellers, steps: orderSteps }, now, timeZone, options.calendar);
    const late =
      status === 'shipped'
        ? shippedAt != null && projectedPastDue(shippedAt, order.dueDate, timeZone)
        : status !== 'cancelled' &&
          (projection.expectedAt != null ? projectedPastDue(projection.expectedAt, order.dueDate, timeZone) : projectedPastDue(now, order.dueDate, timeZone));
    out.set(order.id, {
      order,
      status,
      travellers,
      trays,
      steps: orderSteps,
      stage,
      stageText,
      stageNote: note,
      shipped: verdict,
      shippedAt,
      shipments: shipmentsByOrder.get(order.id) ?? [],
      projection,
      late,
    });
  }
  return out;
}

export function trayView(t: TravellerInfo): TrayOnFloor {
  return { id: t.id, number: t.number, quantity: t.quantity, phase: t.phase, stationKind: t.stationKind, stepName: t.stepName, onHold: t.onHold };
}

/** The order's pieces: finished, on the floor, in cartons, shipped; and the check against ordered + allowance. */
export function quantities(p: OrderProgress, unshippedCartonPieces: number): QuantityCheckView {
  let finished = 0;
  let onFloor = 0;
  for (const t of p.trays) {
    if (WRITTEN_OFF.includes(t.phase)) continue;
    if (trayReachedPacking(t)) finished += t.quantity;
    else onFloor += t.quantity;
  }
  const shipped = p.shipments.reduce((a, s) => a + s.pieces, 0);
  const reachable = finished + onFloor;
  const check = checkFinishedQuantity({ ordered: p.order.quantity, overrunPct: p.order.overrunPct, made: reachable });
  const shortAccepted = p.shipments.some((s) => s.shortAccepted);
  return {
    verdict: check.verdict,
    ordered: p.order.quantity,
    overrunPct: p.order.overrunPct,
    maxExpected: check.maxExpected,
    finished,
    onFloor,
    reachable,
    shipped,
    availableToShip: Math.max(0, finished - shipped),
    inCartons: unshippedCartonPieces,
    shortBy: check.shortBy,
    overBy: check.overBy,
    needsDecision: check.needsDecision && !shortAccepted,
    shortAccepted,
  };
}

export function packedAndOnFloor(p: OrderProgress): { packed: TravellerInfo[]; onFloor: TravellerInfo[] } {
  const packed: TravellerInfo[] = [];
  const onFloor: TravellerInfo[] = [];
  for (const t of p.trays) {
    if (WRITTEN_OFF.includes(t.phase)) continue;
    (trayIsPacked(t) ? packed : onFloor).push(t);
  }
  return { packed, onFloor };
}

export function unshippedCartonPieces(cartons: { count: number; piecesPerCarton: number; weightKg: number | null; shipmentId: string | null }[]): number {
  const open = cartons.filter((c) => c.shipmentId == null);
  return open.length ? cartonTotals(open.map((c) => ({ count: c.count, piecesPerCarton: c.piecesPerCarton, weightKg: c.weightKg ?? 0 }))).pieces : 0;
}

function groupBy<T>(items: T[], key: (item: T) => string): Map<string, T[]> {
  const out = new Map<string, T[]>();
  for (const item of items) {
    const k = key(item);
    const list = out.get(k);
    if (list) list.push(item);
    else out.set(k, [item]);
  }
  return out;
}
