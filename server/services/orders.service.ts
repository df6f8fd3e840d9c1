// Orders from entry to release: the spec, the payment and proof gates, the routing made from
// the spec, and the release that creates trays, mould travellers and their first states.
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import type { DbLike } from '../db/client';
import { ordersRepository, type OrderRow } from '../repositories/orders.repository';
import { traysRepository, type TrayRow, type TrayStateInsert, type TrayStateRow } from '../repositories/trays.repository';
import { mouldsRepository } from '../repositories/moulds.repository';
import { auditRepository } from '../repositories/audit.repository';
import { AppError, badInput, conflict, forbidden, notFound } from '../errors';
import { putFile, putThumbnail, readFile } from '../lib/file-store';
import { checkUploadName } from '../lib/uploads';
import { decodeUpload, type DecodedUpload } from '../lib/upload-decode';
import {
  checkReleasedAt,
  orderSpecSchema,
  specWarnings,
  type OrderDetail,
  type OrderGate,
  type OrderListItem,
  type OrderMouldView,
  type OrderSpec,
  type OrderSpecPatch,
  type PaymentBody,
  type ProofApprovalBody,
  type ReleaseBody,
  type ReleaseResult,
  type TravellerSummary,
  type ProductType,
} from '@shared/schemas/orders';
import { routingTemplateSchema, type RoutingEditBody } from '@shared/schemas/routing';
import {
  DEFAULT_ROUTING_TEMPLATES,
  expandRouting,
  mouldRouting,
  mouldStepsFor,
  mouldTool,
  requiredMoulds,
  type MouldSide,
  type RoutingTemplate,
} from '@shared/domain/routing';
import { MAX_TRAYS_PER_RELEASE, mouldNumber, releasedQuantity, splitIntoTrays, trayNumber } from '@shared/domain/trays';
import { makeTravellerCode } from '@shared/domain/traveller-code';
import { previewOrderImport } from '@shared/domain/order-import';
import { localDate } from '@shared/domain/calendar';
import { loadProgress } from './order-progress.service';
import { approveProofIn, openGates, paymentSummaryOf, PRE_RELEASE_STATUSES, preReleaseStatus, recordPaymentIn, refreshStatus } from './order-gates';
import { shipDateService } from './ship-date.service';
import {
  initialTrayState,
  type BackingType,
  type OrderStatus,
  type Process,
  type Role,
  type RoutingStep,
  type StationKind,
  type TrayPhase,
  type TravellerKind,
} from '@shared/domain/vocabulary';
import { cures, kindTraits } from '@shared/domain/traveller';

/** Roles that may record a payment exception (release without payment). */
export const EXCEPTION_ROLES: readonly Role[] = ['manager', 'admin'];
export const FIRST_ORDER_NUMBER = 1001;
/** Tray size used for standard minutes before the planner has chosen one. */
export const DEFAULT_TRAY_SIZE = 100;

const iso = (ms: number | null | undefined) => (ms == null ? null : new Date(ms).toISOString());
const today = (now: number) => new Date(now).toISOString().slice(0, 10);

// ---------------------------------------------------------------------------------------
// Small helpers

function getOrder(db: DbLike, id: string): OrderRow {
  const order = ordersRepository.byId(db, id);
  if (!order) throw notFound('That order');
  return order;
}

function isReleased(order: OrderRow): boolean {
  return order.releasedAt != null;
}

function refuseIfReleased(order: OrderRow, what: string) {
  if (isReleased(order)) {
    throw conflict('already_released', `Order ${order.number} is released to the floor; ${what} can no longer be changed.`);
  }
  if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
}

/** The columns an order spec fills (one mapping for entry and change). */
function specColumns(spec: OrderSpec) {
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
function routingShape(spec: Omit<OrderSpec, 'customer' | 'customerId' | 'reorderOf'>): string {
  return JSON.stringify([spec.process, spec.colours.length, spec.backLogo, spec.printing, spec.epoxy, spec.backing, spec.plating, spec.secondPlating, spec.sandblast]);
}

export function specOf(order: OrderRow): Omit<OrderSpec, 'customer' | 'customerId' | 'reorderOf'> {
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

function stepRows(orderId: string, kind: TravellerKind, steps: RoutingStep[]) {
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

export function routingOf(db: DbLike, orderId: string, kind: TravellerKind): RoutingStep[] {
  return ordersRepository.steps(db, orderId, kind).map((s) => ({
    seq: s.seq,
    name: s.name,
    stationKind: s.stationKind as StationKind,
    trayMinutes: s.trayMinutes,
    pieceMinutes: s.pieceMinutes,
    cureMinutes: s.cureMinutes,
    colour: s.colour,
  }));
}

const GATE_MESSAGES: Record<OrderGate, string> = {
  payment_missing: 'No payment is recorded (nor a manager’s exception). Record the payment first.',
  proof_not_approved: 'The latest artwork proof is not approved by the customer yet. Record the approval first.',
};

function isLate(order: OrderRow, now: number): boolean {
  if (order.status === 'cancelled') return false;
  if (order.shippedAt != null) return today(order.shippedAt) > order.dueDate;
  return today(now) > order.dueDate;
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

function audit(db: DbLike, now: number, userId: string | null, action: string, orderId: string, text: string, extra: Record<string, unknown> = {}) {
  auditRepository.record(db, now, { userId, action, entity: 'order', entityId: orderId, detail: { text, ...extra } });
}

export function travellerCode(deps: AppDeps, tray: Pick<TrayRow, 'number' | 'revision'>): string {
  return makeTravellerCode({ number: tray.number, revision: tray.revision }, deps.keys.traveller);
}

/** A tray_states row for a traveller just released, waiting for `stepSeq`. */
export function releasedStateRow(input: {
  trayId: string;
  kind: TravellerKind;
  quantity: number;
  releasedAt: number;
  stepSeq: number;
  stationKind: string | null;
  now: number;
}): TrayStateInsert {
  const s = initialTrayState({ trayId: input.trayId, kind: input.kind, quantity: input.quantity, releasedAt: new Date(input.releasedAt).toISOString() });
  return {
    trayId: s.trayId,
    kind: s.kind,
    phase: s.phase,
    stepSeq: input.stepSeq,
    stationKind: input.stationKind,
    quantity: s.quantity,
    stationId: s.stationId,
    startedAt: null,
    waitingSince: Date.parse(s.waitingSince!),
    cureReadyAt: null,
    onHold: s.onHold,
    holdReason: s.holdReason,
    releasedAt: input.releasedAt,
    lastEventAt: null,
    updatedAt: input.now,
  };
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
  return loadProgress(deps.db, list, deps.now(), shipDateService.timeZone(deps), { project: true, shipDates: shipDateService.measuredShipDates(deps, list.map((o) => o.id)) });
}

// ---------------------------------------------------------------------------------------

/** Today's date where the factory is. */
function factoryToday(deps: AppDeps): string {
  return localDate(shipDateService.timeZone(deps), deps.now());
}

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
        late: p?.late ?? isLate(order, deps.now()),
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
    const history = ordersRepository.history(
      db,
      id,
      travellers.map((t) => t.tray.id),
    ).map(({ entry, by }) => ({
      at: iso(entry.at)!,
      action: entry.action,
      by: by ?? null,
      text: (entry.detail as { text?: string } | null)?.text ?? entry.action,
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
      late: progress?.late ?? isLate(order, deps.now()),
      projectedShipAt: iso(progress?.projection.expectedAt),
      projectionNote: progress?.projection.basis || null,
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
      routing: routing.map((s) => ({ ...s, standardMinutes: Math.round((s.trayMinutes + s.pieceMinutes * traySize) * 10) / 10 })),
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
      ordersRepository.replaceSteps(tx, id, 'tray', stepRows(id, 'tray', expandRouting(templateFor(tx, input.process), input)));
      audit(tx, now, actorId, 'order.create', id, `Order ${number} entered${input.reorderOf ? ' as a repeat of an earlier design' : ''}`);
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
        ordersRepository.replaceSteps(tx, id, 'tray', stepRows(id, 'tray', expandRouting(templateFor(tx, spec.process), spec)));
        audit(tx, now, actorId, 'order.update', id, `Spec changed (${changed}); routing made again from the template`);
      } else {
        audit(tx, now, actorId, 'order.update', id, `Spec changed (${changed})`);
      }
    });
    return ordersService.get(deps, id);
  },

  recordPayment(deps: AppDeps, id: string, body: PaymentBody, actor: { id: string; role: Role }) {
    const { db } = deps;
    const now = deps.now();
    if ('exception' in body && !EXCEPTION_ROLES.includes(actor.role)) {
      throw forbidden('Only a manager can let an order start without payment.');
    }
    db.transaction((tx) => {
      const order = getOrder(tx, id);
      if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
      const paymentId = crypto.randomUUID();
      if ('exception' in body) {
        ordersRepository.insertPayment(tx, { id: paymentId, orderId: id, amount: null, reference: 'exception', isException: true, note: body.reason, recordedBy: actor.id, recordedAt: now });
        audit(tx, now, actor.id, 'order.payment_exception', id, `Release without payment allowed: ${body.reason}`);
      } else {
        const note = body.paidOn ? `paid on ${body.paidOn}` : '';
        recordPaymentIn(tx, now, { orderId: id, amount: body.amount, currency: body.currency, reference: body.reference, source: 'manual', recordedBy: actor.id, note });
        return;
      }
      refreshStatus(tx, order, now);
    });
    return ordersService.get(deps, id);
  },

  async uploadProof(deps: AppDeps, id: string, file: Express.Multer.File | undefined, actorId: string): Promise<{ revision: number }> {
    const { db } = deps;
    const order = getOrder(db, id);
    if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
    if (!file) throw badInput('Choose a proof file to upload (field "file").', undefined, 'file_missing');
    const name = checkUploadName(file.originalname);
    if (file.size === 0 || file.buffer.length === 0) throw badInput('The file is empty.', undefined, 'empty_file');
    // decoded in full before anything is kept; the thumbnail is what travellers print
    const decoded = await decodeUpload(file.buffer, name, ['application/pdf', 'image/png', 'image/jpeg']);
    return ordersService.storeProof(deps, id, { buffer: file.buffer, name, decoded }, actorId);
  },

  /** Keeps a proof that decodeUpload has checked, with its thumbnail, as the next revision. */
  storeProof(deps: AppDeps, id: string, file: { buffer: Buffer; name: string; decoded: DecodedUpload }, actorId: string): { revision: number } {
    const { db } = deps;
    const order = getOrder(db, id);
    if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
    const { name } = file;
    const { mime, thumbnail } = file.decoded;
    const now = deps.now();
    const { hash, sizeBytes } = putFile(deps.env.dataDir, file.buffer);
    if (thumbnail) putThumbnail(deps.env.dataDir, hash, thumbnail);
    return db.transaction((tx) => {
      const existing = ordersRepository.proofs(tx, id);
      const revision = (existing[existing.length - 1]?.revision ?? 0) + 1;
      ordersRepository.insertProof(tx, {
        id: crypto.randomUUID(),
        orderId: id,
        revision,
        fileHash: hash,
        mime,
        sizeBytes,
        originalName: name,
        uploadedBy: actorId,
        uploadedAt: now,
      });
      audit(tx, now, actorId, 'order.proof_upload', id, `Proof revision ${revision} uploaded (${name})`);
      refreshStatus(tx, getOrder(tx, id), now);
      return { revision };
    });
  },

  proofFile(deps: AppDeps, id: string, revision: number) {
    const order = getOrder(deps.db, id);
    const proof = ordersRepository.proof(deps.db, id, revision);
    if (!proof) throw notFound(`Proof revision ${revision}`);
    const content = readFile(deps.env.dataDir, proof.fileHash);
    if (!content) throw notFound('The stored proof file');
    const ext = proof.mime === 'application/pdf' ? 'pdf' : proof.mime === 'image/png' ? 'png' : 'jpg';
    return { content, mime: proof.mime, downloadName: `proof-${order.number}-rev${revision}.${ext}` };
  },

  approveProof(deps: AppDeps, id: string, revision: number, body: ProofApprovalBody, actorId: string) {
    const now = deps.now();
    if (body.approvedOn && body.approvedOn > today(now)) {
      throw badInput('The approval date cannot be in the future.', [{ path: ['approvedOn'], message: 'In the future' }]);
    }
    const approvedAt = body.approvedOn ? Math.min(Date.parse(`${body.approvedOn}T12:00:00Z`), now) : now;
    deps.db.transaction((tx) => approveProofIn(tx, now, { orderId: id, revision, approvedAt, userId: actorId, customerName: null, note: body.note ?? null }));
    return ordersService.get(deps, id);
  },

  editRouting(deps: AppDeps, id: string, body: RoutingEditBody, actorId: string) {
    const { db } = deps;
    const now = deps.now();
    db.transaction((tx) => {
      const order = getOrder(tx, id);
      refuseIfReleased(order, 'its routing');
      const steps: RoutingStep[] = body.steps.map((s, i) => ({ ...s, seq: i + 1, cureMinutes: cures(s.stationKind) ? (s.cureMinutes ?? null) : null, colour: s.colour ?? null }));
      ordersRepository.replaceSteps(tx, id, 'tray', stepRows(id, 'tray', steps));
      ordersRepository.update(tx, id, { updatedAt: now });
      audit(tx, now, actorId, 'order.routing_edit', id, `Routing edited: ${steps.length} steps`);
    });
    return ordersService.get(deps, id);
  },

  resetRouting(deps: AppDeps, id: string, actorId: string) {
    const { db } = deps;
    const now = deps.now();
    db.transaction((tx) => {
      const order = getOrder(tx, id);
      refuseIfReleased(order, 'its routing');
      const spec = specOf(order);
      ordersRepository.replaceSteps(tx, id, 'tray', stepRows(id, 'tray', expandRouting(templateFor(tx, spec.process), spec)));
      audit(tx, now, actorId, 'order.routing_reset', id, 'Routing made again from the template');
    });
    return ordersService.get(deps, id);
  },

  release(deps: AppDeps, id: string, body: ReleaseBody, actorId: string): ReleaseResult {
    const { db } = deps;
    const now = deps.now();
    let releasedAt = now;
    if (body.releasedAt) {
      const problem = checkReleasedAt(body.releasedAt, new Date(now));
      if (problem) throw badInput(problem, [{ path: ['releasedAt'], message: problem }], 'bad_released_at');
      releasedAt = Math.min(Date.parse(body.releasedAt), now);
    }
    const created = db.transaction((tx) => {
      const order = getOrder(tx, id);
      if (isReleased(order)) throw conflict('already_released', `Order ${order.number} was released already.`);
      if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
      if (order.status === 'on_hold') throw conflict('order_on_hold', `Order ${order.number} is on hold: ${order.holdReason ?? 'no reason given'}.`);
      const gates = openGates(tx, id);
      if (gates.length) {
        throw new AppError(409, gates[0], gates.map((g) => GATE_MESSAGES[g]).join(' '), { missing: gates });
      }
      const spec = specOf(order);
      let routing = routingOf(tx, id, 'tray');
      if (routing.length === 0) {
        routing = expandRouting(templateFor(tx, spec.process), spec);
        ordersRepository.replaceSteps(tx, id, 'tray', stepRows(id, 'tray', routing));
      }
      const total = releasedQuantity(order.quantity, order.overrunPct);
      const parts = splitIntoTrays(total, body.traySize);
      if (parts.length > MAX_TRAYS_PER_RELEASE) {
        throw badInput(
          `${parts.length} trays is more than ${MAX_TRAYS_PER_RELEASE}; choose a larger tray size.`,
          [{ path: ['traySize'], message: 'Too many trays' }],
          'too_many_trays',
        );
      }

      // moulds: reuse the stored ones of this design, make the others
      const plan = requiredMoulds(spec).map((side) => ({ side, stored: mouldsRepository.reusable(tx, order.designKey, side) }));
      const anyNew = plan.some((p) => !p.stored);
      const mouldSteps = mouldRouting({ reuse: !anyNew, process: spec.process });
      ordersRepository.replaceSteps(tx, id, 'mould', stepRows(id, 'mould', mouldSteps));
      const checkSeq = mouldSteps.find((s) => kindTraits(s.stationKind).mouldShop === 'check')!.seq;
      const mouldTravellers: ReleaseResult['moulds'] = [];
      for (const { side, stored } of plan) {
        let mouldId: string;
        if (stored) {
          mouldId = stored.id;
          mouldsRepository.update(tx, mouldId, { useCount: stored.useCount + 1, status: 'checking', updatedAt: now });
        } else {
          mouldId = crypto.randomUUID();
          mouldsRepository.insert(tx, {
            id: mouldId,
            number: mouldNumber(order.number, side),
            designKey: order.designKey,
            side,
            firstOrderId: id,
            status: 'engraving',
            useCount: 1,
            createdAt: now,
            updatedAt: now,
          });
        }
        mouldsRepository.link(tx, id, mouldId);
        const trayId = crypto.randomUUID();
        const number = mouldNumber(order.number, side);
        traysRepository.insert(tx, { id: trayId, number, kind: 'mould', orderId: id, mouldId, revision: 1, quantity: 1, releasedAt, createdAt: now });
        // a stored mould skips engraving: its traveller starts at the check
        const firstSeq = stored ? checkSeq : 1;
        const firstKind = mouldSteps.find((s) => s.seq === firstSeq)!.stationKind;
        traysRepository.insertState(tx, releasedStateRow({ trayId, kind: 'mould', quantity: 1, releasedAt, stepSeq: firstSeq, stationKind: firstKind, now }));
        mouldTravellers.push({ id: trayId, number, code: travellerCode(deps, { number, revision: 1 }), quantity: 1 });
      }

      const trayTravellers: ReleaseResult['trays'] = parts.map((quantity, i) => {
        const trayId = crypto.randomUUID();
        const number = trayNumber(order.number, i + 1);
        traysRepository.insert(tx, { id: trayId, number, kind: 'tray', orderId: id, revision: 1, quantity, releasedAt, createdAt: now });
        traysRepository.insertState(tx, releasedStateRow({ trayId, kind: 'tray', quantity, releasedAt, stepSeq: 1, stationKind: routing[0].stationKind, now }));
        return { id: trayId, number, code: travellerCode(deps, { number, revision: 1 }), quantity };
      });

      const moved = ordersRepository.updateIfStatus(tx, id, PRE_RELEASE_STATUSES, { status: 'released', traySize: body.traySize, releasedAt, updatedAt: now });
      if (!moved) throw conflict('already_released', `Order ${order.number} was released already.`);
      const reused = plan.filter((p) => p.stored).length;
      audit(
        tx,
        now,
        actorId,
        'order.release',
        id,
        `Released ${total} pieces in ${parts.length} trays of up to ${body.traySize}` +
          `${body.releasedAt ? ` (on the floor since ${new Date(releasedAt).toISOString().slice(0, 16).replace('T', ' ')} UTC)` : ''}` +
          `; ${plan.length} mould traveller${plan.length === 1 ? '' : 's'}${reused ? ` (${reused} reusing a stored mould)` : ''}`,
      );
      return { trays: trayTravellers, moulds: mouldTravellers };
    });
    return created;
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
      audit(tx, now, actorId, 'order.hold', id, `Put on hold: ${reason}`);
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
      audit(tx, now, actorId, 'order.resume', id, 'Hold lifted');
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
      audit(tx, now, actorId, 'order.cancel', id, `Cancelled: ${reason}`);
    });
    return ordersService.get(deps, id);
  },

  previewImport: (deps: AppDeps, csv: string) => previewOrderImport(csv, factoryToday(deps)),

  importOrders(deps: AppDeps, csv: string, actorId: string) {
    const preview = previewOrderImport(csv, factoryToday(deps));
    if (preview.validCount === 0) {
      throw badInput(
        preview.fileErrors.join(' ') || 'No row can be imported.',
        preview.rows.flatMap((r) => r.errors.map((e) => ({ path: [r.line, e.column ?? ''], message: e.message }))),
        'nothing_to_import',
      );
    }
    const created = deps.db.transaction((tx) =>
      preview.rows
        .filter((r) => r.spec)
        .map((r) => {
          const id = ordersService.createInTx(deps, tx, r.spec!, actorId);
          return { line: r.line, id, number: ordersRepository.byId(tx, id)!.number };
        }),
    );
    return { created, skipped: preview.rows.filter((r) => !r.spec).map((r) => r.line) };
  },

  listTemplates(deps: AppDeps) {
    return ordersRepository.templates(deps.db).map((row) => {
      const parsed = routingTemplateSchema.safeParse(row.template);
      return {
        process: row.process as Process,
        template: parsed.success ? parsed.data : DEFAULT_ROUTING_TEMPLATES[row.process as Process],
        updatedAt: iso(row.updatedAt),
      };
    });
  },

  saveTemplate(deps: AppDeps, process: Process, template: RoutingTemplate, actorId: string) {
    if (template.process !== process) throw badInput('The template is for another process.', [{ path: ['process'], message: 'Does not match the path' }]);
    const now = deps.now();
    deps.db.transaction((tx) => {
      ordersRepository.saveTemplate(tx, { process, name: template.name, template, updatedAt: now, updatedBy: actorId });
      auditRepository.record(tx, now, { userId: actorId, action: 'routing_template.update', entity: 'routing_template', entityId: process, detail: { steps: template.steps.length } });
    });
    return ordersService.listTemplates(deps).find((t) => t.process === process)!;
  },
};
