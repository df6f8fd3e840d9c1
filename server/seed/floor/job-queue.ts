// The simulator's clock: travellers wait in a queue by the moment they are ready for their next
// step, ties in the order they were queued (so the same seed gives the same floor).
import { PriorityQueue } from '@shared/domain/priority-queue';
import type { Live } from './types';

interface Job {
  at: number;
  n: number;
  t: Live;
}

export class JobQueue {
  private readonly queue = new PriorityQueue<Job>((x, y) => x.at < y.at || (x.at === y.at && x.n < y.n));
  private counter = 0;
  get size() {
    return this.queue.size;
  }
  /** `t` is ready for its next step at `at`. */
  push(at: number, t: Live) {
    this.queue.push({ at, n: this.counter++, t });
  }
  /** The earliest job; undefined when none is left. */
  pop(): { at: number; t: Live } | undefined {
    return this.queue.pop();
  }
}
