import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import sharp from 'sharp';
import { eq, sql } from 'drizzle-orm';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertBadgeUser, insertFloorOrder, pairTablet, scan, stationId, tabletAgent, TWO_COLOUR_ROUTING } from '../support/scan-fixtures';
import { scanEvents, scanRejections } from '../../server/db/schema/scans';
import { trays, trayStates } from '../../server/db/schema/trays';
import { addScanHook } from '../../server/services/scan-ingest.service';
import { makeTravellerCode } from '@shared/domain/traveller-code';
import { REJECTION_CODES, type RejectionCode } from '@shared/domain/vocabulary';
import { scanBatchResponseSchema } from '@shared/schemas/scans';

// The server clock is pinned (to a whole minute near the real time, so session cookies stay
// valid in the agents' cookie jars) and cure times and the 2-minute / 7-day limits are exact.
const T0 = Math.floor(Date.now() / 60_000) * 60_000;
const MIN = 60_000;
let t: TestApp;
let ST: Record<string, string>;
let operator: Awaited<ReturnType<TestApp['agentAs']>>;
let supervisorAgent: Awaited<ReturnType<TestApp['agentAs']>>;

beforeAll(async () => {
  t = makeTestApp();
  t.setNow(T0);
  ST = Object.fromEntries(['STR-1', 'TRM-1', 'PST-1', 'FIL-1', 'FIL-2', 'OVN-1', 'STN-1', 'POL-1', 'PLT-1', 'INS-1'].map((c) => [c, stationId(t.deps, c)]));
  operator = await t.agentAs('operator');
  supervisorAgent = await t.agentAs('supervisor');
});
afterAll(() => t.close());
beforeEach(() => t.setNow(T0));
const RELEASED = T0 - 24 * 60 * MIN;

const now = () => t.deps.now();
const floor = (opts: Partial<Parameters<typeof insertFloorOrder>[1]> = {}) => insertFloorOrder(t.deps, { releasedAt: RELEASED, ...opts });

async function post(events: unknown[], agent: TestAgent = operator) {
  const res = await agent.post('/api/scans').send({ events });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return scanBatchResponseSchema.parse(res.body);
}

function stateOf(trayId: string) {
  return t.deps.db.select().from(trayStates).where(eq(trayStates.trayId, trayId)).get()!;
}
const countEvents = () =>
  t.deps.db
    .select({ n: sql<number>`count(*)` })
    .from(scanEvents)
    .get()!.n;
const countRejections = () =>
  t.deps.db
    .select({ n: sql<number>`count(*)` })
    .from(scanRejections)
    .get()!.n;

describe('POST /api/scans: accepted events', () => {
  it('starts and finishes a tray, answers in order and updates the tray state', async () => {
    const {
      trays: [tray],
    } = floor();
    const a = now() - 30 * MIN;
    const body = await post([
      scan(tray.code, ST['STR-1'], 'start', a),
      scan(tray.code, ST['STR-1'], 'finish', a + 20 * MIN, { goodQty: 97, scrapQty: 3, scrapReason: 'misstrike' }),
    ]);
    expect(body.results.map((r) => r.status)).toEqual(['accepted', 'accepted']);
    expect(body.results[1].tray).toMatchObject({ number: tray.number, phase: 'waiting', stepSeq: 2, quantity: 97, stepName: 'Trimming' });
    expect(Date.parse(body.serverTime)).toBe(now());
    const st = stateOf(tray.id);
    expect(st).toMatchObject({ phase: 'waiting', stepSeq: 2, stationKind: 'trim', quantity: 97, waitingSince: a + 20 * MIN, lastEventAt: a + 20 * MIN });
    const rows = t.deps.db.select().from(scanEvents).where(eq(scanEvents.trayId, tray.id)).all();
    expect(rows.map((r) => [r.type, r.stepSeq, r.qtyIn, r.goodQty, r.scrapQty])).toEqual([
      ['start', 1, 100, null, null],
      ['finish', 1, 100, 97, 3],
    ]);
    expect(rows[0].userId).toBe(operator.user.id);
  });

  it('accepts a typed tray number as well as the QR text', async () => {
    const {
      trays: [tray],
    } = floor();
    const body = await post([scan(tray.number.toLowerCase(), ST['STR-1'], 'start', now() - MIN)]);
    expect(body.results[0].status).toBe('accepted');
  });

  it('the next colour starts exactly when the cure has run its time, not a minute before (cure 120 min: common practice)', async () => {
    const {
      trays: [tray],
    } = floor({ stepSeq: 5 });
    const inOven = now() - 300 * MIN;
    await post([scan(tray.code, ST['OVN-1'], 'start', inOven)]);
    expect(stateOf(tray.id)).toMatchObject({ phase: 'curing', cureReadyAt: inOven + 120 * MIN });
    const early = await post([scan(tray.code, ST['FIL-1'], 'start', inOven + 119 * MIN)]);
    expect(early.results[0]).toMatchObject({ status: 'rejected', code: 'curing', minutesLeft: 1 });
    expect(early.results[0].message).toMatch(/1 more minute/);
    const onTime = await post([scan(tray.code, ST['FIL-1'], 'start', inOven + 120 * MIN)]);
    expect(onTime.results[0]).toMatchObject({ status: 'accepted', tray: { phase: 'in_process', stepSeq: 6 } });
  });
});

describe('POST /api/scans: every rejection code', () => {
  const codes = new Set<RejectionCode>();
  async function expectRefused(event: unknown, code: RejectionCode, agent = operator) {
    const body = await post([event], agent);
    expect(body.results[0], JSON.stringify(body.results[0])).toMatchObject({ status: 'rejected', code });
    expect(body.results[0].message!.length).toBeGreaterThan(20);
    codes.add(code);
    return body.results[0];
  }

  it('unknown_tray, void_traveller, bad_signature', async () => {
    const {
      trays: [tray],
    } = floor();
    await expectRefused(scan('99999-999', ST['STR-1'], 'start', now()), 'unknown_tray');
    await expectRefused(scan('not a traveller at all', ST['STR-1'], 'start', now()), 'unknown_tray');
    const forged = tray.code.slice(0, -4) + (tray.code.endsWith('AAAA') ? 'BBBB' : 'AAAA');
    await expectRefused(scan(forged, ST['STR-1'], 'start', now()), 'bad_signature');
    t.deps.db.update(trays).set({ revision: 2 }).where(eq(trays.id, tray.id)).run();
    const old = await expectRefused(scan(tray.code, ST['STR-1'], 'start', now()), 'void_traveller');
    expect(old.params).toMatchObject({ currentRevision: 2 });
    const current = makeTravellerCode({ number: tray.number, revision: 2 }, t.deps.keys.traveller);
    expect((await post([scan(current, ST['STR-1'], 'start', now())])).results[0].status).toBe('accepted');
  });

  it('wrong_station, not_started, already_started, finished', async () => {
    const {
      trays: [tray],
    } = floor();
    await expectRefused(scan(tray.code, ST['POL-1'], 'start', now() - 10 * MIN), 'wrong_station');
    await expectRefused(scan(tray.code, ST['STR-1'], 'finish', now() - 9 * MIN), 'not_started');
    await post([scan(tray.code, ST['STR-1'], 'start', now() - 8 * MIN)]);
    await expectRefused(scan(tray.code, ST['STR-1'], 'start', now() - 7 * MIN), 'already_started');
    const {
      trays: [last],
    } = floor({ stepSeq: 10 });
    await post([scan(last.code, ST['PLT-1'], 'start', now() - 6 * MIN), scan(last.code, ST['PLT-1'], 'finish', now() - 5 * MIN)]);
    expect(stateOf(last.id).phase).toBe('done');
    await expectRefused(scan(last.code, ST['PLT-1'], 'start', now() - 4 * MIN), 'finished');
  });

  it('curing with minutesLeft, quantity_mismatch, scrap_reason_missing', async () => {
    const {
      trays: [tray],
    } = floor({ stepSeq: 5 });
    await post([scan(tray.code, ST['OVN-1'], 'start', now() - 30 * MIN)]);
    const r = await expectRefused(scan(tray.code, ST['FIL-2'], 'start', now()), 'curing');
    expect(r.minutesLeft).toBe(90);
    const {
      trays: [b],
    } = floor();
    await post([scan(b.code, ST['STR-1'], 'start', now() - 10 * MIN)]);
    await expectRefused(scan(b.code, ST['STR-1'], 'finish', now() - 5 * MIN, { goodQty: 90, scrapQty: 5, scrapReason: 'misstrike' }), 'quantity_mismatch');
    await expectRefused(scan(b.code, ST['STR-1'], 'finish', now() - 5 * MIN, { goodQty: 95, scrapQty: 5 }), 'scrap_reason_missing');
    await expectRefused(
      scan(b.code, ST['STR-1'], 'finish', now() - 5 * MIN, { goodQty: 95, scrapQty: 5, scrapReason: 'no_such_reason' }),
      'scrap_reason_missing',
    );
    expect((await post([scan(b.code, ST['STR-1'], 'finish', now() - 5 * MIN, { goodQty: 95, scrapQty: 5, scrapReason: 'misstrike' })])).results[0].status).toBe(
      'accepted',
    );
  });

  it('on_hold, not_on_hold, bad_override (release without a supervisor)', async () => {
    const {
      trays: [tray],
    } = floor();
    await expectRefused(scan(tray.code, ST['STR-1'], 'release', now() - 9 * MIN), 'not_on_hold');
    await post([scan(tray.code, ST['STR-1'], 'hold', now() - 8 * MIN, { scrapReason: 'hold_quality', note: 'burr on the edge' })]);
    expect(stateOf(tray.id)).toMatchObject({ onHold: true, holdReason: 'hold_quality' });
    const held = await expectRefused(scan(tray.code, ST['STR-1'], 'start', now() - 7 * MIN), 'on_hold');
    // the text supervisors read names the reason (the base seed's hold_quality), not its code
    expect(held.message).toContain('Quality question');
    expect(held.message).not.toContain('hold_quality');
    const r = await expectRefused(scan(tray.code, ST['STR-1'], 'release', now() - 6 * MIN), 'bad_override');
    expect(r.params).toMatchObject({ reason: 'release_needs_supervisor' });
    const released = await post([scan(tray.code, ST['STR-1'], 'release', now() - 5 * MIN)], supervisorAgent);
    expect(released.results[0]).toMatchObject({ status: 'accepted', tray: { onHold: false } });
  });

  it('mould_not_ready', async () => {
    const {
      trays: [tray],
    } = floor({ mould: 'engraving' });
    await expectRefused(scan(tray.code, ST['STR-1'], 'start', now()), 'mould_not_ready');
    const {
      trays: [ok],
    } = floor({ mould: 'ready' });
    expect((await post([scan(ok.code, ST['STR-1'], 'start', now())])).results[0].status).toBe('accepted');
  });

  it('bad_time: 2 min ahead of the server clock is the limit, 7 days back is the limit, not before release or the last event', async () => {
    const {
      trays: [tray],
    } = floor();
    expect((await expectRefused(scan(tray.code, ST['STR-1'], 'start', now() + 2 * MIN + 1000), 'bad_time')).params).toMatchObject({ reason: 'future' });
    expect((await expectRefused(scan(tray.code, ST['STR-1'], 'start', RELEASED - MIN), 'bad_time')).params).toMatchObject({ reason: 'before_release' });
    const {
      trays: [old],
    } = floor({ releasedAt: now() - 8 * 24 * 60 * MIN });
    const week = 7 * 24 * 60 * MIN;
    expect((await expectRefused(scan(old.code, ST['STR-1'], 'start', now() - week - 1000), 'bad_time')).params).toMatchObject({ reason: 'too_old' });
    expect((await post([scan(old.code, ST['STR-1'], 'start', now() - week)])).results[0].status).toBe('accepted');
    expect((await post([scan(tray.code, ST['STR-1'], 'start', now() + 2 * MIN)])).results[0].status).toBe('accepted');
    expect((await expectRefused(scan(tray.code, ST['STR-1'], 'finish', now()), 'bad_time')).params).toMatchObject({ reason: 'before_last_event' });
  });

  it('invalid_event: a malformed event is answered on its own', async () => {
    const {
      trays: [tray],
    } = floor();
    const body = await post([{ id: 'x', code: tray.code }, scan(tray.code, ST['STR-1'], 'start', now())]);
    expect(body.results[0]).toMatchObject({ id: 'x', status: 'rejected', code: 'invalid_event' });
    expect(body.results[1].status).toBe('accepted');
    codes.add('invalid_event');
    const unknownStation = await post([scan(tray.code, 'no-such-station', 'finish', now())]);
    expect(unknownStation.results[0]).toMatchObject({ code: 'invalid_event', params: { reason: 'unknown_station' } });
  });

  it('station_not_allowed: a tablet paired to one station cannot record a scan at another, and says why and what to do', async () => {
    const {
      trays: [tray],
    } = floor();
    const striking = pairTablet(t, 'STR-1');
    const agent = await tabletAgent(t, striking.token, await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '7531'));
    const r = await expectRefused(scan(tray.code, ST['POL-1'], 'start', now()), 'station_not_allowed', agent as typeof operator);
    expect(r.params).toMatchObject({ stationId: ST['POL-1'], tabletStationId: ST['STR-1'] });
    expect(r.message).toMatch(/set up for .*ask an administrator/);
    expect(stateOf(tray.id)).toMatchObject({ phase: 'waiting', stepSeq: 1 });
    // at its own station the same tablet is fine
    expect((await post([scan(tray.code, ST['STR-1'], 'start', now())], agent)).results[0].status).toBe('accepted');
  });

  it('bad_override: an override for another tray, expired or used up', async () => {
    const supervisor = await insertBadgeUser(t, 'supervisor', `S-${crypto.randomInt(1e6)}`, '2468');
    const {
      trays: [a, b],
    } = floor({ trays: 2 });
    const ov = await operator.post('/api/scans/overrides').send({
      badge: supervisor.badge,
      pin: supervisor.pin,
      reason: 'Striking press down, trim first',
      code: a.code,
      stationId: ST['TRM-1'],
      kind: 'wrong_station',
    });
    expect(ov.status).toBe(201);
    await expectRefused(scan(b.code, ST['TRM-1'], 'start', now(), { overrideId: ov.body.id }), 'bad_override');
    expect((await post([scan(a.code, ST['TRM-1'], 'start', now() - MIN, { overrideId: ov.body.id })])).results[0].status).toBe('accepted');
    const {
      trays: [c],
    } = floor();
    const ov2 = await operator
      .post('/api/scans/overrides')
      .send({ badge: supervisor.badge, pin: supervisor.pin, reason: 'Move on', code: c.code, stationId: ST['TRM-1'], kind: 'wrong_station' });
    t.setNow(now() + 16 * MIN);
    await expectRefused(scan(c.code, ST['TRM-1'], 'start', now(), { overrideId: ov2.body.id }), 'bad_override');
  });

  it('covers every rejection code of the contract', () => {
    // badge_failures is not a scan answer: tests/api/sign-in-throttles.test.ts covers it
    for (const code of REJECTION_CODES.filter((c) => c !== 'badge_failures')) expect(codes.has(code), code).toBe(true);
  });

  it('lists refusals for supervisors, and each tablet sees only its own', async () => {
    const list = await supervisorAgent.get('/api/scans/exceptions');
    expect(list.status).toBe(200);
    expect(list.body.length).toBeGreaterThan(10);
    expect(list.body[0]).toMatchObject({ code: expect.any(String), message: expect.any(String), stationName: expect.anything() });
    const tablet = pairTablet(t, 'STR-1');
    const mine = await request(t.app).get('/api/scans/exceptions').set('Authorization', `Device ${tablet.token}`);
    expect(mine.status).toBe(200);
    expect(mine.body).toEqual([]);
  });
});

describe('POST /api/scans: batches', () => {
  it('a batch of 500 with bad events among them: the rest are accepted, answers in order', async () => {
    const { trays: list } = floor({ trays: 450 });
    const events: unknown[] = [];
    const expected: string[] = [];
    let k = 0;
    for (let i = 0; i < 500; i++) {
      if (i % 10 === 3) {
        const bad = [
          scan('12345-678', ST['STR-1'], 'start', now()), // unknown tray
          scan(list[(k + 1) % 450].code, ST['POL-1'], 'start', now()), // wrong station
          { id: crypto.randomUUID(), code: list[0].code, stationId: ST['STR-1'], type: 'pause', occurredAt: new Date(now()).toISOString() }, // malformed
          scan(list[(k + 2) % 450].code, ST['STR-1'], 'finish', now() - 2 * MIN), // not started (and before its start)
          scan(list[(k + 3) % 450].code, ST['STR-1'], 'start', now() + 10 * MIN), // time ahead
        ][i % 5];
        events.push(bad);
        expected.push('rejected');
      } else {
        events.push(scan(list[k++].code, ST['STR-1'], 'start', now() - MIN));
        expected.push('accepted');
      }
    }
    expect(k).toBe(450);
    const before = countEvents();
    const body = await post(events);
    expect(body.results).toHaveLength(500);
    expect(body.results.map((r) => r.status)).toEqual(expected);
    body.results.forEach((r, i) => expect(r.id).toBe((events[i] as { id: string }).id));
    expect(countEvents() - before).toBe(450);
    for (const tr of list) expect(stateOf(tr.id).phase).toBe('in_process');
  });

  it('the same batch sent twice: all duplicate the second time, nothing doubled', async () => {
    const { trays: list } = floor({ trays: 20 });
    const events = [
      ...list.map((tr) => scan(tr.code, ST['STR-1'], 'start', now() - 10 * MIN)),
      ...list.map((tr) => scan(tr.code, ST['STR-1'], 'finish', now() - 5 * MIN, { goodQty: 99, scrapQty: 1, scrapReason: 'misstrike' })),
      scan(list[0].code, ST['POL-1'], 'start', now() - 4 * MIN), // refused the first time
    ];
    const first = await post(events);
    expect(first.results.filter((r) => r.status === 'accepted')).toHaveLength(40);
    const eventsBefore = countEvents();
    const rejectionsBefore = countRejections();
    const states = list.map((tr) => stateOf(tr.id));
    const second = await post(events);
    expect(second.results.map((r) => r.status)).toEqual(events.map(() => 'duplicate'));
    expect(second.results.at(-1)).toMatchObject({ code: 'wrong_station' }); // still says it was refused
    expect(countEvents()).toBe(eventsBefore);
    expect(countRejections()).toBe(rejectionsBefore);
    expect(list.map((tr) => stateOf(tr.id))).toEqual(states);
    expect(states[0]).toMatchObject({ quantity: 99, stepSeq: 2 });
  });

  it('the same event twice in one batch counts once', async () => {
    const {
      trays: [tray],
    } = floor();
    const e = scan(tray.code, ST['STR-1'], 'start', now());
    const body = await post([e, e]);
    expect(body.results.map((r) => r.status)).toEqual(['accepted', 'duplicate']);
  });

  it('413 above 500 events, 400 for an empty batch', async () => {
    const res = await operator.post('/api/scans').send({ events: Array.from({ length: 501 }, () => ({})) });
    expect(res.status).toBe(413);
    const empty = await operator.post('/api/scans').send({ events: [] });
    expect(empty.status).toBe(400);
  });

  it('events, refusals and tray states are written in one transaction: a failure leaves nothing behind', async () => {
    const {
      trays: [tray],
    } = floor();
    const before = { events: countEvents(), rejections: countRejections(), state: stateOf(tray.id) };
    const boom = () => {
      throw new Error('simulated failure inside the batch');
    };
    const removeBoom = addScanHook(t.deps, boom);
    try {
      const res = await operator
        .post('/api/scans')
        .send({ events: [scan(tray.code, ST['STR-1'], 'start', now()), scan('nothing', ST['STR-1'], 'start', now())] });
      expect(res.status).toBe(500);
    } finally {
      removeBoom();
    }
    expect({ events: countEvents(), rejections: countRejections(), state: stateOf(tray.id) }).toEqual(before);
  });
});

describe('group commit', () => {
  it('batches arriving together share one commit; a batch that fails never takes the others down', async () => {
    const { trays: list } = floor({ trays: 6 });
    const doomed = list[5];
    const boom = (_tx: unknown, accepted: { trayId: string }[]) => {
      if (accepted.some((a) => a.trayId === doomed.id)) throw new Error('simulated failure in one batch');
    };
    const removeBoom = addScanHook(t.deps, boom);
    try {
      const sent = await Promise.all(list.map((tr) => operator.post('/api/scans').send({ events: [scan(tr.code, ST['STR-1'], 'start', now())] })));
      expect(sent.map((r) => r.status)).toEqual([200, 200, 200, 200, 200, 500]);
    } finally {
      removeBoom();
    }
    for (const tr of list.slice(0, 5)) expect(stateOf(tr.id).phase).toBe('in_process');
    expect(stateOf(doomed.id).phase).toBe('waiting');
    expect(t.deps.db.select().from(scanEvents).where(eq(scanEvents.trayId, doomed.id)).all()).toHaveLength(0);
  });
});

describe('two tablets, events out of order', () => {
  it('an oven scan that arrives before the fill bench’s offline scans is accepted once they arrive', async () => {
    const {
      trays: [tray],
    } = floor({ stepSeq: 4 });
    const fillTablet = pairTablet(t, 'FIL-1');
    const ovenTablet = pairTablet(t, 'OVN-1');
    const filler = await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '1357');
    const ovenHand = await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '2580');
    const fillAgent = await tabletAgent(t, fillTablet.token, filler);
    const ovenAgent = await tabletAgent(t, ovenTablet.token, ovenHand);
    const n = now();
    // The fill bench was offline: its start and finish wait in its outbox.
    // Tablets name the operator on every event (sessions time out while a tablet is offline).
    const queued = [
      scan(tray.code, ST['FIL-1'], 'start', n + 1 * MIN, { operatorId: filler.id }),
      scan(tray.code, ST['FIL-1'], 'finish', n + 20 * MIN, { operatorId: filler.id }),
    ];
    t.setNow(n + 25 * MIN);
    const ovenEvent = scan(tray.code, ST['OVN-1'], 'start', n + 25 * MIN, { operatorId: ovenHand.id });
    const ovenFirst = await post([ovenEvent], ovenAgent);
    expect(ovenFirst.results[0]).toMatchObject({ status: 'rejected', code: 'wrong_station' });
    t.setNow(n + 30 * MIN);
    const late = await post(queued, fillAgent);
    expect(late.results.map((r) => r.status)).toEqual(['accepted', 'accepted']);
    // The oven scan was tried again once the earlier scans were in, and now stands.
    expect(stateOf(tray.id)).toMatchObject({ phase: 'curing', stepSeq: 5, stationId: ST['OVN-1'], cureReadyAt: n + 25 * MIN + 120 * MIN });
    const rows = t.deps.db.select().from(scanEvents).where(eq(scanEvents.trayId, tray.id)).orderBy(scanEvents.occurredAt).all();
    expect(rows.map((r) => [r.type, r.stationId, r.userId])).toEqual([
      ['start', ST['FIL-1'], filler.id],
      ['finish', ST['FIL-1'], filler.id],
      ['start', ST['OVN-1'], ovenHand.id],
    ]);
    const rej = t.deps.db.select().from(scanRejections).where(eq(scanRejections.trayId, tray.id)).all();
    expect(rej).toHaveLength(1);
    expect(rej[0]).toMatchObject({ resolution: 'accepted_late', resolvedBy: null });
    // Sent again, the oven scan is a duplicate with no refusal code: it stands.
    const resent = await post([ovenEvent], ovenAgent);
    expect(resent.results[0]).toEqual({ id: ovenEvent.id, status: 'duplicate' });
  });

  it('two benches start the same tray: the one that arrives late but happened earlier is refused as bad_time', async () => {
    const {
      trays: [tray],
    } = floor({ stepSeq: 4 });
    const a = pairTablet(t, 'FIL-1');
    const b = pairTablet(t, 'FIL-2');
    const pa = await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '1111');
    const pb = await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '2222');
    const agentA = await tabletAgent(t, a.token, pa);
    const agentB = await tabletAgent(t, b.token, pb);
    const n = now();
    const fromA = scan(tray.code, ST['FIL-1'], 'start', n + MIN, { operatorId: pa.id });
    t.setNow(n + 5 * MIN);
    expect((await post([scan(tray.code, ST['FIL-2'], 'start', n + 5 * MIN, { operatorId: pb.id })], agentB)).results[0].status).toBe('accepted');
    t.setNow(n + 10 * MIN);
    const r = (await post([fromA], agentA)).results[0];
    expect(r).toMatchObject({ status: 'rejected', code: 'bad_time', params: { reason: 'before_last_event' } });
    expect(stateOf(tray.id)).toMatchObject({ phase: 'in_process', stationId: ST['FIL-2'] });
  });

  it('scans queued on a tablet count for the operator who made them, even when another person is signed in at sync', async () => {
    const {
      trays: [tray],
    } = floor();
    const tablet = pairTablet(t, 'STR-1');
    const first = await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '3691');
    const second = await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '4702');
    await tabletAgent(t, tablet.token, first); // first signs in on this tablet, scans offline, hands over
    const agent = await tabletAgent(t, tablet.token, second);
    const body = await post([scan(tray.code, ST['STR-1'], 'start', now() + MIN, { operatorId: first.id })], agent);
    expect(body.results[0].status).toBe('accepted');
    expect(t.deps.db.select().from(scanEvents).where(eq(scanEvents.trayId, tray.id)).get()!.userId).toBe(first.id);
    // The device alone (every session gone) may still deliver its outbox, for people who signed in on it.
    const deviceOnly = request.agent(t.app).set('Authorization', `Device ${tablet.token}`);
    const fin = await post([scan(tray.code, ST['STR-1'], 'finish', now() + 2 * MIN, { operatorId: first.id })], deviceOnly);
    expect(fin.results[0].status).toBe('accepted');
    const stranger = await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '5813');
    const refused = await post([scan(tray.code, ST['TRM-1'], 'start', now() + 2 * MIN, { operatorId: stranger.id })], deviceOnly);
    expect(refused.results[0]).toMatchObject({ status: 'rejected', code: 'invalid_event', params: { reason: 'operator_not_signed_in_here' } });
  });
});

describe('overrides, exceptions and station screens', () => {
  it('a supervisor override lets a wrong-station start through once, and records who and why', async () => {
    const supervisor = await insertBadgeUser(t, 'supervisor', `S-${crypto.randomInt(1e6)}`, '8024');
    const op = await insertBadgeUser(t, 'operator', `B-${crypto.randomInt(1e6)}`, '9999');
    const {
      trays: [tray],
    } = floor();
    const refused = await operator
      .post('/api/scans/overrides')
      .send({ badge: op.badge, pin: op.pin, reason: 'I say so', code: tray.code, stationId: ST['TRM-1'], kind: 'wrong_station' });
    // an operator's right PIN is answered like a wrong one
    expect(refused.status).toBe(401);
    expect(refused.body.error.code).toBe('invalid_credentials');
    const wrongPin = await operator
      .post('/api/scans/overrides')
      .send({ badge: supervisor.badge, pin: '0000', reason: 'x y z', code: tray.code, stationId: ST['TRM-1'], kind: 'wrong_station' });
    expect(wrongPin.status).toBe(401);
    const ov = await operator.post('/api/scans/overrides').send({
      badge: supervisor.badge,
      pin: supervisor.pin,
      reason: 'Struck on the old press last night',
      code: tray.code,
      stationId: ST['TRM-1'],
      kind: 'wrong_station',
    });
    expect(ov.status).toBe(201);
    expect(ov.body.supervisor).toMatchObject({ id: supervisor.id });
    const ok = await post([scan(tray.code, ST['TRM-1'], 'start', now(), { overrideId: ov.body.id })]);
    // striking done at the trimming bench: the awaited step, nothing skipped
    expect(ok.results[0]).toMatchObject({ status: 'accepted', tray: { stepSeq: 1, phase: 'in_process' } });
    const row = t.deps.db.select().from(scanEvents).where(eq(scanEvents.trayId, tray.id)).get()!;
    expect(row.overrideId).toBe(ov.body.id);
    const audit = t.deps.db.$client.prepare("select detail from audit_log where action = 'scan.override' and entity_id = ?").get(tray.id) as { detail: string };
    expect(JSON.parse(audit.detail)).toMatchObject({ kind: 'wrong_station', overridden: ['wrong_station'], reason: 'Struck on the old press last night' });
  });

  it('a supervisor retries a refused scan after the cause is gone, or resolves it with a note', async () => {
    const {
      trays: [tray],
    } = floor();
    await post([scan(tray.code, ST['STR-1'], 'hold', now() - 10 * MIN, { scrapReason: 'hold_material' })]);
    const refused = await post([scan(tray.code, ST['STR-1'], 'start', now() - 9 * MIN)]);
    expect(refused.results[0].code).toBe('on_hold');
    const list = (await supervisorAgent.get('/api/scans/exceptions')).body as { id: string; eventId: string }[];
    const exc = list.find((e) => e.eventId === refused.results[0].id)!;
    const stillHeld = await supervisorAgent.post(`/api/scans/exceptions/${exc.id}/retry`);
    expect(stillHeld.body).toMatchObject({ status: 'rejected', code: 'on_hold' });
    // a release clears the hold; the earlier start stays refused: it happened before the release
    await post([scan(tray.code, ST['STR-1'], 'release', now() - 8 * MIN)], supervisorAgent);
    const again = await supervisorAgent.post(`/api/scans/exceptions/${exc.id}/retry`);
    expect(again.body).toMatchObject({ status: 'rejected', code: 'bad_time' });
    const closed = await supervisorAgent.post(`/api/scans/exceptions/${exc.id}/resolve`).send({ resolution: 'Started again after the release' });
    expect(closed.status).toBe(200);
    const twice = await supervisorAgent.post(`/api/scans/exceptions/${exc.id}/resolve`).send({ resolution: 'again' });
    expect(twice.status).toBe(409);
    const open = (await supervisorAgent.get('/api/scans/exceptions')).body as { id: string }[];
    expect(open.some((e) => e.id === exc.id)).toBe(false);
  });

  it('the station queue lists what waits for the station, what is in process there and what cures before it', async () => {
    const { trays: waiting } = floor({ trays: 2, stepSeq: 6 });
    const {
      trays: [curing],
    } = floor({ stepSeq: 5 });
    await post([scan(curing.code, ST['OVN-1'], 'start', now() - 10 * MIN)]);
    await post([scan(waiting[0].code, ST['FIL-1'], 'start', now() - 5 * MIN)]);
    const res = await operator.get(`/api/stations/${ST['FIL-1']}/queue`);
    expect(res.status).toBe(200);
    const numbers = (res.body.trays as { tray: { number: string }; state: { phase: string } }[]).map((c) => [c.tray.number, c.state.phase]);
    expect(numbers).toEqual(
      expect.arrayContaining([
        [waiting[0].number, 'in_process'],
        [waiting[1].number, 'waiting'],
        [curing.number, 'curing'],
      ]),
    );
    const other = await operator.get(`/api/stations/${ST['FIL-2']}/queue`);
    const otherNumbers = (other.body.trays as { tray: { number: string } }[]).map((c) => c.tray.number);
    expect(otherNumbers).not.toContain(waiting[0].number); // in process at bench 1 only
    expect(otherNumbers).toContain(waiting[1].number);
    expect(res.body.station).toMatchObject({ code: 'FIL-1', kind: 'fill' });
    expect(res.body.trays[0].routing).toHaveLength(TWO_COLOUR_ROUTING.length);
    const look = await operator.get('/api/scans/lookup').query({ code: curing.code });
    expect(look.body).toMatchObject({ tray: { number: curing.number }, state: { phase: 'curing' }, order: { title: 'Club crest with crossed oars' } });
    expect((await operator.get('/api/scans/lookup').query({ code: '55555-55' })).status).toBe(404);
  });

  it('keeps a QC photo with the tray', async () => {
    const {
      trays: [tray],
    } = floor();
    // a real picture: photos are decoded in full before they are kept
    const jpeg = await sharp({ create: { width: 32, height: 24, channels: 3, background: '#8899aa' } })
      .jpeg()
      .toBuffer();
    const res = await operator.post('/api/scans/photos').field('code', tray.code).attach('file', jpeg, { filename: 'qc.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(201);
    expect(res.body.hash).toBe(crypto.createHash('sha256').update(jpeg).digest('hex'));
    const text = await operator
      .post('/api/scans/photos')
      .field('code', tray.code)
      .attach('file', Buffer.from('hello'), { filename: 'a.txt', contentType: 'text/plain' });
    expect(text.status).toBe(400);
  });
});
