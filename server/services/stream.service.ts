import type { Response } from 'express';
import type { AppDeps } from '../app-deps';
import { floorRepository } from '../repositories/floor.repository';
import { onFloorChanged } from './live-bus';
import { wipService } from './wip.service';
import type { ScanNotice } from '@shared/schemas/live';

// Server-Sent Events for the wall and open screens: `scan` (one per accepted scan), `refusal`
// (a scan was refused) and `wip` (the whole WIP picture, as GET /api/wip). The hub reads what is
// new in the database (by rowid) when a writer notifies the live bus, and once a second in case
// one did not, so what it sends always matches what is stored.

const POLL_MS = 1000;
const HEARTBEAT_MS = 20_000;
/** Notices read per query; a check reads as many pages as there are new events. */
export const NOTICE_PAGE = 200;
/** How often an open stream's access is checked again (session ended, person or device switched off). */
export const RECHECK_MS = 5000;

/** Whether the caller of an open stream may still read it. */
export type StillAllowed = () => Promise<boolean> | boolean;

interface Hub {
  clients: Set<Response>;
  access: Map<Response, StillAllowed>;
  recheck: NodeJS.Timeout | null;
  last: { events: number; rejections: number; states: number };
  timer: NodeJS.Timeout | null;
  heartbeat: NodeJS.Timeout | null;
  unsubscribe: (() => void) | null;
  pending: NodeJS.Timeout | null;
}

const hubs = new WeakMap<object, Hub>();

function send(res: Response, event: string, data: unknown) {
  res.write(`event: ${event}\ndata: ${JSON.stringify(data)}\n\n`);
}

function check(deps: AppDeps, hub: Hub) {
  if (hub.clients.size === 0) return;
  const now = floorRepository.maxRowids(deps.db);
  const changed = now.events !== hub.last.events || now.rejections !== hub.last.rejections || now.states !== hub.last.states;
  if (!changed) return;
  if (now.events > hub.last.events) {
    // Every new event gets its notice, in pages of 200: a burst (a batch of 500, a tablet coming
    // back online) is sent in full, never cut at the first page.
    let after = hub.last.events;
    for (;;) {
      const page = floorRepository.eventsAfter(deps.db, after, NOTICE_PAGE);
      for (const e of page) {
        const notice: ScanNotice = {
          id: e.id,
          type: e.type,
          trayId: e.trayId,
          trayNumber: e.trayNumber,
          stationId: e.stationId,
          stationName: e.stationName,
          stationKind: e.stationKind,
          occurredAt: new Date(e.occurredAt).toISOString(),
        };
        for (const c of hub.clients) send(c, 'scan', notice);
      }
      if (page.length < NOTICE_PAGE) break;
      after = page[page.length - 1].rowid;
      if (after >= now.events) break;
    }
  }
  if (now.rejections > hub.last.rejections) for (const c of hub.clients) send(c, 'refusal', { count: now.rejections - hub.last.rejections });
  hub.last = now;
  const wip = wipService.wip(deps);
  for (const c of hub.clients) send(c, 'wip', wip);
}

function hubOf(deps: AppDeps): Hub {
  let hub = hubs.get(deps.db);
  if (!hub) {
    hub = {
      clients: new Set(),
      access: new Map(),
      recheck: null,
      last: { events: 0, rejections: 0, states: 0 },
      timer: null,
      heartbeat: null,
      unsubscribe: null,
      pending: null,
    };
    hubs.set(deps.db, hub);
  }
  return hub;
}

function safeCheck(deps: AppDeps, hub: Hub) {
  try {
    check(deps, hub);
  } catch (error) {
    deps.log.warn({ err: error }, 'live stream check failed');
  }
}

/** Closes every stream whose caller lost access since it opened. */
async function recheckAccess(deps: AppDeps, hub: Hub) {
  for (const [res, allowed] of [...hub.access]) {
    let ok = false;
    try {
      ok = await allowed();
    } catch (error) {
      deps.log.warn({ err: error }, 'live stream access check failed');
    }
    if (!ok && hub.clients.has(res)) {
      send(res, 'closed', { reason: 'access_ended' });
      res.end();
      hub.clients.delete(res);
      hub.access.delete(res);
    }
  }
  if (hub.clients.size === 0) stop(hub);
}

function start(deps: AppDeps, hub: Hub) {
  hub.last = floorRepository.maxRowids(deps.db);
  hub.timer = setInterval(() => safeCheck(deps, hub), POLL_MS);
  hub.recheck = setInterval(() => void recheckAccess(deps, hub), RECHECK_MS);
  hub.heartbeat = setInterval(() => {
    for (const c of hub.clients) c.write(': still here\n\n');
  }, HEARTBEAT_MS);
  hub.unsubscribe = onFloorChanged(deps, () => {
    if (hub.pending) return;
    hub.pending = setTimeout(() => {
      hub.pending = null;
      safeCheck(deps, hub);
    }, 30);
  });
}

function stop(hub: Hub) {
  if (hub.timer) clearInterval(hub.timer);
  if (hub.heartbeat) clearInterval(hub.heartbeat);
  if (hub.recheck) clearInterval(hub.recheck);
  hub.recheck = null;
  if (hub.pending) clearTimeout(hub.pending);
  hub.unsubscribe?.();
  hub.timer = hub.heartbeat = hub.pending = null;
  hub.unsubscribe = null;
}

export const streamService = {
  /** Holds the response open as an event stream until the client goes away. */
  open(deps: AppDeps, res: Response, stillAllowed: StillAllowed) {
    res.status(200);
    res.set({
      'Content-Type': 'text/event-stream; charset=utf-8',
      'Cache-Control': 'no-cache, no-transform',
      Connection: 'keep-alive',
      'X-Accel-Buffering': 'no',
    });
    res.flushHeaders();
    // a browser's EventSource reconnects by itself after this many ms (e.g. a server restart)
    res.write('retry: 2000\n\n');
    const hub = hubOf(deps);
    if (hub.clients.size === 0) start(deps, hub);
    hub.clients.add(res);
    hub.access.set(res, stillAllowed);
    send(res, 'wip', wipService.wip(deps));
    res.on('close', () => {
      hub.clients.delete(res);
      hub.access.delete(res);
      if (hub.clients.size === 0) stop(hub);
    });
  },
};
