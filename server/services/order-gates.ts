// The two gates before release, and the one way each is passed: a payment recorded (typed in by
// sales, or reported by the hosted checkout) and a proof approved (recorded by staff, or by the
// customer on her page). Every path calls these functions, so they open the same gates and
// leave the same record.
import crypto from 'node:crypto';
import type { DbLike } from '../db/client';
import { ordersRepository, type OrderRow } from '../repositories/orders.repository';
import { paymentsRepository } from '../repositories/payments.repository';
import { auditRepository } from '../repositories/audit.repository';
import { conflict, notFound } from '../errors';
import { paymentGate, roundMoney, type PaymentGate } from '@shared/domain/payments';
import { DEFAULT_PAYMENT_SETTINGS, paymentSettingsSchema, type OrderPaymentSummary, type PaymentSettings } from '@shared/schemas/payments';
import type { OrderGate } from '@shared/schemas/orders';
import type { OrderStatus } from '@shared/domain/vocabulary';

export const PRE_RELEASE_STATUSES: readonly OrderStatus[] = ['draft', 'awaiting_payment', 'awaiting_proof'];

export function paymentSettings(db: DbLike): PaymentSettings {
  const parsed = paymentSettingsSchema.safeParse({ ...DEFAULT_PAYMENT_SETTINGS, ...(paymentsRepository.settings(db) ?? {}) });
  return parsed.success ? parsed.data : DEFAULT_PAYMENT_SETTINGS;
}

/** The order's currency: its own (from the accepted quote), else the factory's setting. */
export function currencyOf(db: DbLike, order: Pick<OrderRow, 'currency'>): string {
  return order.currency ?? paymentSettings(db).currency;
}

export function paymentGateOf(db: DbLike, order: OrderRow): PaymentGate & { currency: string; depositPct: number } {
  const { depositPct } = paymentSettings(db);
  const currency = currencyOf(db, order);
  const payments = ordersRepository.payments(db, order.id).map(({ payment }) => ({ amount: payment.amount, isException: payment.isException }));
  return { ...paymentGate({ priceTotal: order.priceTotal, currency, depositPct, payments }), currency, depositPct };
}

export function paymentSummaryOf(db: DbLike, order: OrderRow): OrderPaymentSummary {
  const g = paymentGateOf(db, order);
  return { priceTotal: order.priceTotal, currency: g.currency, depositPct: g.depositPct, required: g.required, paidTotal: g.paidTotal, amountDue: g.amountDue };
}

/** The gates still open before release, in the order a planner deals with them. */
export function openGates(db: DbLike, orderId: string): OrderGate[] {
  const order = ordersRepository.byId(db, orderId);
  if (!order) return [];
  const gates: OrderGate[] = [];
  if (paymentGateOf(db, order).blocking) gates.push('payment_missing');
  const proofs = ordersRepository.proofs(db, orderId);
  const latest = proofs[proofs.length - 1];
  if (!latest || latest.approvedAt == null) gates.push('proof_not_approved');
  return gates;
}

/**
 * Status before release follows the gates: awaiting payment, then awaiting proof approval;
 * with both gates closed the order is a draft ready to release (not on the floor yet).
 */
export function preReleaseStatus(gates: OrderGate[]): OrderStatus {
  if (gates.includes('payment_missing')) return 'awaiting_payment';
  if (gates.includes('proof_not_approved')) return 'awaiting_proof';
  return 'draft';
}

export function refreshStatus(db: DbLike, order: OrderRow, now: number) {
  if (!PRE_RELEASE_STATUSES.includes(order.status as OrderStatus)) return;
  const status = preReleaseStatus(openGates(db, order.id));
  if (status !== order.status) ordersRepository.update(db, order.id, { status, updatedAt: now });
}

function audit(db: DbLike, now: number, userId: string | null, action: string, orderId: string, text: string, extra: Record<string, unknown> = {}) {
  auditRepository.record(db, now, { userId, action, entity: 'order', entityId: orderId, detail: { text, ...extra } });
}

export interface PaymentInput {
  orderId: string;
  amount: number;
  currency?: string;
  reference: string;
  source: 'manual' | 'checkout';
  /** the payment service's event id (checkout only): a second delivery records nothing */
  eventId?: string;
  /** the person who typed it in (manual only) */
  recordedBy: string | null;
  note?: string;
}

/**
 * Records one payment inside the caller's transaction and moves the order's status on when the
 * paid total reaches the deposit share. Returns false when that event id was recorded already.
 */
export function recordPaymentIn(tx: DbLike, now: number, input: PaymentInput): boolean {
  const order = ordersRepository.byId(tx, input.orderId);
  if (!order) throw notFound('That order');
  if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
  if (input.eventId && paymentsRepository.byEventId(tx, input.eventId)) return false;
  const currency = (input.currency ?? currencyOf(tx, order)).toUpperCase();
  const orderCurrency = currencyOf(tx, order);
  if (currency !== orderCurrency) {
    throw conflict('currency_mismatch', `Order ${order.number} is priced in ${orderCurrency}; a payment in ${currency} cannot count towards it.`);
  }
  const amount = roundMoney(input.amount, currency);
  ordersRepository.insertPayment(tx, {
    id: crypto.randomUUID(),
    orderId: order.id,
    amount,
    currency,
    reference: input.reference,
    source: input.source,
    eventId: input.eventId ?? null,
    isException: false,
    note: input.note ?? '',
    recordedBy: input.recordedBy,
    recordedAt: now,
  });
  const how = input.source === 'checkout' ? 'paid online' : 'recorded';
  audit(tx, now, input.recordedBy, 'order.payment', order.id, `Payment of ${amount.toFixed(2)} ${currency} ${how} (${input.reference})`, {
    source: input.source,
    params: { variant: input.source === 'checkout' ? 'online' : 'manual', amount: amount.toFixed(2), currency, reference: input.reference },
  });
  refreshStatus(tx, order, now);
  return true;
}

export interface ApprovalInput {
  orderId: string;
  revision: number;
  approvedAt: number;
  /** staff recording an approval given by e-mail or phone */
  userId: string | null;
  /** the name the customer typed on her page */
  customerName: string | null;
  note?: string | null;
}

/** Approves the latest proof revision inside the caller's transaction; the proof gate opens. */
export function approveProofIn(tx: DbLike, now: number, input: ApprovalInput) {
  const order = ordersRepository.byId(tx, input.orderId);
  if (!order) throw notFound('That order');
  refuseAfterRelease(order, 'its proof approval');
  const proof = latestProof(tx, order, input.revision);
  if (proof.approvedAt != null) throw conflict('already_approved', `Proof revision ${input.revision} is approved already.`);
  ordersRepository.approveProof(tx, proof.id, {
    approvedAt: input.approvedAt,
    approvedBy: input.userId,
    approvedByName: input.customerName,
    approvalNote: input.note ?? null,
  });
  const day = new Date(input.approvedAt).toISOString().slice(0, 10);
  const who = input.customerName
    ? `${input.customerName} approved proof revision ${input.revision} on the order page`
    : `Customer approved proof revision ${input.revision}`;
  audit(tx, now, input.userId, 'order.proof_approve', order.id, `${who} on ${day}${input.note ? `: ${input.note}` : ''}`, {
    ...(input.customerName ? { via: 'portal', name: input.customerName } : { via: 'staff' }),
    params: { variant: input.customerName ? 'portal' : 'staff', name: input.customerName, revision: input.revision, day, note: input.note || null },
  });
  refreshStatus(tx, order, now);
}

/** The customer sends the latest proof back with a comment; the gate stays shut. */
export function requestProofChangesIn(tx: DbLike, now: number, input: { orderId: string; revision: number; comment: string }) {
  const order = ordersRepository.byId(tx, input.orderId);
  if (!order) throw notFound('That order');
  refuseAfterRelease(order, 'its proof');
  const proof = latestProof(tx, order, input.revision);
  if (proof.approvedAt != null)
    throw conflict('already_approved', `Proof revision ${input.revision} is approved already; ask the factory if something must still change.`);
  ordersRepository.requestProofChanges(tx, proof.id, { changesRequestedAt: now, changesComment: input.comment });
  audit(tx, now, null, 'order.proof_changes', order.id, `Customer asked for changes to proof revision ${input.revision}: ${input.comment}`, {
    via: 'portal',
    params: { revision: input.revision, comment: input.comment },
  });
  return { order, proof };
}

function refuseAfterRelease(order: OrderRow, what: string) {
  if (order.releasedAt != null) throw conflict('already_released', `Order ${order.number} is released to the floor; ${what} can no longer be changed.`);
  if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
}

function latestProof(tx: DbLike, order: OrderRow, revision: number) {
  const proof = ordersRepository.proof(tx, order.id, revision);
  if (!proof) throw notFound(`Proof revision ${revision}`);
  if (proof.approvedAt != null) throw conflict('already_approved', `Proof revision ${revision} is approved already.`);
  const all = ordersRepository.proofs(tx, order.id);
  const latest = all[all.length - 1]!;
  if (latest.revision !== revision) {
    throw conflict('not_latest_proof', `Revision ${latest.revision} is the latest proof; approve that one (revision ${revision} was replaced).`);
  }
  return proof;
}
