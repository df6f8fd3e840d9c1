// One override passes one guard: it names one guard, one traveller and one station, is used
// once, and lets through only that guard.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import { eq } from 'drizzle-orm';
import type TestAgent from 'supertest/lib/agent';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertBadgeUser, insertFloorOrder, scan, stationId } from '../support/scan-fixtures';
import { overrides, scanEvents } from '../../server/db/schema/scans';
import { trayStates } from '../../server/db/schema/trays';
import { scanBatchResponseSchema } from '@shared/schemas/scans';

const T0 = Math.floor(Date.now() / 60_000) * 60_000;
const MIN = 60_000;
let t: TestApp;
let ST: Record<string, string>;
let operator: TestAgent;
let supervisor: { id: string; badge: string; pin: string };

beforeAll(async () => {
  t = makeTestApp();
  t.setNow(T0);
  ST = Object.fromEntries(['STR-1', 'TRM-1', 'FIL-1', 'FIL-2', 'OVN-1'].map((c) => [c, stationId(t.deps, c)]));
  operator = await t.agentAs('operator');
  supervisor = await insertBadgeUser(t, 'supervisor', `S-${crypto.randomInt(1e6)}`, '8024');
});
afterAll(() => t.close());
beforeEach(() => t.setNow(T0));

const floor = (stepSeq = 1) => insertFloorOrder(t.deps, { releasedAt: T0 - 24 * 60 * MIN, stepSeq }).trays[0];
const stateOf = (trayId: string) => t.deps.db.select().from(trayStates).where(eq(trayStates.trayId, trayId)).get()!;
const eventsOf = (trayId: string) => t.deps.db.select().from(scanEvents).where(eq(scanEvents.trayId, trayId)).all();

async function post(events: unknown[]) {
  const res = await operator.post('/api/scans').send({ events });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return scanBatchResponseSchema.parse(res.body).results;
}

async function override(code: string, station: string, kind: 'wrong_station' | 'curing' | 'release') {
  const res = await operator
    .post('/api/scans/overrides')
    .send({ badge: supervisor.badge, pin: supervisor.pin, reason: 'Agreed on the floor', code, stationId: station, kind });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  expect(res.body.kind).toBe(kind);
  return res.body.id as string;
}

describe('an override lets through only the guard it names', () => {
  it('a wrong-station override on a tray waiting for its first cure does not jump it to the next colour', async () => {
    const tray = floor(5); // waiting for step 5, colour 1 cure
    const before = stateOf(tray.id);
    const ov = await override(tray.code, ST['FIL-1'], 'wrong_station');
    const [r] = await post([scan(tray.code, ST['FIL-1'], 'start', T0 - MIN, { overrideId: ov })]);
    expect(r).toMatchObject({ status: 'rejected', code: 'wrong_station', params: { expectedKind: 'cure', expectedSeq: 5 } });
    expect(stateOf(tray.id)).toMatchObject({ phase: before.phase, stepSeq: 5 });
    expect(eventsOf(tray.id)).toEqual([]);
    expect(t.deps.db.select().from(overrides).where(eq(overrides.id, ov)).get()!.usedEventId).toBeNull();
  });

  it('starting the next colour early needs a curing override; a wrong-station one is refused as curing', async () => {
    const tray = floor(5);
    const inOven = T0 - 60 * MIN;
    expect((await post([scan(tray.code, ST['OVN-1'], 'start', inOven)]))[0].status).toBe('accepted');
    const wrong = await override(tray.code, ST['FIL-1'], 'wrong_station');
    const [refused] = await post([scan(tray.code, ST['FIL-1'], 'start', T0 - MIN, { overrideId: wrong })]);
    expect(refused).toMatchObject({ status: 'rejected', code: 'curing', minutesLeft: 61 });
    expect(stateOf(tray.id)).toMatchObject({ phase: 'curing', stepSeq: 5 });

    const cure = await override(tray.code, ST['FIL-1'], 'curing');
    const [ok] = await post([scan(tray.code, ST['FIL-1'], 'start', T0, { overrideId: cure })]);
    expect(ok).toMatchObject({ status: 'accepted', tray: { stepSeq: 6, phase: 'in_process' } });
    const audit = t.deps.db.$client.prepare("select detail from audit_log where action = 'scan.override' and entity_id = ?").get(tray.id) as { detail: string };
    expect(JSON.parse(audit.detail)).toMatchObject({ kind: 'curing', overridden: ['curing'], stationId: ST['FIL-1'] });
  });

  it('a wrong-station override does the awaited step at this station and skips nothing', async () => {
    const tray = floor(1); // waiting for striking
    const ov = await override(tray.code, ST['TRM-1'], 'wrong_station');
    const [r] = await post([scan(tray.code, ST['TRM-1'], 'start', T0, { overrideId: ov })]);
    expect(r).toMatchObject({ status: 'accepted', tray: { stepSeq: 1, phase: 'in_process' } });
    expect(eventsOf(tray.id).map((e) => e.stepSeq)).toEqual([1]);
  });

  it('names one station: it is refused at another bench, even one of the same kind', async () => {
    const tray = floor(5);
    expect((await post([scan(tray.code, ST['OVN-1'], 'start', T0 - 60 * MIN)]))[0].status).toBe('accepted');
    const ov = await override(tray.code, ST['FIL-1'], 'curing');
    const [r] = await post([scan(tray.code, ST['FIL-2'], 'start', T0, { overrideId: ov })]);
    expect(r).toMatchObject({ status: 'rejected', code: 'bad_override' });
    expect(stateOf(tray.id)).toMatchObject({ phase: 'curing' });
  });

  it('is used once: the same override on a second scan is refused', async () => {
    const tray = floor(1);
    const ov = await override(tray.code, ST['TRM-1'], 'wrong_station');
    expect((await post([scan(tray.code, ST['TRM-1'], 'start', T0 - 2 * MIN, { overrideId: ov })]))[0].status).toBe('accepted');
    expect((await post([scan(tray.code, ST['TRM-1'], 'finish', T0 - MIN)]))[0].status).toBe('accepted');
    // waiting for trimming at TRM-1 now: the used override rides along and is refused
    const [again] = await post([scan(tray.code, ST['TRM-1'], 'start', T0, { overrideId: ov })]);
    expect(again).toMatchObject({ status: 'rejected', code: 'bad_override' });
  });
});
