// Throttling of failed sign-ins and badge + PIN checks (OWASP Authentication Cheat Sheet:
// count failures, slow the guesser down with growing delays, and never let the lockout itself
// become a way to keep someone else out for long).
//
// Every failure is counted under a few keys at once (the server decides the keys, this file the
// rule): for a password, the account together with the client that tried (a browser that has
// signed in to that account before, or else the address), so one guesser's failures delay only
// that guesser; for a badge, the badge together with the tablet, the tablet itself, and the
// address. A key is free for its first few failures, then waits a doubling delay after each
// further one, up to a cap; a run of failures is forgotten after a quiet spell. Some keys also
// have a budget: at most so many failures in a rolling window.
//
// The delay runs from the key's own last failure, and an attempt refused for waiting is not a
// failure: so whoever gives the right secret after the delay gets in, and refused attempts
// never stretch the wait.

/** Failures allowed before any delay (per account and client). */
export const FREE_FAILURES = 3;
/** The longest wait one account can be put under for one client, however many failures. */
export const MAX_DELAY_SECONDS = 60;

/** Seconds to wait after `failures` consecutive failed attempts: 0, then 1, 2, 4 … capped. */
export function signInDelaySeconds(failures: number): number {
  if (failures < FREE_FAILURES) return 0;
  return Math.min(2 ** (failures - FREE_FAILURES), MAX_DELAY_SECONDS);
}

export interface ThrottleRule {
  /** failures allowed before any delay */
  free: number;
  /** the growing delay's cap */
  maxDelayMs: number;
  /** a run of failures is forgotten after this long without a new one */
  forgetAfterMs: number;
  /** at most this many failures within the rolling window */
  budget?: { failures: number; windowMs: number };
}

/** What is remembered under one key. */
export interface FailureRecord {
  /** failures in the current run */
  failures: number;
  lastFailureAt: number;
  /** times of the latest failures, for the budget (at most the budget's size) */
  recent: number[];
}

const SECOND = 1000;
const MINUTE = 60 * SECOND;

/** Password sign-in, per account and client (a known browser, or the address). */
export const PASSWORD_PER_CLIENT: ThrottleRule = { free: FREE_FAILURES, maxDelayMs: MAX_DELAY_SECONDS * SECOND, forgetAfterMs: 15 * MINUTE };
/**
 * Password sign-in, per account, counting only clients that never signed in to it: many
 * addresses guessing one password together. Browsers that signed in to the account before are
 * not held by it, so the owner still gets in.
 */
export const PASSWORD_PER_ACCOUNT_UNKNOWN_CLIENTS: ThrottleRule = {
  free: Number.POSITIVE_INFINITY,
  maxDelayMs: 0,
  forgetAfterMs: 60 * MINUTE,
  budget: { failures: 50, windowMs: 60 * MINUTE },
};
/** Badge + PIN, per badge typed (known or not) and tablet. */
export const BADGE_PER_BADGE: ThrottleRule = { free: FREE_FAILURES, maxDelayMs: MAX_DELAY_SECONDS * SECOND, forgetAfterMs: 15 * MINUTE };
/**
 * Badge + PIN, per tablet whatever badge is typed: a 4-digit PIN has 10,000 values, so one
 * tablet gets 10 failures, then a doubling delay up to 15 minutes (about 100 guesses a day
 * after the first hour), and supervisors see the run in their refused-scans list.
 */
export const BADGE_PER_DEVICE: ThrottleRule = { free: 10, maxDelayMs: 15 * MINUTE, forgetAfterMs: 60 * MINUTE };

/** A per-address budget: `failures` per `windowMinutes` (its own counter for passwords and for badges). */
export function perAddressRule(failures: number, windowMinutes = 15): ThrottleRule {
  return { free: Number.POSITIVE_INFINITY, maxDelayMs: 0, forgetAfterMs: windowMinutes * MINUTE, budget: { failures, windowMs: windowMinutes * MINUTE } };
}

function delayMs(failures: number, rule: ThrottleRule): number {
  if (failures < rule.free) return 0;
  return Math.min(SECOND * 2 ** (failures - rule.free), rule.maxDelayMs);
}

function current(rec: FailureRecord | undefined, now: number, rule: ThrottleRule): FailureRecord | undefined {
  if (!rec || now - rec.lastFailureAt >= rule.forgetAfterMs) return undefined;
  return rec;
}

/** Milliseconds until this key may try again (0: now). */
export function waitMs(rec: FailureRecord | undefined, now: number, rule: ThrottleRule): number {
  const run = current(rec, now, rule);
  if (!run) return 0;
  let wait = run.lastFailureAt + delayMs(run.failures, rule) - now;
  if (rule.budget) {
    const inWindow = run.recent.filter((t) => t > now - rule.budget!.windowMs);
    if (inWindow.length >= rule.budget.failures) wait = Math.max(wait, inWindow[inWindow.length - rule.budget.failures] + rule.budget.windowMs - now);
  }
  return Math.max(0, wait);
}

/** The record after one more failure at `now`. */
export function afterFailure(rec: FailureRecord | undefined, now: number, rule: ThrottleRule): FailureRecord {
  const run = current(rec, now, rule);
  const keep = rule.budget ? rule.budget.failures : 0;
  const recent = keep ? [...(run?.recent ?? []).filter((t) => t > now - rule.budget!.windowMs), now].slice(-keep) : [];
  return { failures: (run?.failures ?? 0) + 1, lastFailureAt: now, recent };
}

/** Whether this failure is the one that starts the key's delay (or a further ten past it): worth telling supervisors. */
export function worthReporting(rec: FailureRecord, rule: ThrottleRule): boolean {
  if (!Number.isFinite(rule.free)) return false;
  return rec.failures >= rule.free && (rec.failures - rule.free) % 10 === 0;
}

/** Session lifetimes (OWASP Session Management: absolute and idle timeouts enforced on the server). */
export const SESSION_ABSOLUTE_HOURS = 12;
export const OFFICE_IDLE_MINUTES = 60;
