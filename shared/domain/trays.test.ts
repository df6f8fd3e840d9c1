import { describe, expect, it } from 'vitest';
import {
  canMerge,
  childTrayNumber,
  mouldNumber,
  releasedQuantity,
  splitIntoTrays,
  splitTray,
  trayNumber,
  TRAY_NUMBER_PATTERN,
  type MergeCandidate,
} from './trays';
import { expandRouting, DEFAULT_ROUTING_TEMPLATES } from './routing';
import { initialTrayState, type TrayState } from './vocabulary';
import { seededRandom } from './stats';

describe('releasedQuantity: quantity + overrun, rounded up', () => {
  it('adds the usual 5 % overrun (common practice)', () => {
    expect(releasedQuantity(1000, 5)).toBe(1050);
    expect(releasedQuantity(100, 5)).toBe(105);
  });
  it('rounds a part piece up', () => {
    // 333 × 5 % = 16.65 → 17 extra
    expect(releasedQuantity(333, 5)).toBe(350);
    // 7 × 1.1 % = 0.077 → 1 extra, not thrown off by float noise
    expect(releasedQuantity(7, 1.1)).toBe(8);
    // 300 × 0.1 % = 0.3 → 1; 1000 × 0.7 % = 7 exactly → 7 (0.7 × 1000 is not exact in binary)
    expect(releasedQuantity(300, 0.1)).toBe(301);
    expect(releasedQuantity(1000, 0.7)).toBe(1007);
  });
  it('no overrun, no extra pieces', () => {
    expect(releasedQuantity(250, 0)).toBe(250);
  });
  it('agrees with exact integer arithmetic for whole percentages', () => {
    const r = seededRandom(7);
    for (let k = 0; k < 2000; k++) {
      const q = 1 + Math.floor(r() * 50_000);
      const p = Math.floor(r() * 11);
      // ceil(q·p/100) in integers: (q·p + 99) div 100
      expect(releasedQuantity(q, p)).toBe(q + Math.floor((q * p + 99) / 100));
    }
  });
  it('refuses nonsense', () => {
    expect(() => releasedQuantity(0, 5)).toThrow();
    expect(() => releasedQuantity(10.5, 5)).toThrow();
    expect(() => releasedQuantity(10, -1)).toThrow();
  });
});

describe('splitIntoTrays: trays of the chosen size, the last takes the remainder', () => {
  it('1050 pieces in trays of 100: ten full trays and one of 50', () => {
    expect(splitIntoTrays(1050, 100)).toEqual([...Array(10).fill(100), 50]);
  });
  it('an exact multiple has no short tray', () => {
    expect(splitIntoTrays(400, 100)).toEqual([100, 100, 100, 100]);
  });
  it('fewer pieces than a tray: one tray', () => {
    expect(splitIntoTrays(42, 100)).toEqual([42]);
  });
  it('conserves pieces for any quantity and tray size', () => {
    const r = seededRandom(42);
    for (let k = 0; k < 2000; k++) {
      const total = 1 + Math.floor(r() * 20_000);
      const size = 1 + Math.floor(r() * 600);
      const trays = splitIntoTrays(total, size);
      expect(trays.reduce((a, b) => a + b, 0)).toBe(total);
      expect(trays).toHaveLength(Math.ceil(total / size));
      expect(trays.slice(0, -1).every((q) => q === size)).toBe(true);
      const last = trays[trays.length - 1];
      expect(last).toBeGreaterThanOrEqual(1);
      expect(last).toBeLessThanOrEqual(size);
      expect(last).toBe(total % size === 0 ? size : total % size);
    }
  });
  it('refuses a tray size of 0 or a fraction', () => {
    expect(() => splitIntoTrays(100, 0)).toThrow();
    expect(() => splitIntoTrays(100, 2.5)).toThrow();
  });
});

describe('tray numbers', () => {
  it('are printable and fit the QR alphanumeric set', () => {
    for (const n of [trayNumber('1042', 3), mouldNumber('1042', 'back'), childTrayNumber(trayNumber('1042', 11), 2)]) {
      expect(n).toMatch(TRAY_NUMBER_PATTERN);
    }
    expect(trayNumber('1042', 3)).toBe('1042-03');
    expect(childTrayNumber('1042-03', 1)).toBe('1042-03.1');
  });
});

const waiting = (quantity: number, over: Partial<TrayState> = {}): TrayState => ({
  ...initialTrayState({ trayId: 't1', kind: 'tray', quantity, releasedAt: '2026-03-02T08:00:00Z' }),
  ...over,
});

describe('splitTray: pieces are conserved', () => {
  it('takes parts off and leaves the rest', () => {
    const r = splitTray(waiting(100), [20, 5]);
    expect(r).toEqual({ ok: true, remaining: 75, parts: [20, 5] });
  });
  it('conserves pieces for random splits', () => {
    const r = seededRandom(3);
    for (let k = 0; k < 500; k++) {
      const q = 2 + Math.floor(r() * 500);
      const parts = [1 + Math.floor(r() * (q - 1))];
      const res = splitTray(waiting(q), parts);
      expect(res.ok).toBe(true);
      if (res.ok) expect(res.remaining + res.parts.reduce((a, b) => a + b, 0)).toBe(q);
    }
  });
  it('refuses to empty the tray, zero or part pieces, a busy or held tray', () => {
    expect(splitTray(waiting(10), [10])).toMatchObject({ ok: false, code: 'nothing_left' });
    expect(splitTray(waiting(10), [6, 6])).toMatchObject({ ok: false, code: 'nothing_left' });
    expect(splitTray(waiting(10), [0])).toMatchObject({ ok: false, code: 'bad_quantity' });
    expect(splitTray(waiting(10), [1.5])).toMatchObject({ ok: false, code: 'bad_quantity' });
    expect(splitTray(waiting(10), [])).toMatchObject({ ok: false, code: 'bad_quantity' });
    expect(splitTray(waiting(10, { phase: 'in_process' }), [2])).toMatchObject({ ok: false, code: 'not_waiting' });
    expect(splitTray(waiting(10, { phase: 'curing' }), [2])).toMatchObject({ ok: false, code: 'not_waiting' });
    expect(splitTray(waiting(10, { onHold: true }), [2])).toMatchObject({ ok: false, code: 'on_hold' });
  });
});

describe('canMerge: same order, same next step', () => {
  const routing = expandRouting(DEFAULT_ROUTING_TEMPLATES.hard_enamel, {
    process: 'hard_enamel',
    colours: [{}, {}],
    backLogo: false,
    printing: false,
    epoxy: false,
    backing: { type: 'butterfly_clutch', count: 1 },
    plating: 'gold',
    secondPlating: null,
    sandblast: false,
  });
  const cand = (id: string, q: number, over: Partial<TrayState> = {}, orderId = 'o1'): MergeCandidate => ({
    orderId,
    routing,
    state: waiting(q, { trayId: id, stepSeq: 14, ...over }),
  });

  it('merges and adds the pieces', () => {
    const r = canMerge([cand('a', 100, { waitingSince: '2026-03-03T10:00:00Z' }), cand('b', 45, { waitingSince: '2026-03-03T09:00:00Z' })]);
    expect(r).toMatchObject({ ok: true, quantity: 145, waitingSince: '2026-03-03T09:00:00Z' });
  });
  it('the merged tray waits for the later cure', () => {
    const r = canMerge([cand('a', 10, { cureReadyAt: '2026-03-03T12:00:00Z' }), cand('b', 10, { cureReadyAt: '2026-03-03T13:30:00Z' })]);
    expect(r).toMatchObject({ ok: true, cureReadyAt: '2026-03-03T13:30:00Z' });
  });
  it('refuses other orders, other steps, busy, held, moulds, a single tray', () => {
    expect(canMerge([cand('a', 1)])).toMatchObject({ code: 'too_few' });
    expect(canMerge([cand('a', 1), cand('b', 1, {}, 'o2')])).toMatchObject({ code: 'different_orders' });
    expect(canMerge([cand('a', 1), cand('b', 1, { stepSeq: 15 })])).toMatchObject({ code: 'different_next_step' });
    expect(canMerge([cand('a', 1), cand('b', 1, { phase: 'in_process' })])).toMatchObject({ code: 'not_waiting' });
    expect(canMerge([cand('a', 1), cand('b', 1, { onHold: true })])).toMatchObject({ code: 'on_hold' });
    expect(canMerge([cand('a', 1), cand('b', 1, { kind: 'mould' })])).toMatchObject({ code: 'not_trays' });
  });
  it('refuses when the steps after the next one differ (a split sent to another finish)', () => {
    const other = routing.map((s) => (s.stationKind === 'plate' ? { ...s, name: 'Plate black nickel' } : s));
    const b: MergeCandidate = { ...cand('b', 5), routing: other };
    const plateSeq = routing.find((s) => s.stationKind === 'plate')!.seq;
    expect(canMerge([cand('a', 5, { stepSeq: plateSeq - 1 }), { ...b, state: { ...b.state, stepSeq: plateSeq - 1 } }])).toMatchObject({
      code: 'different_next_step',
    });
    // past the differing step, they may merge
    expect(canMerge([cand('a', 5), b])).toMatchObject({ ok: true, quantity: 10 });
  });
});
