// Retry delays for the sync loop: exponential back-off with "full jitter" (a random delay
// between a floor and the exponential cap), so tablets that lost the network together do not
// all come back at the same instant. Common practice; the cap keeps a tablet trying at least
// once a minute.

export const BACKOFF_FLOOR_MS = 500;
export const BACKOFF_BASE_MS = 1000;
export const BACKOFF_CAP_MS = 60_000;

/** Delay before retry number `attempt` (1 = first retry). `random` returns [0, 1). */
export function retryDelayMs(attempt: number, random: () => number = Math.random): number {
  const ceiling = Math.min(BACKOFF_CAP_MS, BACKOFF_BASE_MS * 2 ** Math.max(0, attempt - 1));
  return Math.round(BACKOFF_FLOOR_MS + random() * Math.max(0, ceiling - BACKOFF_FLOOR_MS));
}
