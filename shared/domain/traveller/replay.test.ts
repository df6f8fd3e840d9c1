import { describe, expect, it } from 'vitest';
import { replayTravellers, stepRunYieldCounts, trayFlowOf, type ReplayEvent, type ReplayTraveller, type StepRun } from './replay';
import { applyScans, type GuardInput } from '../guards';
import { initialTrayState, type RoutingStep, type StationKind } from '../vocabulary';
import { stepYield, sumStepCounts } from '../yield';

const MIN = 60_000;
const T0 = Date.parse('2026-06-01T00:00:00Z');
const at = (m: number) => T0 + m * MIN;

const step = (seq: number, stationKind: StationKind, cureMinutes: number | null = null): RoutingStep => ({
  seq,
  name: `step ${seq}`,
  stationKind,
  trayMinutes: 10,
  pieceMinutes: 0,
  cureMinutes,
  colour: null,
});
const ROUTING = [step(1, 'fill'), step(2, 'cure', 120), step(3, 'plate'), step(4, 'inspect'), step(5, 'pack')];
const tray = (id: string, extra: Partial<ReplayTraveller> = {}): ReplayTraveller => ({
  id,
  orderId: 'o',
  kind: 'tray',
  quantity: 100,
  releasedAt: at(0),
  routing: ROUTING,
  ...extra,
});
const ev = (trayId: string, type: string, m: number, kind: StationKind | null, extra: Partial<ReplayEvent> = {}): ReplayEvent => ({
  trayId,
  type,
  stepSeq: null,
  stationId: kind ? `${kind}-1` : null,
  stationKind: kind,
  occurredAt: at(m),
  qtyIn: null,
  goodQty: null,
  scrapQty: null,
  reworkQty: null,
  scrapReason: null,
  ...extra,
});

/** The yield of one station kind over runs, as the report sums them. */
function yieldOf(runs: StepRun[], kind: string) {
  const rows = runs.filter((r) => r.stationKind === kind).map((r) => ({ seq: 1, ...stepRunYieldCounts(r) }));
  return stepYield(sumStepCounts(rows)[0]);
}

describe('replay: a traveller’s history through the scan guards', () => {
  const history = [
    ev('a', 'start', 60, 'fill'),
    ev('a', 'finish', 120, 'fill', { goodQty: 98, scrapQty: 2, scrapReason: 'bubbles' }),
    ev('a', 'start', 130, 'cure'),
    // the plater takes the tray from the oven: the cure closes on its own at 130 + 120
    ev('a', 'start', 300, 'plate'),
    ev('a', 'finish', 360, 'plate', { goodQty: 98 }),
  ];

  it('ends in the state the guards give scan by scan', () => {
    const r = replayTravellers([tray('a')], history);
    const inputs: Omit<GuardInput, 'state'>[] = history.map((e) => ({
      routing: ROUTING,
      station: { id: e.stationId!, kind: e.stationKind as StationKind },
      event: {
        type: e.type as 'start',
        occurredAt: new Date(e.occurredAt).toISOString(),
        goodQty: e.goodQty,
        scrapQty: e.scrapQty,
        scrapReason: e.scrapReason,
      },
      now: e.occurredAt,
    }));
    const direct = applyScans(initialTrayState({ trayId: 'a', kind: 'tray', quantity: 100, releasedAt: new Date(at(0)).toISOString() }), inputs);
    expect(direct.results.every((x) => x.ok)).toBe(true);
    expect(r.refused).toEqual([]);
    expect(r.states.get('a')).toEqual(direct.state);
  });

  it('closes each step with its queue and process time, the cure on its own at the end of its time', () => {
    const runs = replayTravellers([tray('a')], history).runs.get('a')!;
    expect(runs.map((x) => [x.stepSeq, x.stationKind, x.queueMinutes, x.processMinutes, x.qtyIn, x.goodQty, x.implicit, x.pass])).toEqual([
      [1, 'fill', 60, 60, 100, 98, false, 'first'], // waited from release (0) to 60
      [2, 'cure', 10, 120, 98, 98, true, 'first'], // in at 130, ready at 250
      [3, 'plate', 50, 60, 98, 98, false, 'first'], // waited from the end of the cure (250) to 300
    ]);
    expect(runs[1]).toMatchObject({ cureMinutes: 120, readyAt: at(120), startedAt: at(130), finishedAt: at(250), stationId: 'cure-1' });
    // the tray's flow: cure time apart from process time, in each unit the clock given measures
    const flow = trayFlowOf(tray('a'), runs, (from, to) => (to - from) / MIN / 2);
    expect(flow).toMatchObject({
      processMinutes: 120,
      cureMinutes: 120,
      processWorkingMinutes: 60,
      cureWorkingMinutes: 60,
      startedAt: at(60),
      lastFinishAt: at(360),
    });
  });

  it('leaves out, and reports, a stored event the guards refuse', () => {
    const r = replayTravellers([tray('a')], [ev('a', 'finish', 10, 'fill', { goodQty: 100 })]);
    expect(r.refused.map((x) => x.result.code)).toEqual(['not_started']);
    expect(r.runs.get('a')).toEqual([]);
  });

  it('lets a stored override through the guard it names', () => {
    const early = [...history.slice(0, 3), ev('a', 'start', 200, 'plate', { overrideKind: 'curing' })];
    expect(replayTravellers([tray('a')], early.slice(0, 3).concat(ev('a', 'start', 200, 'plate'))).refused.map((x) => x.result.code)).toEqual(['curing']);
    const r = replayTravellers([tray('a')], early);
    expect(r.refused).toEqual([]);
    expect(r.runs.get('a')!.at(-1)).toMatchObject({ stationKind: 'cure', processMinutes: 70, implicit: true });
  });
});

describe('rework by a split counts as not first pass for the step it went back to', () => {
  // 100 pieces plated; before inspection 10 are split off back to plating and plated again
  // (first-pass yield = pieces passed the first time / pieces in: common practice).
  const parent = tray('p');
  const child = tray('c', { quantity: 10, parentId: 'p' });
  const common = [
    ev('p', 'start', 10, 'fill'),
    ev('p', 'finish', 20, 'fill', { goodQty: 100 }),
    ev('p', 'start', 30, 'cure'),
    ev('p', 'start', 200, 'plate'),
    ev('p', 'finish', 260, 'plate', { goodQty: 100 }),
    // the split: the new tray's event first, then the parent's (as the tray service writes them)
    ev('c', 'split', 300, null, { stepSeq: 3, qtyIn: 10 }),
    ev('p', 'split', 300, null, { stepSeq: 4, qtyIn: 100 }),
    ev('p', 'start', 310, 'inspect'),
    ev('p', 'finish', 330, 'inspect', { goodQty: 90 }),
    ev('c', 'start', 320, 'plate'),
  ];

  it('10 of 100 re-plated: plating first-pass yield 0.9, final yield 1.0; the re-plated pieces are not new pieces in', () => {
    const r = replayTravellers(
      [parent, child],
      [...common, ev('c', 'finish', 380, 'plate', { goodQty: 10 }), ev('c', 'start', 390, 'inspect'), ev('c', 'finish', 400, 'inspect', { goodQty: 10 })],
    );
    expect(r.refused).toEqual([]);
    expect(r.states.get('p')).toMatchObject({ phase: 'waiting', stepSeq: 5, quantity: 90 });
    expect(r.states.get('c')).toMatchObject({ phase: 'waiting', stepSeq: 5, quantity: 10 });
    const runs = [...r.runs.get('p')!, ...r.runs.get('c')!];
    expect(r.runs.get('c')!.map((x) => [x.stationKind, x.pass, x.queueMinutes])).toEqual([
      ['plate', 'rework', 20], // waits from the split (300) to 320
      ['inspect', 'first', 10],
    ]);
    expect(yieldOf(runs, 'plate')).toMatchObject({ inQty: 100, firstPassQty: 90, goodQty: 100, reworkQty: 10, firstPassYield: 0.9, finalYield: 1 });
    // inspection saw each of the 100 pieces once
    expect(yieldOf(runs, 'inspect')).toMatchObject({ inQty: 100, goodQty: 100, firstPassYield: 1 });
  });

  it('pieces scrapped in the rework are lost from the step’s good ones; first pass stays 90 of 100', () => {
    const r = replayTravellers([parent, child], [...common, ev('c', 'finish', 380, 'plate', { goodQty: 8, scrapQty: 2, scrapReason: 'plating_defect' })]);
    const runs = [...r.runs.get('p')!, ...r.runs.get('c')!];
    expect(yieldOf(runs, 'plate')).toMatchObject({ inQty: 100, goodQty: 98, scrapQty: 2, reworkQty: 8, firstPassYield: 0.9, finalYield: 0.98 });
  });

  it('steps done again after the one it went back to are neither new pieces nor failures', () => {
    // back to the fill (step 1) from inspection's queue: the fill is the rework, the cure and the plating are done again
    const c2 = tray('c2', { quantity: 10, parentId: 'p' });
    const events = [
      ...common.slice(0, 5),
      ev('c2', 'split', 300, null, { stepSeq: 1, qtyIn: 10 }),
      ev('p', 'split', 300, null, { stepSeq: 4, qtyIn: 100 }),
      ev('c2', 'start', 310, 'fill'),
      ev('c2', 'finish', 330, 'fill', { goodQty: 10 }),
      ev('c2', 'start', 340, 'cure'),
      ev('c2', 'start', 500, 'plate'),
      ev('c2', 'finish', 520, 'plate', { goodQty: 10 }),
      ev('c2', 'start', 530, 'inspect'),
    ];
    const r = replayTravellers([parent, c2], events);
    expect(r.refused).toEqual([]);
    expect(r.runs.get('c2')!.map((x) => [x.stationKind, x.pass])).toEqual([
      ['fill', 'rework'],
      ['cure', 'repeat'],
      ['plate', 'repeat'],
    ]);
    const runs = [...r.runs.get('p')!, ...r.runs.get('c2')!];
    expect(yieldOf(runs, 'fill')).toMatchObject({ inQty: 100, firstPassYield: 0.9, finalYield: 1 });
    expect(yieldOf(runs, 'cure')).toMatchObject({ inQty: 100, firstPassYield: 1 });
    expect(yieldOf(runs, 'plate')).toMatchObject({ inQty: 100, firstPassYield: 1 });
    expect(r.states.get('p')).toMatchObject({ phase: 'waiting', stepSeq: 4, quantity: 90 });
    expect(r.states.get('c2')).toMatchObject({ phase: 'in_process', stepSeq: 4, quantity: 10 });
  });

  it('a merge puts the pieces together; the merged tray waits since the earliest and starts after the latest cure', () => {
    const a = tray('a', { quantity: 50 });
    const b = tray('b', { quantity: 50, mergedIntoId: 'a' });
    const events = [
      ev('a', 'start', 10, 'fill'),
      ev('a', 'finish', 20, 'fill', { goodQty: 50 }),
      ev('a', 'start', 30, 'cure'),
      ev('b', 'start', 40, 'fill'),
      ev('b', 'finish', 50, 'fill', { goodQty: 49, scrapQty: 1, scrapReason: 'bubbles' }),
      ev('b', 'start', 60, 'cure'),
      ev('a', 'start', 150, 'plate'),
      ev('a', 'finish', 160, 'plate', { goodQty: 50 }),
      ev('b', 'start', 180, 'plate'),
      ev('b', 'finish', 190, 'plate', { goodQty: 49 }),
      ev('b', 'merge', 200, null, { stepSeq: 4, qtyIn: 49 }),
      ev('a', 'merge', 200, null, { stepSeq: 4, qtyIn: 99 }),
    ];
    const r = replayTravellers([a, b], events);
    expect(r.refused).toEqual([]);
    expect(r.states.get('b')).toMatchObject({ phase: 'merged', quantity: 0, stepSeq: null });
    expect(r.states.get('a')).toMatchObject({ phase: 'waiting', stepSeq: 4, quantity: 99, waitingSince: new Date(at(160)).toISOString() });
  });
});

describe('yield counts of a run', () => {
  it('conserve the pieces of a step: in = good + scrap over its runs', () => {
    const first = stepRunYieldCounts({ pass: 'first', qtyIn: 100, goodQty: 100, scrapQty: 0, reworkQty: 0 });
    const again = stepRunYieldCounts({ pass: 'rework', qtyIn: 10, goodQty: 7, scrapQty: 3, reworkQty: 0 });
    const sum = sumStepCounts([
      { seq: 1, ...first },
      { seq: 1, ...again },
    ])[0];
    expect(sum.inQty).toBe(sum.goodQty + sum.scrapQty);
    expect(stepYield(sum)).toMatchObject({ firstPassQty: 90, finalYield: 0.97 });
  });
});
