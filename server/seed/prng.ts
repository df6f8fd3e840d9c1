// A small seeded random number generator for the demo factory: the same seed gives the same
// factory. mulberry32 (a 32-bit generator, public domain) is plenty for invented data; nothing
// here is used for secrets.

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

function hashLabel(label: string): number {
  let h = 2166136261;
  for (let i = 0; i < label.length; i++) {
    h ^= label.charCodeAt(i);
    h = Math.imul(h, 16777619);
  }
  return h >>> 0;
}

export function makeRng(seed: number | string): Rng {
  let a = (typeof seed === 'string' ? hashLabel(seed) : seed) >>> 0;
  const next = (): number => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
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
      const hex = (n: number) =>
        Array.from({ length: n }, () => Math.floor(next() * 16).toString(16)).join('');
      const variant = (8 + Math.floor(next() * 4)).toString(16);
      return `${hex(8)}-${hex(4)}-4${hex(3)}-${variant}${hex(3)}-${hex(12)}`;
    },
    fork: (label) => makeRng((hashLabel(label) ^ Math.floor(next() * 4294967296)) >>> 0),
  };
  return rng;
}
