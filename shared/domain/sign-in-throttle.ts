// Per-account throttling of failed sign-ins (OWASP Authentication Cheat Sheet: growing delays,
// and lockout must not become a way to keep someone else out for long).

/** Failures allowed before any delay. */
export const FREE_FAILURES = 3;
/** The longest wait one account can be put under, however many failures. */
export const MAX_DELAY_SECONDS = 60;

/** Seconds the account must wait after `failures` consecutive failed attempts: 0, then 1, 2, 4 … capped. */
export function signInDelaySeconds(failures: number): number {
  if (failures < FREE_FAILURES) return 0;
  return Math.min(2 ** (failures - FREE_FAILURES), MAX_DELAY_SECONDS);
}

/** Session lifetimes (OWASP Session Management: absolute and idle timeouts enforced on the server). */
export const SESSION_ABSOLUTE_HOURS = 12;
export const OFFICE_IDLE_MINUTES = 60;
