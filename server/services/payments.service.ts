// Payments through the hosted checkout: a Checkout Session for what is still due, and the signed
// webhook that records the payment. Without STRIPE_SECRET_KEY the local fake (server/lib/
// checkout-fake.ts) starts with the app and the same SDK client talks to it, so every path from
// the customer's Pay button to the recorded payment runs the real SDK code.
import Stripe from 'stripe';
import type { AppDeps } from '../app-deps';
import type { OrderRow } from '../repositories/orders.repository';
import { paymentsRepository } from '../repositories/payments.repository';
import { auditRepository } from '../repositories/audit.repository';
import { AppError, badInput, conflict } from '../errors';
import { startCheckoutFake, type CheckoutFake } from '../lib/checkout-fake';
import { paymentGateOf, paymentSettings, PRE_RELEASE_STATUSES, recordPaymentIn } from './order-gates';
import { fromMinorUnits, minorUnitsOf, roundMoney } from '@shared/domain/payments';
import { paymentSettingsSchema, type CheckoutAnswer, type PaymentSettings } from '@shared/schemas/payments';
import type { OrderStatus } from '@shared/domain/vocabulary';

/** Events that mean a session's money has arrived (card payments complete at once; bank debits later). */
const PAID_EVENTS = new Set(['checkout.session.completed', 'checkout.session.async_payment_succeeded']);

export interface StartedPayments {
  mode: 'service' | 'local';
  fake?: CheckoutFake;
  stop(): Promise<void>;
}

/**
 * Sets `deps.payments`: the real service when STRIPE_SECRET_KEY is set, otherwise the local fake
 * on a free loopback port, posting its events to `webhookUrl` (asked at each delivery).
 */
export async function startPayments(deps: AppDeps, webhookUrl: () => string): Promise<StartedPayments> {
  const { stripeSecretKey, stripeWebhookSecret } = deps.env;
  if (stripeSecretKey && stripeWebhookSecret) {
    deps.payments = { stripe: new Stripe(stripeSecretKey, { telemetry: false, maxNetworkRetries: 2 }), webhookSecret: stripeWebhookSecret, mode: 'service' };
    deps.log.info('payments: hosted checkout service');
    return { mode: 'service', stop: async () => {} };
  }
  const fake = await startCheckoutFake({ webhookUrl, log: (m) => deps.log.warn(m) });
  deps.payments = {
    stripe: new Stripe(fake.secretKey, { host: fake.host, port: fake.port, protocol: fake.protocol, telemetry: false, maxNetworkRetries: 0 }),
    webhookSecret: fake.webhookSecret,
    mode: 'local',
  };
  deps.log.info(`payments: local checkout fake on http://${fake.host}:${fake.port} (no STRIPE_SECRET_KEY set; no money moves)`);
  return { mode: 'local', fake, stop: () => fake.close() };
}

function paymentsOf(deps: AppDeps) {
  if (!deps.payments) throw new AppError(503, 'payments_unavailable', 'Online payment is not available right now. Ask your contact at the factory how to pay.');
  return deps.payments;
}

export const paymentsService = {
  settings: (deps: AppDeps): PaymentSettings => paymentSettings(deps.db),

  saveSettings(deps: AppDeps, body: PaymentSettings, actorId: string): PaymentSettings {
    const value = paymentSettingsSchema.parse(body);
    const now = deps.now();
    deps.db.transaction((tx) => {
      paymentsRepository.saveSettings(tx, value);
      auditRepository.record(tx, now, { userId: actorId, action: 'settings.payments', entity: 'settings', entityId: 'payments', detail: value });
    });
    return paymentSettings(deps.db);
  },

  /**
   * A hosted checkout for what the order still owes before release (the deposit share less what
   * is paid). A second click while a session for the same amount is open gets that session again.
   */
  async createCheckout(deps: AppDeps, order: OrderRow, returnUrl: string): Promise<CheckoutAnswer> {
    const payments = paymentsOf(deps);
    if (order.status === 'cancelled') throw conflict('order_cancelled', 'This order is cancelled; nothing is to be paid.');
    if (!PRE_RELEASE_STATUSES.includes(order.status as OrderStatus) && order.releasedAt == null)
      throw conflict('not_payable', 'This order cannot be paid online now.');
    const gate = paymentGateOf(deps.db, order);
    if (gate.required == null) throw conflict('no_price', 'This order has no agreed price here yet; your contact at the factory will tell you the amount.');
    if (!gate.amountDue || gate.amountDue <= 0) throw conflict('nothing_due', 'Nothing is due on this order: the payment is complete.');
    const now = deps.now();
    const open = paymentsRepository.openSession(deps.db, order.id, gate.amountDue, gate.currency, now);
    if (open) return { url: open.url };
    const part = gate.depositPct < 100 && gate.paidTotal === 0 ? ` (deposit, ${gate.depositPct} %)` : gate.paidTotal > 0 ? ' (balance)' : '';
    let session: Stripe.Checkout.Session;
    try {
      session = await payments.stripe.checkout.sessions.create(
        {
          mode: 'payment',
          line_items: [
            {
              quantity: 1,
              price_data: {
                currency: gate.currency.toLowerCase(),
                unit_amount: minorUnitsOf(gate.amountDue, gate.currency),
                product_data: { name: `Order ${order.number}: ${order.title}${part}`.slice(0, 250) },
              },
            },
          ],
          client_reference_id: order.id,
          metadata: { orderId: order.id, orderNumber: order.number },
          success_url: `${returnUrl}?paid=1`,
          cancel_url: returnUrl,
        },
        // one session per order, amount and minute even when the customer taps twice
        { idempotencyKey: `checkout-${order.id}-${minorUnitsOf(gate.amountDue, gate.currency)}-${Math.floor(now / 60_000)}` },
      );
    } catch (err) {
      deps.log.error({ err: (err as Error).message }, 'checkout session could not be created');
      throw new AppError(502, 'payment_service_error', 'The payment service did not answer. Try again in a minute.');
    }
    if (!session.url) throw new AppError(502, 'payment_service_error', 'The payment service gave no checkout page. Try again in a minute.');
    paymentsRepository.insertSession(deps.db, {
      id: session.id,
      orderId: order.id,
      amount: gate.amountDue,
      currency: gate.currency,
      url: session.url,
      status: 'open',
      createdAt: now,
      expiresAt: session.expires_at * 1000,
    });
    return { url: session.url };
  },

  /**
   * `POST /api/payments/webhook`: verifies the `Stripe-Signature` header over the raw body with the
   * SDK, then records a paid session once. A bad signature changes nothing (400); an event id or a
   * session seen before records nothing more.
   */
  webhook(deps: AppDeps, rawBody: unknown, signature: string | undefined): { received: true; recorded: boolean } {
    const payments = paymentsOf(deps);
    if (!Buffer.isBuffer(rawBody) || rawBody.length === 0) throw badInput('The webhook body is missing.', undefined, 'bad_payload');
    if (!signature) throw badInput('The Stripe-Signature header is missing.', undefined, 'bad_signature');
    let event: Stripe.Event;
    try {
      event = payments.stripe.webhooks.constructEvent(rawBody, signature, payments.webhookSecret);
    } catch {
      throw badInput('The Stripe-Signature header does not match this body and signing secret; nothing was recorded.', undefined, 'bad_signature');
    }
    if (!PAID_EVENTS.has(event.type)) return { received: true, recorded: false };
    const session = event.data.object as Stripe.Checkout.Session;
    if (session.payment_status !== 'paid') return { received: true, recorded: false };
    const ours = paymentsRepository.session(deps.db, session.id);
    if (!ours) {
      deps.log.warn({ session: session.id, event: event.id }, 'webhook for a checkout session this app did not open; ignored');
      return { received: true, recorded: false };
    }
    const currency = (session.currency ?? ours.currency).toUpperCase();
    const amount = roundMoney(fromMinorUnits(session.amount_total ?? 0, currency), currency);
    const reference = typeof session.payment_intent === 'string' ? session.payment_intent : session.id;
    const now = deps.now();
    try {
      const recorded = deps.db.transaction((tx) => {
        if (paymentsRepository.byEventId(tx, event.id)) return false;
        if (!paymentsRepository.completeSession(tx, session.id, now)) return false;
        return recordPaymentIn(tx, now, {
          orderId: ours.orderId,
          amount,
          currency,
          reference,
          source: 'checkout',
          eventId: event.id,
          recordedBy: null,
          note: `checkout session ${session.id}`,
        });
      });
      return { received: true, recorded };
    } catch (err) {
      // The money was taken (a cancelled order, another currency): answer 200 so the service stops
      // retrying, and leave it to staff, who see the error in the log.
      if (err instanceof AppError && err.status === 409) {
        deps.log.error({ order: ours.orderId, event: event.id, code: err.code }, `paid checkout not recorded: ${err.message}`);
        return { received: true, recorded: false };
      }
      throw err;
    }
  },
};
