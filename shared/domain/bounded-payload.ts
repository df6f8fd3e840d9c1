// What is kept of a value a client sent, for a record of its refusal: at most `maxDepth` levels and
// about `maxChars` characters of JSON. Deeper or larger parts are replaced by a short marker, so
// no event, however it is built, can make storing its refusal fail (JSON.stringify of a value
// nested 50,000 levels deep overflows the stack). Walks without recursion.

export interface Bounds {
  maxDepth: number;
  maxChars: number;
}

export const REFUSAL_BOUNDS: Bounds = { maxDepth: 8, maxChars: 8_000 };

const CUT = '[cut: too deep]';

/** A copy of `value` no deeper than `maxDepth`, whose JSON is at most about `maxChars` long. */
export function boundedPayload(value: unknown, bounds: Bounds = REFUSAL_BOUNDS): unknown {
  let budget = bounds.maxChars;
  const leaf = (v: unknown): unknown => {
    if (typeof v === 'string') {
      const s = v.length > budget ? `${v.slice(0, Math.max(0, budget))}…` : v;
      budget -= s.length + 2;
      return s;
    }
    budget -= 8;
    return typeof v === 'number' || typeof v === 'boolean' || v === null ? v : String(v);
  };
  const root: { v: unknown } = { v: undefined };
  // a work list of (source, where to put its copy, depth) instead of recursion
  const work: { src: unknown; put: (copy: unknown) => void; depth: number }[] = [{ src: value, put: (c) => (root.v = c), depth: 0 }];
  while (work.length) {
    const { src, put, depth } = work.pop()!;
    if (budget <= 0) {
      put('[cut: too long]');
      continue;
    }
    if (src === null || typeof src !== 'object') {
      put(leaf(src));
      continue;
    }
    if (depth >= bounds.maxDepth) {
      put(CUT);
      budget -= CUT.length;
      continue;
    }
    if (Array.isArray(src)) {
      const out: unknown[] = [];
      put(out);
      const n = Math.min(src.length, 100);
      for (let i = n - 1; i >= 0; i--) work.push({ src: src[i], put: (c) => (out[i] = c), depth: depth + 1 });
      budget -= 2;
      continue;
    }
    const out: Record<string, unknown> = {};
    put(out);
    const keys = Object.keys(src).slice(0, 100);
    for (let i = keys.length - 1; i >= 0; i--) {
      const k = keys[i];
      budget -= k.length + 3;
      work.push({ src: (src as Record<string, unknown>)[k], put: (c) => (out[k] = c), depth: depth + 1 });
    }
  }
  return root.v;
}
