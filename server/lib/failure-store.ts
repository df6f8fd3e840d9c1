// Where failed sign-ins and badge checks are counted: in memory, one store per database handle
// (API tests that build many apps in one process do not share counters). Bounded: the oldest
// keys make room when it is full, so guessing many badges cannot grow it without end.
// The rules themselves are pure: shared/domain/sign-in-throttle.ts.
import { afterFailure, waitMs, type FailureRecord, type ThrottleRule } from '@shared/domain/sign-in-throttle';

const MAX_KEYS = 100_000;
const stores = new WeakMap<object, Map<string, FailureRecord>>();

function storeOf(owner: object): Map<string, FailureRecord> {
  let store = stores.get(owner);
  if (!store) stores.set(owner, (store = new Map()));
  return store;
}

export interface ThrottleKey {
  key: string;
  rule: ThrottleRule;
}

export const failureStore = {
  /** The longest wait among the keys, in ms (0: may try now). */
  wait(owner: object, keys: readonly ThrottleKey[], now: number): number {
    const store = storeOf(owner);
    return Math.max(0, ...keys.map((k) => waitMs(store.get(k.key), now, k.rule)));
  },

  /** Counts one failure under every key; returns each key's record after it. */
  fail(owner: object, keys: readonly ThrottleKey[], now: number): Array<ThrottleKey & { record: FailureRecord }> {
    const store = storeOf(owner);
    return keys.map((k) => {
      const record = afterFailure(store.get(k.key), now, k.rule);
      store.delete(k.key); // re-inserted last: the Map's order is oldest first
      store.set(k.key, record);
      if (store.size > MAX_KEYS) store.delete(store.keys().next().value!);
      return { ...k, record };
    });
  },

  /** Forgets the keys (a success, or a new secret). */
  clear(owner: object, keys: readonly string[]): void {
    const store = storeOf(owner);
    for (const k of keys) store.delete(k);
  },

  /** Forgets every key starting with `prefix` (all clients of one account after a password reset). */
  clearPrefix(owner: object, prefix: string): void {
    const store = storeOf(owner);
    for (const k of [...store.keys()]) if (k.startsWith(prefix)) store.delete(k);
  },
};
