import { describe, expect, it } from 'vitest';
import {
  afterFailure,
  BADGE_PER_DEVICE,
  MAX_DELAY_SECONDS,
  PASSWORD_PER_ACCOUNT_UNKNOWN_CLIENTS,
  PASSWORD_PER_CLIENT,
  perAddressRule,
  signInDelaySeconds,
  waitMs,
  worthReporting,
  type FailureRecord,
  type ThrottleRule,
} from './sign-in-throttle';

// OWASP Authentication Cheat Sheet ("Account Lockout"): count failed attempts, slow the guesser
// with growing delays rather than a long lockout, and take care that the lockout cannot be used
// to deny other people access.
describe('signInDelaySeconds', () => {
  it('lets the first failures through without delay', () => {
    expect([0, 1, 2].map(signInDelaySeconds)).toEqual([0, 0, 0]);
  });
  it('doubles the delay after each further failure', () => {
    expect([3, 4, 5, 6].map(signInDelaySeconds)).toEqual([1, 2, 4, 8]);
  });
  it('never holds an account longer than the cap', () => {
    expect(signInDelaySeconds(50)).toBe(MAX_DELAY_SECONDS);
    expect(MAX_DELAY_SECONDS).toBeLessThanOrEqual(60);
  });
});

function fail(times: number, rule: ThrottleRule, start = 0, every = 0): { rec: FailureRecord | undefined; at: number } {
  let rec: FailureRecord | undefined;
  let at = start;
  for (let i = 0; i < times; i++) {
    at = start + i * every;
    rec = afterFailure(rec, at, rule);
  }
  return { rec, at };
}

describe('growing delay per key', () => {
  it('matches signInDelaySeconds for a password client', () => {
    for (const n of [1, 2, 3, 4, 5, 9, 20]) {
      const { rec } = fail(n, PASSWORD_PER_CLIENT);
      expect(waitMs(rec, 0, PASSWORD_PER_CLIENT)).toBe(signInDelaySeconds(n) * 1000);
    }
  });

  it('runs from the key’s own last failure, so the right password right after the delay gets in', () => {
    const { rec, at } = fail(10, PASSWORD_PER_CLIENT);
    expect(waitMs(rec, at + 59_999, PASSWORD_PER_CLIENT)).toBe(1);
    expect(waitMs(rec, at + 60_000, PASSWORD_PER_CLIENT)).toBe(0);
  });

  it('a guesser who fails at every expiry delays only its own key: another client’s key stays free', () => {
    const rule = PASSWORD_PER_CLIENT;
    let attacker: FailureRecord | undefined;
    let t = 0;
    for (let i = 0; i < 40; i++) {
      t += waitMs(attacker, t, rule);
      attacker = afterFailure(attacker, t, rule);
      const victim: FailureRecord | undefined = undefined;
      expect(waitMs(victim, t, rule)).toBe(0);
    }
    // 40 guesses took about half an hour, and the wait never exceeded the cap
    expect(t).toBeGreaterThan(30 * 60_000);
    expect(waitMs(attacker, t, rule)).toBe(MAX_DELAY_SECONDS * 1000);
  });

  it('forgets a run after a quiet spell', () => {
    const { rec, at } = fail(8, PASSWORD_PER_CLIENT);
    const later = at + 15 * 60_000;
    expect(waitMs(rec, later, PASSWORD_PER_CLIENT)).toBe(0);
    expect(afterFailure(rec, later, PASSWORD_PER_CLIENT).failures).toBe(1);
  });

  it('a tablet gets ten PIN failures, then doubling delays up to 15 minutes', () => {
    expect(waitMs(fail(9, BADGE_PER_DEVICE).rec, 0, BADGE_PER_DEVICE)).toBe(0);
    expect(waitMs(fail(10, BADGE_PER_DEVICE).rec, 0, BADGE_PER_DEVICE)).toBe(1000);
    expect(waitMs(fail(30, BADGE_PER_DEVICE).rec, 0, BADGE_PER_DEVICE)).toBe(15 * 60_000);
  });

  it('guesses one tablet can make in a day, at the fastest it is allowed: far below the 10,000 values of a 4-digit PIN', () => {
    let rec: FailureRecord | undefined;
    let t = 0;
    let guesses = 0;
    while (t < 24 * 3600_000) {
      t += waitMs(rec, t, BADGE_PER_DEVICE);
      rec = afterFailure(rec, t, BADGE_PER_DEVICE);
      guesses += 1;
    }
    expect(guesses).toBeLessThan(120);
  });
});

describe('budgets', () => {
  it('per address: so many failures per window, then a wait until the oldest leaves the window', () => {
    const rule = perAddressRule(5, 15);
    const { rec } = fail(5, rule, 0, 60_000); // at 0, 1, 2, 3, 4 minutes
    expect(waitMs(rec, 4 * 60_000, rule)).toBe(11 * 60_000);
    expect(waitMs(rec, 15 * 60_000, rule)).toBe(0);
    expect(waitMs(fail(4, rule).rec, 0, rule)).toBe(0);
  });

  it('per account for unknown clients: 50 an hour', () => {
    const rule = PASSWORD_PER_ACCOUNT_UNKNOWN_CLIENTS;
    expect(waitMs(fail(49, rule).rec, 0, rule)).toBe(0);
    expect(waitMs(fail(50, rule).rec, 0, rule)).toBe(60 * 60_000);
  });
});

describe('worthReporting', () => {
  it('reports the failure that starts the delay, then every tenth after it', () => {
    const reported = [];
    let rec: FailureRecord | undefined;
    for (let i = 1; i <= 35; i++) {
      rec = afterFailure(rec, i, BADGE_PER_DEVICE);
      if (worthReporting(rec, BADGE_PER_DEVICE)) reported.push(i);
    }
    expect(reported).toEqual([10, 20, 30]);
    expect(worthReporting(afterFailure(undefined, 0, perAddressRule(1)), perAddressRule(1))).toBe(false);
  });
});
