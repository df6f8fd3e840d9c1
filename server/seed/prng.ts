// The demo factory's random draws, on the app's one seeded generator (shared/domain/stats.ts):
// the same seed gives the same factory. Nothing here is used for secrets.
import { seededRandom, seedOf } from '@shared/domain/stats';

export interface Rng {
  /** uniform in [0, 1) */
  next(): number;
  /** whole number in [min, max] */
  int(min: number, max: number): number;
  /** true with probability p */
  chance(p: number): boolean;
  pick<T>(items: readonly T[]): T;
  /** standard normal (Box–Muller) */
  normal(): number;
  /** a positive factor around 1: exp(N(0, sigma)) */
  spread(sigma: number): number;
  /** a UUID-shaped id (version 4 layout) made from the stream, so ids repeat with the seed */
  uuid(): string;
  /** a new independent stream derived from this one */
  fork(label: string): Rng;
}

export function makeRng(seed: number | string): Rng {
  const next = seededRandom(typeof seed === 'string' ? seedOf(seed) : seed);
  const rng: Rng = {
    next,
    int: (min, max) => min + Math.floor(next() * (max - min + 1)),
    chance: (p) => next() < p,
    pick: (items) => items[Math.floor(next() * items.length)],
    normal: () => {
      const u = 1 - next();
      const v = next();
      return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
    },
    spread: (sigma) => Math.exp(rng.normal() * sigma),
    uuid: () => {
      const hex = (n: number) => Array.from({ length: n }, () => Math.floor(next() * 16).toString(16)).join('');
      const variant = (8 + Math.floor(next() * 4)).toString(16);
      return `${hex(8)}-${hex(4)}-4${hex(3)}-${variant}${hex(3)}-${hex(12)}`;
    },
    fork: (label) => makeRng((seedOf(label) ^ Math.floor(next() * 4294967296)) >>> 0),
  };
  return rng;
}
