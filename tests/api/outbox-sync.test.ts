// The tablet's outbox and sync loop (IndexedDB through fake-indexeddb) against the real server
// app on a real SQLite file: offline scans, an answer lost mid-sync, refusals, big backlogs.
import 'fake-indexeddb/auto';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import { eq, inArray, sql } from 'drizzle-orm';
import type TestAgent from 'supertest/lib/agent';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertBadgeUser, insertFloorOrder, pairTablet, scan, tabletAgent } from '../support/scan-fixtures';
import { scanEvents } from '../../server/db/schema/scans';
import { trayStates } from '../../server/db/schema/trays';
import { StationDb } from '../../src/features/station/lib/station-db';
import { SyncEngine, type SyncTransport } from '../../src/features/station/lib/sync-engine';
import type { ScanEvent } from '@shared/schemas/scans';

let t: TestApp;
let agent: TestAgent;
let tablet: ReturnType<typeof pairTablet>;
let operatorId: string;
const MIN = 60_000;

beforeAll(async () => {
  t = makeTestApp();
  tablet = pairTablet(t, 'TRM-1');
  const person = await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '1357');
  operatorId = person.id;
  agent = await tabletAgent(t, tablet.token, person);
});
afterAll(() => t.close());

interface Net {
  down: boolean;
  /** the server handles the next N batches but the answer never reaches the tablet (a restart mid-sync) */
  loseAnswers: number;
  posts: number;
}

function transport(net: Net): SyncTransport {
  return {
    async postScans(events) {
      net.posts += 1;
      if (net.down) throw { status: 0 };
      const res = await agent.post('/api/scans').send({ events });
      if (net.loseAnswers > 0) {
        net.loseAnswers -= 1;
        throw { status: 0 };
      }
      if (res.status !== 200) throw { status: res.status };
      return res.body;
    },
    async clock() {
      if (net.down) throw { status: 0 };
      return (await agent.get('/api/scans/clock')).body;
    },
    async uploadPhoto() {},
  };
}

let db: StationDb;
let net: Net;
let engine: SyncEngine;
beforeEach(async () => {
  db = new StationDb(`outbox-${crypto.randomUUID()}`);
  net = { down: false, loseAnswers: 0, posts: 0 };
  engine = new SyncEngine(db, transport(net));
  await engine.init();
});

const trayScan = (code: string, type: 'start' | 'finish', at: number): ScanEvent => scan(code, tablet.stationId, type, at, { operatorId }) as ScanEvent;

function serverEvents(trayIds: string[]) {
  return t.deps.db
    .select({ n: sql<number>`count(*)` })
    .from(scanEvents)
    .where(inArray(scanEvents.trayId, trayIds))
    .get()!.n;
}

describe('the tablet outbox', () => {
  it('keeps 50 scans made offline and delivers them exactly once when the network returns', async () => {
    const { trays } = insertFloorOrder(t.deps, { trays: 25, releasedAt: Date.now() - 3600_000, stepSeq: 2 });
    net.down = true;
    const base = Date.now() - 30 * MIN;
    for (const [i, tr] of trays.entries()) {
      await engine.add(trayScan(tr.code, 'start', base + i * 1000), { trayNumber: tr.number, local: { ok: true } });
      await engine.add(trayScan(tr.code, 'finish', base + 10 * MIN + i * 1000), { trayNumber: tr.number, local: { ok: true } });
    }
    await engine.syncNow();
    expect(engine.getStatus()).toMatchObject({ online: false, pending: 50 });
    expect(await db.outbox.where('status').equals('pending').count()).toBe(50);
    expect(serverEvents(trays.map((x) => x.id))).toBe(0);

    net.down = false;
    await engine.syncNow();
    expect(engine.getStatus()).toMatchObject({ online: true, pending: 0, refusedUnseen: 0 });
    expect(await db.outbox.where('status').equals('accepted').count()).toBe(50);
    expect(serverEvents(trays.map((x) => x.id))).toBe(50);
    const states = t.deps.db
      .select()
      .from(trayStates)
      .where(
        inArray(
          trayStates.trayId,
          trays.map((x) => x.id),
        ),
      )
      .all();
    expect(states.every((s) => s.phase === 'waiting' && s.stepSeq === 3)).toBe(true);
  });

  it('an answer lost after the server stored the batch: the resend is answered duplicate and nothing is doubled', async () => {
    const { trays } = insertFloorOrder(t.deps, { trays: 5, releasedAt: Date.now() - 3600_000, stepSeq: 2 });
    net.down = true; // queue them first
    for (const tr of trays) await engine.add(trayScan(tr.code, 'start', Date.now() - MIN), { trayNumber: tr.number, local: { ok: true } });
    await engine.syncNow();
    net.down = false;
    net.posts = 0;
    net.loseAnswers = 1;
    await engine.syncNow();
    expect(engine.getStatus().pending).toBe(5);
    expect(serverEvents(trays.map((x) => x.id))).toBe(5); // the server had stored them
    await engine.syncNow();
    expect(engine.getStatus().pending).toBe(0);
    expect(await db.outbox.where('status').equals('accepted').count()).toBe(5);
    expect(serverEvents(trays.map((x) => x.id))).toBe(5);
    expect(net.posts).toBe(2);
  });

  it('marks a refused scan with the server’s code and words, and keeps it until the operator has seen it', async () => {
    const {
      trays: [tr],
    } = insertFloorOrder(t.deps, { trays: 1, releasedAt: Date.now() - 3600_000, stepSeq: 2 });
    await engine.add(trayScan(tr.code, 'finish', Date.now() - MIN), { trayNumber: tr.number, local: null });
    await engine.syncNow(); // (the add already started a sync; this waits for it)
    const [entry] = await db.outbox.toArray();
    expect(entry).toMatchObject({ status: 'rejected', code: 'not_started' });
    expect(entry.message).toMatch(/never started/);
    expect(engine.getStatus().refusedUnseen).toBe(1);
    await engine.markSeen(entry.id);
    expect(engine.getStatus().refusedUnseen).toBe(0);
  });

  it('sends a backlog of 1,200 scans in batches of at most 500, in the order they were made', async () => {
    const { trays } = insertFloorOrder(t.deps, { trays: 1200, releasedAt: Date.now() - 3600_000, stepSeq: 2 });
    const events = trays.map((tr, i) => trayScan(tr.code, 'start', Date.now() - 20 * MIN + i));
    await db.outbox.bulkAdd(
      events.map((event, i) => ({
        id: event.id,
        event,
        trayNumber: trays[i].number,
        status: 'pending' as const,
        local: { ok: true },
        createdAt: Date.now(),
        attempts: 0,
      })),
    );
    await engine.refreshCounts();
    await engine.syncNow();
    expect(net.posts).toBe(3);
    expect(engine.getStatus().pending).toBe(0);
    const first = t.deps.db.select().from(scanEvents).where(eq(scanEvents.id, events[0].id)).get();
    const last = t.deps.db.select().from(scanEvents).where(eq(scanEvents.id, events[1199].id)).get();
    expect(first!.receivedAt).toBeLessThanOrEqual(last!.receivedAt);
  });

  it('measures the clock offset on each round trip (server 90 s ahead of the tablet)', async () => {
    // a server clock that runs 90 s ahead (a pinned clock would fall behind while the test waits)
    const realNow = t.deps.now;
    t.deps.now = () => Date.now() + 90_000;
    try {
      await engine.add(trayScan('no-such-tray-0', 'start', Date.now() + 90_000), { trayNumber: 'x', local: null });
      await engine.syncNow();
      const offset = engine.getStatus().offset!;
      // the offset is good to ± half the round trip (RFC 5905)
      expect(Math.abs(offset.offsetMs - 90_000)).toBeLessThanOrEqual(offset.roundTripMs / 2 + 5);
      expect(Math.abs(engine.now() - (Date.now() + 90_000))).toBeLessThan(1000);
    } finally {
      t.deps.now = realNow;
    }
  });
});
