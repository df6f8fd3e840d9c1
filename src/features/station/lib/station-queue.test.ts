import { describe, expect, it } from 'vitest';
import { initialTrayState, type RoutingStep, type TrayState } from '@shared/domain/vocabulary';
import type { TrayCard } from '@shared/schemas/scans';
import { newlyCured, stationQueue } from './station-queue';
import { overrideFor } from './refusal-choices';

// An enamel bench (fill) followed by the oven (cure) and polishing; the tablet is at the fill bench.
const routing: RoutingStep[] = [
  { seq: 1, name: 'Fill colours', stationKind: 'fill', trayMinutes: 10, pieceMinutes: 0.5 },
  { seq: 2, name: 'Cure', stationKind: 'cure', trayMinutes: 0, pieceMinutes: 0, cureMinutes: 30 },
  { seq: 3, name: 'Fill second colour', stationKind: 'fill', trayMinutes: 10, pieceMinutes: 0.5 },
];
const T = Date.parse('2026-06-15T02:00:00.000Z');
const at = (m: number) => new Date(T + m * 60_000).toISOString();
const card = (number: string): TrayCard => ({
  tray: { id: number, number, kind: 'tray', revision: 1, releasedQuantity: 50 },
  order: null,
  state: { ...initialTrayState({ trayId: number, kind: 'tray', quantity: 50, releasedAt: at(-600) }), lastEventAt: null },
  routing,
  mouldReady: true,
  artworkUrl: null,
});
const state = (patch: Partial<TrayState>): TrayState => ({ ...initialTrayState({ trayId: 'x', kind: 'tray', quantity: 50, releasedAt: at(-600) }), ...patch });
const tray = (number: string, patch: Partial<TrayState> | null) => ({ number, card: card(number), state: patch ? state(patch) : null });
const fill = { id: 'st-fill-1', kind: 'fill' as const };
const oven = { id: 'st-oven', kind: 'cure' as const };
const numbers = (items: { number: string }[]) => items.map((i) => i.number);

describe('a station’s lists on the tablet', () => {
  it('puts each traveller in the right list, with its minutes', () => {
    const lists = stationQueue(
      [
        tray('A', { phase: 'in_process', stepSeq: 1, stationId: 'st-fill-1', startedAt: at(-25), waitingSince: null }),
        tray('B', { phase: 'in_process', stepSeq: 1, stationId: 'st-fill-2', startedAt: at(-5), waitingSince: null }), // the other fill bench
        tray('C', { phase: 'waiting', stepSeq: 1, waitingSince: at(-40) }),
        tray('D', { phase: 'curing', stepSeq: 2, stationId: 'st-oven', cureReadyAt: at(12), waitingSince: null }), // next step is fill again
        tray('E', { phase: 'waiting', stepSeq: 2, waitingSince: at(-90) }), // waits for the oven, not for this bench
        tray('F', null), // no state on the tablet yet
      ],
      fill,
      T,
    );
    expect(numbers(lists.inProcess)).toEqual(['A']);
    expect(lists.inProcess[0].minutes).toBe(25);
    expect(lists.curing).toEqual([]);
    // a tray curing elsewhere whose next step is here waits with the minutes until it is ready
    expect(numbers(lists.waiting)).toEqual(['C', 'D']);
    expect(lists.waiting.map((i) => i.minutes)).toEqual([40, 12]);
  });

  it('orders each list, and puts held trays last whatever they waited', () => {
    const lists = stationQueue(
      [
        tray('W1', { phase: 'waiting', stepSeq: 1, waitingSince: at(-10) }),
        tray('W2', { phase: 'waiting', stepSeq: 1, waitingSince: at(-300), onHold: true, holdReason: 'hold_quality' }),
        tray('W3', { phase: 'waiting', stepSeq: 1, waitingSince: at(-60) }),
        tray('W4', { phase: 'curing', stepSeq: 2, stationId: 'st-oven', cureReadyAt: at(-30), waitingSince: null }), // ready 30 min ago
        tray('P1', { phase: 'in_process', stepSeq: 1, stationId: 'st-fill-1', startedAt: at(-5), waitingSince: null }),
        tray('P2', { phase: 'in_process', stepSeq: 1, stationId: 'st-fill-1', startedAt: at(-50), waitingSince: null, onHold: true }),
        tray('P3', { phase: 'in_process', stepSeq: 1, stationId: 'st-fill-1', startedAt: at(-20), waitingSince: null }),
      ],
      fill,
      T,
    );
    // waiting: by when each became ready here (the cured tray at its cure end), held last
    expect(numbers(lists.waiting)).toEqual(['W3', 'W4', 'W1', 'W2']);
    // in process: longest first, held last
    expect(numbers(lists.inProcess)).toEqual(['P3', 'P1', 'P2']);
  });

  it('lists the oven soonest ready first and announces a ready tray once, never a held one', () => {
    const lists = stationQueue(
      [
        tray('K1', { phase: 'curing', stepSeq: 2, stationId: 'st-oven', cureReadyAt: at(20), waitingSince: null }),
        tray('K2', { phase: 'curing', stepSeq: 2, stationId: 'st-oven', cureReadyAt: at(-2), waitingSince: null }),
        tray('K3', { phase: 'curing', stepSeq: 2, stationId: 'st-oven', cureReadyAt: at(-1), waitingSince: null, onHold: true }),
        tray('K4', { phase: 'curing', stepSeq: 2, stationId: 'st-oven', cureReadyAt: at(0), waitingSince: null }),
      ],
      oven,
      T,
    );
    expect(numbers(lists.curing)).toEqual(['K2', 'K4', 'K1', 'K3']);
    expect(numbers(newlyCured(lists.curing, new Set()))).toEqual(['K2', 'K4']);
    expect(numbers(newlyCured(lists.curing, new Set(['K2'])))).toEqual(['K4']);
  });
});

describe('what the operator can do about a refused scan', () => {
  it('offers the override that lifts the refusal, or none', () => {
    expect(overrideFor('curing', true)).toBe('curing');
    expect(overrideFor('wrong_station', true)).toBe('wrong_station');
    expect(overrideFor('bad_override', false)).toBe('release');
    expect(overrideFor('on_hold', false)).toBeNull();
  });
});
