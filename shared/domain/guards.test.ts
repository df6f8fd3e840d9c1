import { describe, expect, it } from 'vitest';
import { sum } from 'simple-statistics';
import {
  applyScans,
  effectivePhase,
  evaluateScan,
  minutesUntil,
  type Acceptance,
  type GuardEvent,
  type GuardInput,
  type GuardResult,
  type OverrideKind,
  type Refusal,
} from './guards';
import { initialTrayState, REJECTION_CODES, type RoutingStep, type StationKind, type TrayState } from './vocabulary';
import { refusalMessage, refusalText } from './scan-messages';
import { seededRandom } from './stats';

// A two-colour hard-enamel routing. Cure times: 120 min per colour ("each colour cures in an oven for
// two hours or more before the next colour goes in": common practice, no published source).
const step = (seq: number, name: string, stationKind: StationKind, cureMinutes?: number): RoutingStep => ({
  seq,
  name,
  stationKind,
  trayMinutes: 5,
  pieceMinutes: 0.1,
  cureMinutes: cureMinutes ?? null,
});
const ROUTING: RoutingStep[] = [
  step(1, 'Die striking', 'strike'),
  step(2, 'Trimming', 'trim'),
  step(3, 'Post fitting', 'post'),
  step(4, 'Colour 1 of 2: fill', 'fill'),
  step(5, 'Colour 1 of 2: cure', 'cure', 120),
  step(6, 'Colour 2 of 2: fill', 'fill'),
  step(7, 'Colour 2 of 2: cure', 'cure', 120),
  step(8, 'Stoning', 'stone'),
  step(9, 'Polishing', 'polish'),
  step(10, 'Plating', 'plate'),
];

const ST: Record<string, { id: string; kind: StationKind }> = {
  strike: { id: 'st-strike', kind: 'strike' },
  trim: { id: 'st-trim', kind: 'trim' },
  post: { id: 'st-post', kind: 'post' },
  fill: { id: 'st-fill-1', kind: 'fill' },
  fill2: { id: 'st-fill-2', kind: 'fill' },
  cure: { id: 'st-oven', kind: 'cure' },
  stone: { id: 'st-stone', kind: 'stone' },
  polish: { id: 'st-polish', kind: 'polish' },
  plate: { id: 'st-plate', kind: 'plate' },
  inspect: { id: 'st-inspect', kind: 'inspect' },
};

const T0 = Date.parse('2025-03-03T08:00:00.000Z');
const at = (minutes: number) => new Date(T0 + minutes * 60_000).toISOString();
const NOW = at(24 * 60); // server clock: a day after release

function fresh(quantity = 100): TrayState {
  return initialTrayState({ trayId: 'tray-1', kind: 'tray', quantity, releasedAt: at(0) });
}

function input(state: TrayState, station: keyof typeof ST, event: GuardEvent, extra: Partial<GuardInput> = {}): GuardInput {
  return { state, routing: ROUTING, station: ST[station], event, now: NOW, ...extra };
}

function accepted(r: GuardResult): Acceptance {
  if (!r.ok) throw new Error(`expected accepted, got ${r.code} ${JSON.stringify(r.params)}`);
  return r;
}
function refused(r: GuardResult, code: string): Refusal {
  if (r.ok) throw new Error(`expected ${code}, got accepted`);
  expect(r.code).toBe(code);
  return r;
}

/** Run one start + finish of the waiting step at `station`. */
function doStep(state: TrayState, station: keyof typeof ST, startMin: number, endMin: number, counts: Partial<GuardEvent> = {}) {
  const s = accepted(evaluateScan(input(state, station, { type: 'start', occurredAt: at(startMin) })));
  return accepted(evaluateScan(input(s.next, station, { type: 'finish', occurredAt: at(endMin), ...counts })));
}

/** A tray that went through striking, trimming and posts, filled colour 1, and went into the oven at minute 100. */
function inOven(): TrayState {
  let s = fresh();
  s = doStep(s, 'strike', 10, 20).next;
  s = doStep(s, 'trim', 30, 40).next;
  s = doStep(s, 'post', 50, 60).next;
  s = doStep(s, 'fill', 70, 90).next;
  const r = accepted(evaluateScan(input(s, 'cure', { type: 'start', occurredAt: at(100) })));
  return r.next;
}

const ov = (kind: OverrideKind) => ({ id: `ov-${kind}`, supervisorId: 'sup-1', reason: 'Customer rush agreed by the manager', kind });
const WRONG_STATION = ov('wrong_station');
const CURING = ov('curing');
const RELEASE = ov('release');

describe('start and finish', () => {
  it('a start at the next step’s station puts the tray in process there, with its queue time', () => {
    const r = accepted(evaluateScan(input(fresh(), 'strike', { type: 'start', occurredAt: at(15) })));
    expect(r.next).toMatchObject({ phase: 'in_process', stepSeq: 1, stationId: 'st-strike', startedAt: at(15), waitingSince: null });
    expect(r.facts.queueMinutes).toBe(15);
    expect(r.facts.stepSeq).toBe(1);
  });

  it('a finish moves the good pieces to wait for the next step, with process time and a step record', () => {
    const r = doStep(fresh(100), 'strike', 10, 35, { goodQty: 97, scrapQty: 3, scrapReason: 'double_strike' });
    expect(r.next).toMatchObject({ phase: 'waiting', stepSeq: 2, quantity: 97, stationId: null, waitingSince: at(35) });
    expect(r.facts.processMinutes).toBe(25);
    expect(r.facts.completed).toEqual([
      expect.objectContaining({ seq: 1, quantityIn: 100, good: 97, scrap: 3, rework: 0, scrapReason: 'double_strike', implicit: false }),
    ]);
  });

  it('a finish without counts means every piece good', () => {
    const r = doStep(fresh(40), 'strike', 10, 20);
    expect(r.next.quantity).toBe(40);
    expect(r.facts.completed[0]).toMatchObject({ good: 40, scrap: 0 });
  });

  it('finishing the last step makes the tray done; scrapping every piece makes it scrapped', () => {
    const last = { ...fresh(10), stepSeq: 10, waitingSince: at(500) };
    const done = doStep(last, 'plate', 510, 530);
    expect(done.next).toMatchObject({ phase: 'done', stepSeq: null, quantity: 10 });

    const lost = doStep(fresh(10), 'strike', 10, 20, { goodQty: 0, scrapQty: 10, scrapReason: 'die_crack' });
    expect(lost.next).toMatchObject({ phase: 'scrapped', stepSeq: null, quantity: 0 });
  });

  it('not_started: a finish for a tray that is waiting', () => {
    const r = refused(evaluateScan(input(fresh(), 'strike', { type: 'finish', occurredAt: at(10) })), 'not_started');
    expect(r.params).toMatchObject({ stepSeq: 1, stepKind: 'strike' });
    expect(r.overridable).toBe(false);
  });

  it('already_started: a second start, at the same or another bench of the kind', () => {
    const s = accepted(evaluateScan(input(fresh(), 'strike', { type: 'start', occurredAt: at(10) }))).next;
    refused(evaluateScan(input(s, 'strike', { type: 'start', occurredAt: at(11) })), 'already_started');
    // started elsewhere: the tray is still in process, whatever station scans it
    refused(evaluateScan(input(s, 'trim', { type: 'start', occurredAt: at(11) })), 'already_started');
  });

  it('a finish at another bench of the same kind is accepted (two colour-fill benches)', () => {
    let s: TrayState = { ...fresh(), stepSeq: 4, waitingSince: at(60) };
    s = accepted(evaluateScan(input(s, 'fill', { type: 'start', occurredAt: at(70) }))).next;
    const r = accepted(evaluateScan(input(s, 'fill2', { type: 'finish', occurredAt: at(80) })));
    expect(r.next.stepSeq).toBe(5);
  });

  it('finished: any scan of a done or scrapped tray', () => {
    for (const phase of ['done', 'scrapped', 'merged'] as const) {
      const s: TrayState = { ...fresh(), phase, stepSeq: null };
      for (const type of ['start', 'finish', 'hold'] as const) {
        const r = refused(evaluateScan(input(s, 'strike', { type, occurredAt: at(10), scrapReason: 'x' })), 'finished');
        expect(r.params.phase).toBe(phase);
      }
    }
  });
});

describe('wrong station', () => {
  it('is refused with the expected step, and is overridable', () => {
    const r = refused(evaluateScan(input(fresh(), 'polish', { type: 'start', occurredAt: at(10) })), 'wrong_station');
    expect(r.overridable).toBe(true);
    expect(r.params).toMatchObject({ expectedSeq: 1, expectedKind: 'strike', stationKind: 'polish', action: 'start' });
  });

  it('with a wrong-station override does the awaited step here and never jumps to a later step of this kind', () => {
    // posts are step 3: the override does step 1 (striking) at the post bench, nothing is skipped
    const r = accepted(evaluateScan(input(fresh(), 'post', { type: 'start', occurredAt: at(10) }, { override: WRONG_STATION })));
    expect(r.next).toMatchObject({ phase: 'in_process', stepSeq: 1, stationId: 'st-post' });
    expect(r.facts.substitutedKind).toBe('post');
    expect(r.facts.overridden).toEqual(['wrong_station']);
    expect(r.facts.completed).toEqual([]);
  });

  it('an override of another guard does not pass the wrong-station guard', () => {
    for (const o of [CURING, RELEASE]) {
      refused(evaluateScan(input(fresh(), 'post', { type: 'start', occurredAt: at(10) }, { override: o })), 'wrong_station');
    }
  });

  it('a wrong-station override never stands in for a cure: a tray waiting for its oven stays refused at the fill bench', () => {
    let s = fresh();
    s = doStep(s, 'strike', 10, 20).next;
    s = doStep(s, 'trim', 30, 40).next;
    s = doStep(s, 'post', 50, 60).next;
    s = doStep(s, 'fill', 70, 90).next; // waiting for step 5, colour 1 cure
    const r = refused(evaluateScan(input(s, 'fill', { type: 'start', occurredAt: at(95) }, { override: WRONG_STATION })), 'wrong_station');
    expect(r.overridable).toBe(false);
    expect(r.params).toMatchObject({ expectedSeq: 5, expectedKind: 'cure' });
  });

  it('a tray in the oven is not taken out by a wrong-station override at another station', () => {
    const r = refused(evaluateScan(input(inOven(), 'polish', { type: 'finish', occurredAt: at(250) }, { override: WRONG_STATION })), 'wrong_station');
    expect(r.overridable).toBe(false);
  });

  it('with an override and no later step of this kind does the next step here', () => {
    const r = accepted(evaluateScan(input(fresh(), 'inspect', { type: 'start', occurredAt: at(10) }, { override: WRONG_STATION })));
    expect(r.next).toMatchObject({ phase: 'in_process', stepSeq: 1, stationId: 'st-inspect' });
    expect(r.facts.substitutedKind).toBe('inspect');
    // and it is finished at the station where it started
    const f = accepted(evaluateScan(input(r.next, 'inspect', { type: 'finish', occurredAt: at(20) })));
    expect(f.next.stepSeq).toBe(2);
  });

  it('a finish at a station of another kind is refused, overridable', () => {
    const s = accepted(evaluateScan(input(fresh(), 'strike', { type: 'start', occurredAt: at(10) }))).next;
    const r = refused(evaluateScan(input(s, 'trim', { type: 'finish', occurredAt: at(20) })), 'wrong_station');
    expect(r.params).toMatchObject({ action: 'finish', expectedKind: 'strike' });
    refused(evaluateScan(input(s, 'trim', { type: 'finish', occurredAt: at(20) }, { override: CURING })), 'wrong_station');
    const o = accepted(evaluateScan(input(s, 'trim', { type: 'finish', occurredAt: at(20) }, { override: WRONG_STATION })));
    expect(o.facts.overridden).toEqual(['wrong_station']);
  });

  it('an override that was not needed changes nothing and is not counted as used', () => {
    const r = accepted(evaluateScan(input(fresh(), 'strike', { type: 'start', occurredAt: at(10) }, { override: WRONG_STATION })));
    expect(r.facts.overridden).toEqual([]);
    expect(r.next.stepSeq).toBe(1);
  });
});

describe('cure interlock (2 h cure per colour: common practice)', () => {
  it('a cure start puts the tray in the oven with its ready time', () => {
    const s = inOven();
    expect(s).toMatchObject({ phase: 'curing', stepSeq: 5, stationId: 'st-oven', startedAt: at(100), cureReadyAt: at(220) });
  });

  it('next colour one minute early: refused with minutesLeft 1', () => {
    const r = refused(evaluateScan(input(inOven(), 'fill', { type: 'start', occurredAt: at(219) })), 'curing');
    expect(r.minutesLeft).toBe(1);
    expect(r.params).toMatchObject({ minutesLeft: 1, readyAt: at(220), cureSeq: 5, stepSeq: 6 });
    expect(r.overridable).toBe(true);
  });

  it('next colour 30 seconds early: still refused, 1 minute left (minutes round up)', () => {
    const occurredAt = new Date(Date.parse(at(220)) - 30_000).toISOString();
    const r = refused(evaluateScan(input(inOven(), 'fill', { type: 'start', occurredAt })), 'curing');
    expect(r.minutesLeft).toBe(1);
  });

  it('next colour 90 minutes early: 90 minutes left', () => {
    expect(refused(evaluateScan(input(inOven(), 'fill', { type: 'start', occurredAt: at(130) })), 'curing').minutesLeft).toBe(90);
  });

  it('next colour exactly on time: accepted; the cure step closes on its own at its ready time', () => {
    const r = accepted(evaluateScan(input(inOven(), 'fill', { type: 'start', occurredAt: at(220) })));
    expect(r.next).toMatchObject({ phase: 'in_process', stepSeq: 6, stationId: 'st-fill-1', cureReadyAt: null });
    expect(r.facts.completed).toEqual([expect.objectContaining({ seq: 5, good: 100, scrap: 0, finishedAt: at(220), processMinutes: 120, implicit: true })]);
    expect(r.facts.queueMinutes).toBe(0);
  });

  it('a late start counts queue time from the cure’s ready time', () => {
    const r = accepted(evaluateScan(input(inOven(), 'fill2', { type: 'start', occurredAt: at(250) })));
    expect(r.facts.queueMinutes).toBe(30);
    expect(r.facts.completed[0].finishedAt).toBe(at(220));
  });

  it('taking the tray out of the oven early is refused with the minutes left; on time it is accepted', () => {
    const early = refused(evaluateScan(input(inOven(), 'cure', { type: 'finish', occurredAt: at(219) })), 'curing');
    expect(early.minutesLeft).toBe(1);
    const out = accepted(evaluateScan(input(inOven(), 'cure', { type: 'finish', occurredAt: at(220), goodQty: 99, scrapQty: 1, scrapReason: 'enamel_crack' })));
    expect(out.next).toMatchObject({ phase: 'waiting', stepSeq: 6, quantity: 99, waitingSince: at(220) });
    expect(out.facts.processMinutes).toBe(120);
    // the next colour may start at once
    accepted(evaluateScan(input(out.next, 'fill', { type: 'start', occurredAt: at(221) })));
  });

  it('a wrong-station or release override does not let the next colour start early', () => {
    for (const o of [WRONG_STATION, RELEASE]) {
      const r = refused(evaluateScan(input(inOven(), 'fill', { type: 'start', occurredAt: at(200) }, { override: o })), 'curing');
      expect(r.minutesLeft).toBe(20);
    }
    // nor at a bench of another kind: that needs two overrides, one per guard
    refused(evaluateScan(input(inOven(), 'polish', { type: 'start', occurredAt: at(200) }, { override: WRONG_STATION })), 'curing');
    refused(evaluateScan(input(inOven(), 'polish', { type: 'start', occurredAt: at(200) }, { override: CURING })), 'wrong_station');
  });

  it('a curing override lets the next colour start early; the cure closes at the override', () => {
    const r = accepted(evaluateScan(input(inOven(), 'fill', { type: 'start', occurredAt: at(200) }, { override: CURING })));
    expect(r.facts.overridden).toEqual(['curing']);
    expect(r.facts.completed[0]).toMatchObject({ seq: 5, finishedAt: at(200), processMinutes: 100, implicit: true });
  });

  it('an overridden early take-out does not need a second override for the next colour', () => {
    refused(evaluateScan(input(inOven(), 'cure', { type: 'finish', occurredAt: at(200) }, { override: WRONG_STATION })), 'curing');
    const out = accepted(evaluateScan(input(inOven(), 'cure', { type: 'finish', occurredAt: at(200) }, { override: CURING })));
    expect(out.facts.overridden).toEqual(['curing']);
    accepted(evaluateScan(input(out.next, 'fill', { type: 'start', occurredAt: at(201) })));
  });

  it('a tray in the oven scanned at the oven again is already started; a finish at the fill bench is not started', () => {
    refused(evaluateScan(input(inOven(), 'cure', { type: 'start', occurredAt: at(150) })), 'already_started');
    refused(evaluateScan(input(inOven(), 'fill', { type: 'finish', occurredAt: at(250) })), 'not_started');
  });

  it('effectivePhase: curing until the ready time, then waiting', () => {
    expect(effectivePhase(inOven(), at(219))).toBe('curing');
    expect(effectivePhase(inOven(), at(220))).toBe('waiting');
  });

  it('minutesUntil rounds up and never goes below zero', () => {
    expect(minutesUntil(0, 60_000)).toBe(1);
    expect(minutesUntil(0, 60_001)).toBe(2);
    expect(minutesUntil(0, 1)).toBe(1);
    expect(minutesUntil(60_000, 0)).toBe(0);
  });
});

describe('quantities', () => {
  const started = () => accepted(evaluateScan(input(fresh(100), 'strike', { type: 'start', occurredAt: at(10) }))).next;
  const finishWith = (counts: Partial<GuardEvent>) => evaluateScan(input(started(), 'strike', { type: 'finish', occurredAt: at(20), ...counts }));

  it('good + scrap below the quantity in is refused', () => {
    const r = refused(finishWith({ goodQty: 90, scrapQty: 5, scrapReason: 'die_crack' }), 'quantity_mismatch');
    expect(r.params).toMatchObject({ quantityIn: 100, good: 90, scrap: 5 });
  });
  it('good + scrap above the quantity in is refused', () => {
    refused(finishWith({ goodQty: 100, scrapQty: 1, scrapReason: 'die_crack' }), 'quantity_mismatch');
  });
  it('scrap alone larger than the quantity in is refused', () => {
    refused(finishWith({ scrapQty: 101, scrapReason: 'die_crack' }), 'quantity_mismatch');
  });
  it('rework is part of good: rework ≤ good accepted, rework > good refused', () => {
    const ok = accepted(finishWith({ goodQty: 95, scrapQty: 5, reworkQty: 95, scrapReason: 'die_crack' }));
    expect(ok.facts.completed[0]).toMatchObject({ good: 95, scrap: 5, rework: 95 });
    expect(ok.next.quantity).toBe(95);
    refused(finishWith({ goodQty: 95, scrapQty: 5, reworkQty: 96, scrapReason: 'die_crack' }), 'quantity_mismatch');
  });
  it('negative, fractional, excess and non-numeric counts are refused, whoever calls the guard', () => {
    const cases: Partial<GuardEvent>[] = [
      { goodQty: 105, scrapQty: -5, scrapReason: 'die_crack' }, // sums to 100, but scrap < 0 and good > pieces in
      { goodQty: 101 }, // good > pieces in (scrap would be -1)
      { goodQty: 99.5, scrapQty: 0.5, scrapReason: 'die_crack' }, // fractions that sum to 100
      { goodQty: 100, reworkQty: -1 },
      { goodQty: 100, reworkQty: 0.5 },
      { goodQty: Number.NaN },
      { goodQty: Number.POSITIVE_INFINITY, scrapQty: Number.NEGATIVE_INFINITY, scrapReason: 'die_crack' },
      { goodQty: '100' as unknown as number },
    ];
    for (const c of cases) {
      const r = refused(finishWith(c), 'quantity_mismatch');
      expect(r.params.quantityIn).toBe(100);
      // the params stay JSON-safe numbers (or null)
      for (const v of [r.params.good, r.params.scrap, r.params.rework]) expect(v === null || Number.isFinite(v)).toBe(true);
    }
    // with no scrap given, good may not exceed the pieces in either
    refused(finishWith({ scrapQty: -1, scrapReason: 'die_crack' }), 'quantity_mismatch');
  });

  it('scrap needs a reason, and a reason from the list when the list is given', () => {
    refused(finishWith({ goodQty: 98, scrapQty: 2 }), 'scrap_reason_missing');
    const r = evaluateScan(
      input(started(), 'strike', { type: 'finish', occurredAt: at(20), goodQty: 98, scrapQty: 2, scrapReason: 'gremlins' }, { reasonCodes: ['die_crack'] }),
    );
    expect(refused(r, 'scrap_reason_missing').params.reason).toBe('gremlins');
  });

  it('pieces are conserved through a whole routing with random scrap (checked by an independent sum)', () => {
    // Deterministic pseudo-random scrap per step (the app's one seeded generator).
    const rand = seededRandom(12345);
    for (let trial = 0; trial < 50; trial++) {
      const startQty = 50 + Math.floor(rand() * 200);
      let s = { ...fresh(startQty), releasedAt: at(0) };
      const scraps: number[] = [];
      let t = 1;
      const kinds: Array<keyof typeof ST> = ['strike', 'trim', 'post', 'fill', 'cure', 'fill', 'cure', 'stone', 'polish', 'plate'];
      for (const k of kinds) {
        if (s.phase !== 'waiting') break;
        const scrap = Math.min(s.quantity, Math.floor(rand() * 4));
        const st = accepted(evaluateScan(input(s, k, { type: 'start', occurredAt: at(t) })));
        t += k === 'cure' ? 130 : 5;
        const fin = accepted(
          evaluateScan(input(st.next, k, { type: 'finish', occurredAt: at(t), goodQty: s.quantity - scrap, scrapQty: scrap, scrapReason: 'die_crack' })),
        );
        const rec = fin.facts.completed[0];
        expect(rec.quantityIn).toBe(rec.good + rec.scrap); // in = good + scrap at every step
        scraps.push(scrap);
        s = fin.next;
        t += 1;
      }
      expect(s.quantity + sum(scraps.length ? scraps : [0])).toBe(startQty);
    }
  });
});

describe('hold and release', () => {
  it('a hold needs a reason; a held tray cannot start or finish; release needs a supervisor', () => {
    refused(evaluateScan(input(fresh(), 'strike', { type: 'hold', occurredAt: at(5) })), 'scrap_reason_missing');
    const held = accepted(evaluateScan(input(fresh(), 'strike', { type: 'hold', occurredAt: at(5), scrapReason: 'artwork_query' }))).next;
    expect(held).toMatchObject({ onHold: true, holdReason: 'artwork_query', phase: 'waiting' });

    const r = refused(evaluateScan(input(held, 'strike', { type: 'start', occurredAt: at(6) })), 'on_hold');
    expect(r.params.holdReason).toBe('artwork_query');
    expect(r.overridable).toBe(false);
    // an override does not lift a hold
    for (const o of [WRONG_STATION, CURING, RELEASE])
      refused(evaluateScan(input(held, 'strike', { type: 'start', occurredAt: at(6) }, { override: o })), 'on_hold');
    refused(evaluateScan(input(held, 'strike', { type: 'hold', occurredAt: at(6), scrapReason: 'x' })), 'on_hold');

    const byOperator = refused(evaluateScan(input(held, 'strike', { type: 'release', occurredAt: at(7) }, { actorRole: 'operator' })), 'bad_override');
    expect(byOperator.params.reason).toBe('release_needs_supervisor');
    const bySup = accepted(evaluateScan(input(held, 'strike', { type: 'release', occurredAt: at(7) }, { actorRole: 'supervisor' })));
    expect(bySup.next).toMatchObject({ onHold: false, holdReason: null });
    for (const o of [WRONG_STATION, CURING]) {
      refused(evaluateScan(input(held, 'strike', { type: 'release', occurredAt: at(7) }, { actorRole: 'operator', override: o })), 'bad_override');
    }
    const byOverride = accepted(evaluateScan(input(held, 'strike', { type: 'release', occurredAt: at(7) }, { actorRole: 'operator', override: RELEASE })));
    expect(byOverride.next.onHold).toBe(false);
    accepted(evaluateScan(input(bySup.next, 'strike', { type: 'start', occurredAt: at(8) })));
  });

  it('a tray held while in process cannot be finished until released', () => {
    const s = accepted(evaluateScan(input(fresh(), 'strike', { type: 'start', occurredAt: at(10) }))).next;
    const held = accepted(evaluateScan(input(s, 'strike', { type: 'hold', occurredAt: at(11), note: 'press jammed' }))).next;
    expect(held).toMatchObject({ phase: 'in_process', onHold: true, holdReason: 'press jammed' });
    refused(evaluateScan(input(held, 'strike', { type: 'finish', occurredAt: at(12) })), 'on_hold');
  });

  it('not_on_hold: releasing a tray that is not held', () => {
    refused(evaluateScan(input(fresh(), 'strike', { type: 'release', occurredAt: at(5) }, { actorRole: 'supervisor' })), 'not_on_hold');
  });
});

describe('mould not ready', () => {
  it('a striking or casting start waits for the mould; other steps do not', () => {
    const r = refused(evaluateScan(input(fresh(), 'strike', { type: 'start', occurredAt: at(5) }, { mouldReady: false })), 'mould_not_ready');
    expect(r.overridable).toBe(false);
    refused(evaluateScan(input(fresh(), 'strike', { type: 'start', occurredAt: at(5) }, { mouldReady: false, override: WRONG_STATION })), 'mould_not_ready');
    accepted(evaluateScan(input(fresh(), 'strike', { type: 'start', occurredAt: at(5) }, { mouldReady: true })));
    const trimming = { ...fresh(), stepSeq: 2 };
    accepted(evaluateScan(input(trimming, 'trim', { type: 'start', occurredAt: at(5) }, { mouldReady: false })));
  });

  it('a mould traveller itself is never held back by the mould rule', () => {
    const mould = { ...initialTrayState({ trayId: 'm-1', kind: 'mould', quantity: 1, releasedAt: at(0) }) };
    const r = evaluateScan({
      state: mould,
      routing: [step(1, 'Strike test', 'strike')],
      station: ST.strike,
      event: { type: 'start', occurredAt: at(5) },
      now: NOW,
      mouldReady: false,
    });
    expect(r.ok).toBe(true);
  });
});

describe('bad time (2 min ahead, 7 days back, release, last event)', () => {
  const now = at(10 * 24 * 60); // ten days after release
  const s0 = () => fresh();
  const start = (occurredAt: string, state = s0()) => evaluateScan({ ...input(state, 'strike', { type: 'start', occurredAt }), now });

  it('accepts exactly 2 minutes ahead; refuses 2 minutes and 1 second ahead', () => {
    accepted(start(new Date(Date.parse(now) + 120_000).toISOString()));
    const r = refused(start(new Date(Date.parse(now) + 121_000).toISOString()), 'bad_time');
    expect(r.params.reason).toBe('future');
  });

  it('accepts exactly 7 days old; refuses older', () => {
    accepted(start(new Date(Date.parse(now) - 7 * 86_400_000).toISOString()));
    expect(refused(start(new Date(Date.parse(now) - 7 * 86_400_000 - 1000).toISOString()), 'bad_time').params.reason).toBe('too_old');
  });

  it('refuses a time before the release', () => {
    const late = { ...s0(), releasedAt: at(9 * 24 * 60), waitingSince: at(9 * 24 * 60) };
    expect(refused(start(at(9 * 24 * 60 - 1), late), 'bad_time').params.reason).toBe('before_release');
  });

  it('refuses a time before the tray’s last event; the same instant is fine', () => {
    const r1 = accepted(start(at(8 * 24 * 60)));
    expect(r1.next.lastEventAt).toBe(at(8 * 24 * 60));
    const fin = (occurredAt: string) => evaluateScan({ ...input(r1.next, 'strike', { type: 'finish', occurredAt }), now });
    expect(refused(fin(at(8 * 24 * 60 - 1)), 'bad_time').params).toMatchObject({ reason: 'before_last_event', limit: at(8 * 24 * 60) });
    accepted(fin(at(8 * 24 * 60)));
  });

  it('a hold also moves the last-event time', () => {
    const day9 = 9 * 24 * 60;
    const held = accepted(evaluateScan({ ...input(s0(), 'strike', { type: 'hold', occurredAt: at(day9), note: 'x' }), now })).next;
    const r = evaluateScan({ ...input(held, 'strike', { type: 'release', occurredAt: at(day9 - 1) }, { actorRole: 'supervisor' }), now });
    expect(refused(r, 'bad_time').params.reason).toBe('before_last_event');
  });

  it('an unreadable time is refused', () => {
    expect(refused(start('not a time'), 'bad_time').params.reason).toBe('unreadable');
  });
});

describe('traveller verdicts from the traveller-code check', () => {
  it('unknown, forged and void codes are refused before anything else', () => {
    const base = input(fresh(), 'strike', { type: 'start', occurredAt: at(5) });
    refused(evaluateScan({ ...base, traveller: { status: 'unknown' } }), 'unknown_tray');
    refused(evaluateScan({ ...base, state: null }), 'unknown_tray');
    refused(evaluateScan({ ...base, traveller: { status: 'forged' } }), 'bad_signature');
    const v = refused(evaluateScan({ ...base, traveller: { status: 'void', currentRevision: 3 } }), 'void_traveller');
    expect(v.params.currentRevision).toBe(3);
  });
});

describe('applyScans and plain-words messages', () => {
  it('applies a day of scans in order, leaving state untouched on a refusal', () => {
    const { state, results } = applyScans(fresh(20), [
      { routing: ROUTING, station: ST.strike, event: { type: 'start', occurredAt: at(5) }, now: NOW },
      { routing: ROUTING, station: ST.strike, event: { type: 'finish', occurredAt: at(15), goodQty: 30 }, now: NOW },
      { routing: ROUTING, station: ST.strike, event: { type: 'finish', occurredAt: at(16), goodQty: 20 }, now: NOW },
      { routing: ROUTING, station: ST.trim, event: { type: 'start', occurredAt: at(17) }, now: NOW },
    ]);
    expect(results.map((r) => (r.ok ? 'ok' : r.code))).toEqual(['ok', 'quantity_mismatch', 'ok', 'ok']);
    expect(state).toMatchObject({ phase: 'in_process', stepSeq: 2, quantity: 20 });
  });

  it('every rejection code has a message that says what happened and what to do', () => {
    for (const code of REJECTION_CODES) {
      const m = refusalMessage(code, { minutesLeft: 3, quantityIn: 10, good: 8, scrap: 1 });
      expect(m.title.length).toBeGreaterThan(3);
      expect(m.detail.length).toBeGreaterThan(10);
      expect(m.next.length).toBeGreaterThan(10);
    }
  });

  it('messages carry the numbers that matter', () => {
    expect(refusalText('curing', { minutesLeft: 1, readyAt: at(220), cureName: 'Colour 1 of 2: cure', cureSeq: 5 })).toContain('1 more minute');
    expect(refusalText('curing', { minutesLeft: 45, readyAt: at(220) })).toContain('45 more minutes');
    expect(refusalText('quantity_mismatch', { quantityIn: 100, good: 90, scrap: 5, rework: 0 })).toContain('Good 90 + scrap 5 must equal the 100');
    expect(
      refusalText('wrong_station', { expectedKind: 'strike', expectedSeq: 1, expectedName: 'Die striking', stationKind: 'polish', action: 'start' }),
    ).toContain('Take the tray to die striking');
    expect(refusalText('void_traveller', { currentRevision: 2 })).toContain('revision 2');
  });
});
