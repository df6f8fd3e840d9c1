/**
 * A binary min-heap ordered by `before(a, b)` (true when a comes first). With a total order the pop
 * sequence is fully determined; the simulators break ties with an insertion counter to get one.
 */
export class PriorityQueue<T> {
  private items: T[] = [];
  constructor(private readonly before: (a: T, b: T) => boolean) {}
  get size() {
    return this.items.length;
  }
  push(x: T) {
    const a = this.items;
    a.push(x);
    let i = a.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (!this.before(a[i], a[p])) break;
      [a[p], a[i]] = [a[i], a[p]];
      i = p;
    }
  }
  /** The first item, removed; undefined when empty. */
  pop(): T | undefined {
    const a = this.items;
    const top = a[0];
    const last = a.pop();
    if (a.length && last !== undefined) {
      a[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < a.length && this.before(a[l], a[m])) m = l;
        if (r < a.length && this.before(a[r], a[m])) m = r;
        if (m === i) break;
        [a[m], a[i]] = [a[i], a[m]];
        i = m;
      }
    }
    return top;
  }
}
