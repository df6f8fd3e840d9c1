// The payment gate: how much of an order's price must be paid before it may go to the floor, what
// is paid so far, and what is still due. One function for every way a payment arrives (typed in
// by sales for a bank transfer, or reported by the hosted checkout), so both open the same gate.

/** Share of the order's price to be paid before production, in percent (a setting; 100 = paid in full). */
export const DEFAULT_DEPOSIT_PCT = 100;
export const DEFAULT_CURRENCY = 'USD';

/**
 * Currencies without a minor unit, as the hosted checkout service lists them for its amounts
 * (stripe.com/docs/currencies, "Zero-decimal currencies"). Every other currency is taken in
 * hundredths. The three-decimal ones (BHD, JOD, KWD, OMR, TND) are refused by `minorUnitsOf`:
 * the service takes them only in multiples of ten, which the product does not handle.
 */
export const ZERO_DECIMAL_CURRENCIES = new Set([
  'BIF',
  'CLP',
  'DJF',
  'GNF',
  'JPY',
  'KMF',
  'KRW',
  'MGA',
  'PYG',
  'RWF',
  'UGX',
  'VND',
  'VUV',
  'XAF',
  'XOF',
  'XPF',
]);
export const THREE_DECIMAL_CURRENCIES = new Set(['BHD', 'JOD', 'KWD', 'OMR', 'TND']);

export function decimalsOf(currency: string): 0 | 2 {
  const c = currency.toUpperCase();
  if (THREE_DECIMAL_CURRENCIES.has(c)) throw new Error(`${c} is not supported for payments`);
  return ZERO_DECIMAL_CURRENCIES.has(c) ? 0 : 2;
}

/** Rounds an amount to the currency's smallest unit (half away from zero, as money is usually rounded). */
export function roundMoney(amount: number, currency: string): number {
  const f = 10 ** decimalsOf(currency);
  const scaled = Math.round(Math.abs(amount) * f + 1e-9) * Math.sign(amount);
  return scaled / f;
}

/** Amount in the currency's smallest unit, the integer the checkout service takes (12.34 USD → 1234). */
export function minorUnitsOf(amount: number, currency: string): number {
  return Math.round(roundMoney(amount, currency) * 10 ** decimalsOf(currency));
}

/** The inverse of `minorUnitsOf` (1234 USD → 12.34; 1500 JPY → 1500). */
export function fromMinorUnits(minor: number, currency: string): number {
  return minor / 10 ** decimalsOf(currency);
}

export interface GatePayment {
  amount: number | null;
  isException: boolean;
}

export interface PaymentGate {
  /** the amount that must be paid before release; null when the order has no agreed price */
  required: number | null;
  paidTotal: number;
  /** still to pay before release (never below 0); null without a price */
  amountDue: number | null;
  /** a manager let the order start without (full) payment */
  exception: boolean;
  /** true while the payment gate blocks release */
  blocking: boolean;
}

/**
 * The payment gate of one order. With an agreed price, the gate opens once the payments reach
 * the deposit share of it (rounded to the currency's smallest unit); without one (an order typed
 * in with no price), any recorded payment opens it, as before prices were kept. A manager's
 * exception opens it either way.
 */
export function paymentGate(input: { priceTotal: number | null; currency: string; depositPct: number; payments: GatePayment[] }): PaymentGate {
  const { priceTotal, currency, depositPct, payments } = input;
  const exception = payments.some((p) => p.isException);
  const paidTotal = roundMoney(
    payments.reduce((sum, p) => sum + (p.isException || p.amount == null ? 0 : p.amount), 0),
    currency,
  );
  if (priceTotal == null) {
    const anyPaid = payments.some((p) => !p.isException && (p.amount ?? 0) > 0);
    return { required: null, paidTotal, amountDue: null, exception, blocking: !exception && !anyPaid };
  }
  const share = Math.min(100, Math.max(0, depositPct));
  const required = roundMoney((priceTotal * share) / 100, currency);
  const amountDue = Math.max(0, roundMoney(required - paidTotal, currency));
  return { required, paidTotal, amountDue, exception, blocking: !exception && amountDue > 0 };
}
