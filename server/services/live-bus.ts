// The in-process live bus: how the wall and open screens hear about scans at once.
//
// For the scan service (and anything else that changes the floor):
//
//   import { notifyFloorChanged } from './live-bus';
//   // after the transaction that appended scan events / refusals / tray states has committed:
//   notifyFloorChanged(deps);                    // deps: AppDeps (only deps.db is used)
//
// That is all a writer needs to do. It is cheap and never throws. The stream service then reads
// what is new since its last look (scan_events and scan_rejections by rowid) and pushes `scan`
// and `wip` Server-Sent Events to every open wall, so the events it sends always match what the
// database holds. A writer that forgets to call it is still picked up by the stream's own
// check once a second; calling it just makes the wall update at once.
//
// Listeners (the stream service, report caches) subscribe with `onFloorChanged(deps, fn)`, which
// returns an unsubscribe function. One bus per database handle, so API tests that build many
// apps in one process do not hear each other.

type Listener = () => void;

interface Bus {
  listeners: Set<Listener>;
  /** bumped on every notification; caches compare it to know they are stale */
  version: number;
}

const buses = new WeakMap<object, Bus>();

function busOf(deps: { db: object }): Bus {
  let bus = buses.get(deps.db);
  if (!bus) {
    bus = { listeners: new Set(), version: 0 };
    buses.set(deps.db, bus);
  }
  return bus;
}

/** Tell the live screens that scans, refusals or tray states changed (after the commit). */
export function notifyFloorChanged(deps: { db: object }): void {
  const bus = busOf(deps);
  bus.version += 1;
  for (const fn of [...bus.listeners]) {
    try {
      fn();
    } catch {
      // a listener's failure must never reach the scan that notified
    }
  }
}

export function onFloorChanged(deps: { db: object }, fn: Listener): () => void {
  const bus = busOf(deps);
  bus.listeners.add(fn);
  return () => bus.listeners.delete(fn);
}

/** How many notifications the bus has seen: a cheap staleness check for caches. */
export function floorVersion(deps: { db: object }): number {
  return busOf(deps).version;
}
