// Rework made by splitting a tray back to an earlier step, through the real API: the yield report
// counts the re-plated pieces as not passed first time at plating, and not as new pieces in.
// First-pass yield = pieces that passed the first time / pieces in (common practice).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertFloorOrder, scan, stationId } from '../support/scan-fixtures';
import type { RoutingStep, StationKind } from '@shared/domain/vocabulary';
import type { YieldReport } from '@shared/schemas/reports';

const MIN = 60_000;
const T0 = Math.floor(Date.now() / MIN) * MIN - 2 * 24 * 60 * MIN;
const at = (minutes: number) => T0 + minutes * MIN;
const step = (seq: number, stationKind: StationKind): RoutingStep => ({
  seq,
  name: `Step ${seq}`,
  stationKind,
  trayMinutes: 10,
  pieceMinutes: 0.1,
  cureMinutes: null,
  colour: null,
});

let t: TestApp;
beforeAll(async () => {
  t = makeTestApp({ log: (await import('pino')).pino({ level: 'error' }) });
});
afterAll(() => t.close());

describe('rework by a split in the yield report', () => {
  it('10 of 100 pieces split back to plating and plated again: plating first-pass yield 0.9, not 1.0', async () => {
    const NOW = Date.now();
    t.setNow(NOW);
    const order = insertFloorOrder(t.deps, { trays: 1, quantity: 100, releasedAt: at(0), routing: [step(1, 'plate'), step(2, 'inspect'), step(3, 'pack')] });
    const [tray] = order.trays;
    const PLT = stationId(t.deps, 'PLT-1');
    const INS = stationId(t.deps, 'INS-1');
    const operator = await t.agentAs('operator');
    const supervisor = await t.agentAs('supervisor');
    const manager = await t.agentAs('manager');
    const post = async (events: unknown[]) => {
      const res = await operator.post('/api/scans').send({ events });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      for (const r of res.body.results) expect(r.status, JSON.stringify(r)).toBe('accepted');
    };

    await post([scan(tray.code, PLT, 'start', at(10)), scan(tray.code, PLT, 'finish', at(70), { goodQty: 100, scrapQty: 0 })]);
    // waiting for inspection: 10 pieces go back to plating on a tray of their own (the split is made at the app's "now")
    t.setNow(at(120));
    const split = await supervisor.post(`/api/trays/${tray.id}/split`).send({ parts: [{ quantity: 10, stepSeq: 1 }], note: 'thin plating' });
    expect(split.status, JSON.stringify(split.body)).toBe(201);
    const child = split.body.children[0] as { id: string; code: string };

    t.setNow(NOW);
    await post([
      scan(child.code, PLT, 'start', at(130)),
      scan(child.code, PLT, 'finish', at(180), { goodQty: 10, scrapQty: 0 }),
      scan(split.body.tray.code, INS, 'start', at(190)),
      scan(split.body.tray.code, INS, 'finish', at(200), { goodQty: 90, scrapQty: 0 }),
      scan(child.code, INS, 'start', at(210)),
      scan(child.code, INS, 'finish', at(220), { goodQty: 10, scrapQty: 0 }),
    ]);

    const res = await manager.get('/api/reports/yield').query({ from: new Date(at(-60)).toISOString(), to: new Date(at(300)).toISOString() });
    expect(res.status).toBe(200);
    const r = res.body as YieldReport;
    const plate = r.steps.find((s) => s.stationKind === 'plate')!;
    expect(plate).toMatchObject({ inQty: 100, firstPassQty: 90, goodQty: 100, reworkQty: 10, firstPassYield: 0.9, finalYield: 1 });
    // inspection saw each piece once: 90 on the tray, 10 on the split-off one
    expect(r.steps.find((s) => s.stationKind === 'inspect')).toMatchObject({ inQty: 100, goodQty: 100, firstPassYield: 1 });
  });
});
