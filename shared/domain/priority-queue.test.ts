import { describe, expect, it } from 'vitest';
import { PriorityQueue } from './priority-queue';

describe('PriorityQueue', () => {
  it('pops in the order a full sort gives (Array.prototype.sort as the reference)', () => {
    let seed = 7;
    const next = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31), seed);
    const items = Array.from({ length: 500 }, (_, n) => ({ at: next() % 50, n }));
    const q = new PriorityQueue<{ at: number; n: number }>((x, y) => x.at < y.at || (x.at === y.at && x.n < y.n));
    for (const it of items) q.push(it);
    const popped: number[] = [];
    while (q.size) popped.push(q.pop()!.n);
    expect(popped).toEqual([...items].sort((x, y) => x.at - y.at || x.n - y.n).map((x) => x.n));
  });
  it('is empty after its last item', () => {
    const q = new PriorityQueue<number>((a, b) => a < b);
    q.push(2);
    expect(q.pop()).toBe(2);
    expect(q.pop()).toBeUndefined();
    expect(q.size).toBe(0);
  });
});
