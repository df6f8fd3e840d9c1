import { describe, expect, it } from 'vitest';
import { fromMinorUnits, minorUnitsOf, paymentGate, roundMoney } from './payments';

describe('amounts in the smallest currency unit', () => {
  // Check values from the checkout service's API reference, "amount": "A positive integer
  // representing how much to charge in the smallest currency unit (e.g., 100 cents to charge
  // $1.00 or 100 to charge ¥100, a zero-decimal currency)" (docs.stripe.com/api/checkout/sessions,
  // and docs.stripe.com/currencies for the list of zero-decimal currencies).
  it('takes dollars in cents and yen as they are', () => {
    expect(minorUnitsOf(1, 'USD')).toBe(100);
    expect(minorUnitsOf(100, 'JPY')).toBe(100);
    expect(minorUnitsOf(1, 'usd')).toBe(100);
  });

  it('does not lose a cent to binary fractions (0.1 + 0.2, 1.005)', () => {
    expect(minorUnitsOf(0.1 + 0.2, 'EUR')).toBe(30);
    // 1.005 is 1.00499999999999989... as a double; money rounding still gives 1.01
    expect(roundMoney(1.005, 'EUR')).toBe(1.01);
    expect(minorUnitsOf(1234.56, 'EUR')).toBe(123456);
    expect(fromMinorUnits(123456, 'EUR')).toBe(1234.56);
    expect(fromMinorUnits(1500, 'JPY')).toBe(1500);
  });

  it('refuses the three-decimal currencies the service takes only in tens', () => {
    expect(() => minorUnitsOf(1, 'KWD')).toThrow(/not supported/);
  });
});

describe('payment gate', () => {
  const gate = (priceTotal: number | null, depositPct: number, payments: { amount: number | null; isException?: boolean }[], currency = 'EUR') =>
    paymentGate({ priceTotal, currency, depositPct, payments: payments.map((p) => ({ amount: p.amount, isException: p.isException ?? false })) });

  it('blocks until the full price is paid at the default share of 100 %', () => {
    expect(gate(1250, 100, [])).toEqual({ required: 1250, paidTotal: 0, amountDue: 1250, exception: false, blocking: true });
    expect(gate(1250, 100, [{ amount: 1000 }]).amountDue).toBe(250);
    expect(gate(1250, 100, [{ amount: 1000 }]).blocking).toBe(true);
    expect(gate(1250, 100, [{ amount: 1000 }, { amount: 250 }]).blocking).toBe(false);
  });

  it('opens at the deposit share, rounded to the cent (30 % of 1,234.57 = 370.371 → 370.37)', () => {
    // worked by hand: 1234.57 × 0.30 = 370.371
    const g = gate(1234.57, 30, [{ amount: 370.36 }]);
    expect(g.required).toBe(370.37);
    expect(g.amountDue).toBe(0.01);
    expect(g.blocking).toBe(true);
    expect(gate(1234.57, 30, [{ amount: 370.37 }]).blocking).toBe(false);
  });

  it('never asks for less than nothing when more was paid', () => {
    expect(gate(100, 50, [{ amount: 80 }]).amountDue).toBe(0);
  });

  it('opens on a manager exception even unpaid', () => {
    const g = gate(900, 100, [{ amount: null, isException: true }]);
    expect(g.exception).toBe(true);
    expect(g.blocking).toBe(false);
    expect(g.paidTotal).toBe(0);
  });

  it('without an agreed price, any payment opens it', () => {
    expect(gate(null, 100, []).blocking).toBe(true);
    expect(gate(null, 100, [{ amount: 12 }])).toEqual({ required: null, paidTotal: 12, amountDue: null, exception: false, blocking: false });
  });
});
