// An order's spec and the routing made from it: the one spec ↔ row mapping (entry, change, the
// import, quotes turned into orders), the template a process uses, and the step rows.
import crypto from 'node:crypto';
import type { DbLike } from '../db/client';
import { ordersRepository, type OrderRow } from '../repositories/orders.repository';
import type { OrderStepRow } from '../repositories/scans.repository';
import type { OrderSpec, ProductType } from '@shared/schemas/orders';
import { routingTemplateSchema } from '@shared/schemas/routing';
import { DEFAULT_ROUTING_TEMPLATES, expandRouting, type RoutingSpec, type RoutingTemplate } from '@shared/domain/routing';
import type { BackingType, Process, RoutingStep, StationKind, TravellerKind } from '@shared/domain/vocabulary';

/** An order's spec without who it is for (what the routing and the row are made from). */
export type OrderSpecFields = Omit<OrderSpec, 'customer' | 'customerId' | 'reorderOf'>;

/** The columns an order spec fills (one mapping for entry and change). */
export function specColumns(spec: OrderSpecFields) {
  return {
    title: spec.title,
    productType: spec.productType,
    process: spec.process,
    material: spec.material,
    sizeMm: spec.sizeMm,
    quantity: spec.quantity,
    overrunPct: spec.overrunPct,
    colours: spec.colours,
    plating: spec.plating,
    secondPlating: spec.secondPlating,
    backingType: spec.backing.type,
    backingCount: spec.backing.count,
    backLogo: spec.backLogo,
    printing: spec.printing,
    epoxy: spec.epoxy,
    sandblast: spec.sandblast,
    packaging: spec.packaging,
    dueDate: spec.dueDate,
    notes: spec.notes,
    priceTotal: spec.priceTotal ?? null,
    currency: spec.currency ?? null,
  };
}

/** The spec fields that shape the routing: a change to one of them makes the routing again. */
export function routingShape(spec: OrderSpecFields): string {
  return JSON.stringify([
    spec.process,
    spec.colours.length,
    spec.backLogo,
    spec.printing,
    spec.epoxy,
    spec.backing,
    spec.plating,
    spec.secondPlating,
    spec.sandblast,
  ]);
}

export function specOf(order: OrderRow): OrderSpecFields {
  return {
    title: order.title,
    productType: order.productType as ProductType,
    process: order.process as Process,
    material: order.material as OrderSpec['material'],
    sizeMm: order.sizeMm,
    quantity: order.quantity,
    overrunPct: order.overrunPct,
    colours: order.colours,
    plating: order.plating as OrderSpec['plating'],
    secondPlating: (order.secondPlating ?? null) as OrderSpec['secondPlating'],
    backing: { type: order.backingType as BackingType, count: order.backingCount },
    backLogo: order.backLogo,
    printing: order.printing,
    epoxy: order.epoxy,
    sandblast: order.sandblast,
    packaging: order.packaging as OrderSpec['packaging'],
    dueDate: order.dueDate,
    notes: order.notes,
    ...(order.priceTotal != null ? { priceTotal: order.priceTotal } : {}),
    ...(order.currency ? { currency: order.currency } : {}),
  };
}

/** The template admins keep for the process (the built-in default when none is stored or it is damaged). */
export function templateFor(db: DbLike, process: Process): RoutingTemplate {
  const row = ordersRepository.template(db, process);
  const parsed = row ? routingTemplateSchema.safeParse(row.template) : null;
  return parsed?.success ? parsed.data : DEFAULT_ROUTING_TEMPLATES[process];
}

/** The routing the process's template makes for a spec. */
export function routingFromSpec(db: DbLike, spec: RoutingSpec & { process: Process }): RoutingStep[] {
  return expandRouting(templateFor(db, spec.process), spec);
}

/** The order_steps rows of a traveller kind's routing. */
export function stepRows(orderId: string, kind: TravellerKind, steps: RoutingStep[]) {
  return steps.map((s) => ({
    id: crypto.randomUUID(),
    orderId,
    travellerKind: kind,
    seq: s.seq,
    name: s.name,
    stationKind: s.stationKind,
    trayMinutes: s.trayMinutes,
    pieceMinutes: s.pieceMinutes,
    cureMinutes: s.cureMinutes ?? null,
    colour: s.colour ?? null,
  }));
}

/** A stored step as the routing step the guards and screens read. */
export function toRoutingStep(r: Pick<OrderStepRow, 'seq' | 'name' | 'stationKind' | 'trayMinutes' | 'pieceMinutes' | 'cureMinutes' | 'colour'>): RoutingStep {
  return {
    seq: r.seq,
    name: r.name,
    stationKind: r.stationKind as StationKind,
    trayMinutes: r.trayMinutes,
    pieceMinutes: r.pieceMinutes,
    cureMinutes: r.cureMinutes,
    colour: r.colour,
  };
}

export function routingOf(db: DbLike, orderId: string, kind: TravellerKind): RoutingStep[] {
  return ordersRepository.steps(db, orderId, kind).map(toRoutingStep);
}
