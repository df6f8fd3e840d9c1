import { describe, expect, it } from 'vitest';
import { compileCalendar, type Shift } from './calendar';
import type { FloorSnapshot, MeasuredHistory, SnapshotOrder } from './floor-history';
import { calibratedP85, DispatchWait, measureFloor, minuteOfDay, P85_WIDTH, p85Score, projectFloor, WaitDistribution } from './floor-projection';
import { seededRandom } from './stats';
import { initialTrayState, type RoutingStep } from './vocabulary';

const MIN = 60_000;
const T0 = Date.parse('2025-06-09T00:00:00Z'); // a Monday
// every kind used here works around the clock, so working minutes are plain minutes
const calendar = compileCalendar({
  timeZone: 'UTC',
  week: { mon: [], tue: [], wed: [], thu: [], fri: [], sat: [], sun: [] },
  daysOff: [],
  stations: { trim: { continuous: true }, pack: { continuous: true }, dispatch: { continuous: true } },
});
const day: Shift[] = [{ start: '08:00', end: '16:00' }];
const shifts = compileCalendar({ timeZone: 'UTC', week: { mon: day, tue: day, wed: day, thu: day, fri: day, sat: [], sun: [] }, daysOff: [], stations: {} });
const none: MeasuredHistory = { queues: [], processes: [], dispatches: [], holds: [] };
const step = (seq: number, stationKind: RoutingStep['stationKind'], minutes: number): RoutingStep => ({
  seq,
  name: stationKind,
  stationKind,
  trayMinutes: minutes,
  pieceMinutes: 0,
  cureMinutes: null,
});

function order(id: string, trays: number, routing: RoutingStep[], arrivals?: number[], dueDate = '2025-07-01'): SnapshotOrder {
  return {
    id,
    number: id,
    dueDate,
    releasedAt: T0,
    routing: { tray: routing, mould: [] },
    travellers: Array.from({ length: trays }, (_, i) => {
      const st = initialTrayState({ trayId: `${id}-${i}`, kind: 'tray', quantity: 10, releasedAt: new Date(T0).toISOString() });
      // a tray that reaches the station later: it may not start before its arrival
      return { id: `${id}-${i}`, kind: 'tray' as const, state: arrivals ? { ...st, cureReadyAt: new Date(arrivals[i]).toISOString() } : st };
    }),
  };
}

describe('finite-capacity runs against known answers', () => {
  it('one station of capacity 1, fixed 30 min, 10 trays at once: the last finishes after 300 min', () => {
    // references.md, "Known answers for a floor simulation" (computed): 10 × 30 = 300 working minutes
    const snap: FloorSnapshot = { now: T0, orders: [order('A', 10, [step(1, 'trim', 30)])], measured: none };
    const model = measureFloor(none, calendar, [{ kind: 'trim', capacityTrays: 1 }]);
    const p = projectFloor(snap, { calendar, model, runs: 20 }).get('A')!;
    expect(p.expectedAt).toBe(T0 + 300 * MIN);
    expect(p.p85At).toBe(T0 + 300 * MIN);
    // with two places the same work takes half as long; without capacity, one tray's time
    expect(projectFloor(snap, { calendar, model: measureFloor(none, calendar, [{ kind: 'trim', capacityTrays: 2 }]), runs: 5 }).get('A')!.expectedAt).toBe(
      T0 + 150 * MIN,
    );
    expect(projectFloor(snap, { calendar, model, runs: 5, capacity: false }).get('A')!.expectedAt).toBe(T0 + 30 * MIN);
  });

  it('lays the work on the shifts: 10 × 60 min from Monday 08:00 ends Tuesday 10:00', () => {
    // hand-worked: 8 h on Monday (08:00–16:00), the last 2 h on Tuesday from 08:00
    const snap: FloorSnapshot = { now: T0 + 8 * 60 * MIN, orders: [order('B', 10, [step(1, 'trim', 60)])], measured: none };
    const model = measureFloor(none, shifts, [{ kind: 'trim', capacityTrays: 1 }]);
    expect(projectFloor(snap, { calendar: shifts, model, runs: 3 }).get('B')!.expectedAt).toBe(Date.parse('2025-06-10T10:00:00Z'));
  });

  it('an M/M/1 queue: mean wait Wq = ρ/(μ − λ) = 32 min for arrivals every 10 min and service 8 min', () => {
    // Kingman (1961) / references.md (computed): λ = 0.1/min, μ = 0.125/min, ρ = 0.8 → Wq = 32 min,
    // time in the system W = Wq + 1/μ = 40 min; Little (1961): L = λW = 4 trays on average.
    const rnd = seededRandom(2025);
    const n = 40_000;
    const arrivals: number[] = [];
    let t = T0;
    for (let i = 0; i < n; i++) {
      t += -Math.log(1 - rnd()) * 10 * MIN;
      arrivals.push(Math.round(t));
    }
    // exponential service with mean 8 min: measured process times of 8-minute standard steps,
    // given as the ratio measured ÷ standard at 4,000 evenly spaced exponential quantiles
    const processes = Array.from({ length: 4000 }, (_, i) => {
      const minutes = -Math.log(1 - (i + 0.5) / 4000) * 8;
      return {
        stationKind: 'trim',
        stationId: null,
        startedAt: T0 - 10 * 86_400_000 + i * 1000,
        finishedAt: T0 - 10 * 86_400_000 + i * 1000 + minutes * MIN,
        standardMinutes: 8,
      };
    });
    const model = measureFloor({ ...none, processes }, calendar, [{ kind: 'trim', capacityTrays: 1 }], { perKind: 4000 });
    // one tray per order, all due the same day: a freed place goes to the one that asked first
    const orders = arrivals.map((a, i) => order(`q${i}`, 1, [step(1, 'trim', 8)], [a]));
    const out = projectFloor({ now: T0, orders, measured: none }, { calendar, model, runs: 1 });
    let sum = 0;
    orders.forEach((o, i) => (sum += out.get(o.id)!.expectedAt! - arrivals[i]));
    const W = sum / n / MIN;
    const Wq = W - 8;
    expect(Math.abs(Wq - 32) / 32).toBeLessThan(0.05);
  });
});

describe('waits drawn from history', () => {
  it('gives a tray that has waited past every sample a tail, not zero', () => {
    const d = new WaitDistribution(Array.from({ length: 20 }, (_, i) => i + 1));
    // mean excess of the 10 longest (11..20, mean 15.5) over the 10th longest below them (10) = 5.5
    expect(d.tailMean).toBeCloseTo(5.5, 10);
    expect(d.meanRemaining(100)).toBeCloseTo(5.5, 10);
    expect(d.drawRemaining(100, 0.5)).toBeGreaterThan(0);
    // below the tail: the measured waits longer than what was waited, minus it (mean of 6..20 − 5 = 8)
    expect(d.meanRemaining(5)).toBeCloseTo(8, 10);
  });

  it('counts the dispatch wait once per order, from its last packed tray', () => {
    // two trays pack 30 min each on one packer (finish 30 and 60); dispatch waits 120 min measured
    // once per order → ship at 60 + 120 + 5 = 185 min, however many trays the order has
    const dispatches = Array.from({ length: 12 }, (_, i) => ({
      orderId: `old${i}`,
      lastPackedAt: T0 - 86_400_000 + i * 1000,
      startedAt: T0 - 86_400_000 + i * 1000 + 120 * MIN,
    }));
    const model = measureFloor({ ...none, dispatches }, calendar, [{ kind: 'pack', capacityTrays: 1 }]);
    const snap: FloorSnapshot = { now: T0, orders: [order('D', 2, [step(1, 'pack', 30), step(2, 'dispatch', 5)])], measured: none };
    expect(projectFloor(snap, { calendar, model, runs: 10 }).get('D')!.expectedAt).toBe(T0 + 185 * MIN);
  });

  it('takes a big order through the dispatch places in rounds', () => {
    // as above, but one dispatch place and 5 min a tray: the three trays leave at 180 min and
    // go one after another → the last is done at 180 + 3 × 5 = 195 min (hand-worked)
    const dispatches = Array.from({ length: 12 }, (_, i) => ({
      orderId: `old${i}`,
      lastPackedAt: T0 - 86_400_000 + i * 1000,
      startedAt: T0 - 86_400_000 + i * 1000 + 120 * MIN,
    }));
    const model = measureFloor({ ...none, dispatches }, calendar, [
      { kind: 'pack', capacityTrays: 3 },
      { kind: 'dispatch', capacityTrays: 1 },
    ]);
    const snap: FloorSnapshot = { now: T0, orders: [order('D', 3, [step(1, 'pack', 60), step(2, 'dispatch', 5)])], measured: none };
    expect(projectFloor(snap, { calendar, model, runs: 10 }).get('D')!.expectedAt).toBe(T0 + 195 * MIN);
  });

  describe('the dispatch wait by the time of day the order was packed', () => {
    // A courier who collects at 16:30 (common practice: carriers collect at set times). 48
    // orders packed every 20 min from 08:00 to 23:40 on the day before T0 (UTC, plain minutes
    // on this calendar): one packed before 16:30 waits until 16:30 the same day, one packed
    // after it until 16:30 the next day.
    const dayBefore = T0 - 86_400_000;
    const collect = (packed: number) => {
      const sameDay = dayBefore + (16 * 60 + 30) * MIN;
      return packed <= sameDay ? sameDay : sameDay + 86_400_000;
    };
    const samples = Array.from({ length: 48 }, (_, i) => {
      const packed = dayBefore + (8 * 60 + i * 20) * MIN;
      return { minuteOfDay: minuteOfDay('UTC', packed), wait: (collect(packed) - packed) / MIN };
    });
    const d = new DispatchWait(samples);

    it('draws from the orders packed nearest in time of day', () => {
      // packed at 10:00: the neighbours (k = max(5, 48 / 10) = 5: 9:20 to 10:40) waited 350 to
      // 430 min; the true wait is 390 min
      for (const u of [0, 0.5, 0.99]) {
        expect(d.drawRemaining(10 * 60, 0, u)).toBeGreaterThanOrEqual(350);
        expect(d.drawRemaining(10 * 60, 0, u)).toBeLessThanOrEqual(430);
      }
      // packed at 20:00: the neighbours waited until the next afternoon (1,190 to 1,270 min)
      expect(d.drawRemaining(20 * 60, 0, 0.5)).toBeGreaterThan(1100);
    });

    it('gives an order packed after the collection, and already waiting, the next collection', () => {
      // packed at 17:20, waited 400 min: only orders that waited longer count (those packed
      // after 16:30); the rest is about 1,390 − 400 = 990 min, never a few minutes
      const left = [0.01, 0.5, 0.99].map((u) => d.drawRemaining(17 * 60 + 20, 400, u));
      for (const x of left) expect(x).toBeGreaterThan(800);
    });

    it('is the local time of day in the factory zone', () => {
      // 2025-06-09 00:30 UTC is 08:30 in Shanghai (UTC+8, no daylight saving)
      expect(minuteOfDay('Asia/Shanghai', T0 + 30 * MIN)).toBe(8 * 60 + 30);
    });
  });

  it('is repeatable, and a second order competing for the places moves the first no earlier', () => {
    const model = measureFloor(none, calendar, [{ kind: 'trim', capacityTrays: 1 }]);
    const a = order('A', 4, [step(1, 'trim', 30)], undefined, '2025-06-20');
    const alone = projectFloor({ now: T0, orders: [a], measured: none }, { calendar, model, runs: 10 });
    expect(projectFloor({ now: T0, orders: [a], measured: none }, { calendar, model, runs: 10 })).toEqual(alone);
    // the newcomer is due earlier, so it goes first and A waits behind its 5 trays
    const both = projectFloor(
      { now: T0, orders: [a, order('N', 5, [step(1, 'trim', 30)], undefined, '2025-06-12')], measured: none },
      { calendar, model, runs: 10 },
    );
    expect(both.get('A')!.expectedAt).toBe(T0 + 270 * MIN);
    expect(both.get('A')!.p85At!).toBeGreaterThanOrEqual(alone.get('A')!.p85At!);
  });
});

describe('places per kind', () => {
  // ten steps of an oven kind, all under way together; only three were scanned out of the oven
  // (the others went straight on to their next step, closing the cure without a finish)
  const t = (i: number) => T0 - 86_400_000 + i * MIN;
  const queues = Array.from({ length: 10 }, (_, i) => ({
    stationKind: 'trim',
    travellerKind: 'tray' as const,
    orderId: `q${i}`,
    stationId: null,
    readyAt: t(i),
    startedAt: t(i),
    lead: true,
  }));
  const processes = (n: number) =>
    Array.from({ length: n }, (_, i) => ({ stationKind: 'trim', stationId: null, startedAt: t(i), finishedAt: t(i) + 60 * MIN, standardMinutes: 60 }));

  it('reads a crew limit from the steps under way at once when the steps were scanned out', () => {
    // ten measured steps under way together at most → min(12 places, 10) = 10
    expect(measureFloor({ ...none, queues, processes: processes(10) }, calendar, [{ kind: 'trim', capacityTrays: 12 }]).places.get('trim')).toBe(10);
  });

  it('keeps the stations’ places when most steps were closed without a finish scan', () => {
    // 3 of 10 scanned out (under the 80 % share): the three say nothing about the others' places
    expect(measureFloor({ ...none, queues, processes: processes(3) }, calendar, [{ kind: 'trim', capacityTrays: 12 }]).places.get('trim')).toBe(12);
  });
});

describe("the floor's day-to-day pace", () => {
  // 12 days, 10 handovers a day at a station with room to spare: 20 min on even days, 40 on odd
  const queues = Array.from({ length: 120 }, (_, i) => {
    const d = Math.floor(i / 10);
    const readyAt = T0 - 20 * 86_400_000 + d * 86_400_000 + (i % 10) * 30 * MIN;
    return {
      stationKind: 'trim',
      travellerKind: 'tray' as const,
      orderId: `p${i}`,
      stationId: null,
      readyAt,
      startedAt: readyAt + (d % 2 ? 40 : 20) * MIN,
      lead: true,
    };
  });
  const model = measureFloor({ ...none, queues }, calendar, [{ kind: 'trim', capacityTrays: 50 }]);

  it('is each day’s mean handover over the mean of the days (20 and 40 min → 2/3 and 4/3)', () => {
    // hand-worked: mean of the day means = 30 min; 20/30 and 40/30, six days each
    expect(model.pace).toHaveLength(12);
    expect(model.pace[0]).toBeCloseTo(2 / 3, 10);
    expect(model.pace[11]).toBeCloseTo(4 / 3, 10);
    expect(measureFloor({ ...none, queues: queues.slice(0, 50) }, calendar, [{ kind: 'trim', capacityTrays: 50 }]).pace).toHaveLength(0);
  });

  it('spreads the runs without moving their mean much', () => {
    const snap: FloorSnapshot = { now: T0, orders: [order('P', 1, [step(1, 'trim', 10), step(2, 'trim', 10)])], measured: none };
    const flat = projectFloor(snap, { calendar, model, runs: 400, pace: false }).get('P')!;
    const paced = projectFloor(snap, { calendar, model, runs: 400 }).get('P')!;
    expect(paced.p85At! - paced.expectedAt!).toBeGreaterThan(flat.p85At! - flat.expectedAt!);
    expect(Math.abs(paced.expectedAt! - flat.expectedAt!)).toBeLessThan(5 * MIN);
  });
});

describe('the conformal width of the 85 % date', () => {
  const HOUR = 60 * MIN;
  const FRI = T0 + 4 * 86_400_000; // shifts: Monday to Friday, 08:00–16:00 UTC
  const MON = T0 + 7 * 86_400_000;

  it('widens the runs’ spread in working time, over the weekend (hand-worked)', () => {
    // expected Fri 14:00, runs' 85th percentile Fri 15:00: 60 working minutes of spread;
    // × 2.5 = 150 min: 120 on Friday to 16:00, the last 30 on Monday → Mon 08:30
    expect(calibratedP85(shifts.factory, FRI + 14 * HOUR, FRI + 15 * HOUR, 2.5)).toBe(MON + 8.5 * HOUR);
    expect(p85Score(shifts.factory, FRI + 14 * HOUR, FRI + 15 * HOUR, MON + 8.5 * HOUR)).toBe(2.5);
    // an order shipped early scores below zero; shipped on Friday at 14:30, half the spread
    expect(p85Score(shifts.factory, FRI + 14 * HOUR, FRI + 15 * HOUR, FRI + 13 * HOUR)).toBe(-1);
    expect(p85Score(shifts.factory, FRI + 14 * HOUR, FRI + 15 * HOUR, FRI + 14.5 * HOUR)).toBe(0.5);
  });

  it('keeps the expected date when every run ends at the same time', () => {
    expect(calibratedP85(shifts.factory, FRI + 14 * HOUR, FRI + 14 * HOUR, 2)).toBe(FRI + 14 * HOUR);
  });

  it('uses the just-released factor for a new order and the under-way one later, and leaves the expected date alone', () => {
    const queues = Array.from({ length: 60 }, (_, i) => {
      const readyAt = T0 - 20 * 86_400_000 + Math.floor(i / 5) * 86_400_000 + 9 * HOUR + (i % 5) * 30 * MIN;
      return {
        stationKind: 'trim',
        travellerKind: 'tray' as const,
        orderId: `q${i}`,
        stationId: null,
        readyAt,
        startedAt: readyAt + (10 + (i % 7) * 15) * MIN,
        lead: true,
      };
    });
    const model = measureFloor({ ...none, queues }, shifts, [{ kind: 'trim', capacityTrays: 50 }]);
    const width = { justReleasedHours: 8, justReleased: 2, underWay: 1.5 };
    for (const [now, factor] of [
      [T0 + 7 * HOUR, 2], // released at 00:00: 7 h ago, just released
      [T0 + 17 * HOUR + 30 * MIN, 1.5], // 17.5 h ago: under way
    ] as const) {
      const snap: FloorSnapshot = { now, orders: [order('W', 1, [step(1, 'trim', 30), step(2, 'trim', 30), step(3, 'trim', 30)])], measured: none };
      const raw = projectFloor(snap, { calendar: shifts, model, runs: 200, p85Width: null }).get('W')!;
      const wide = projectFloor(snap, { calendar: shifts, model, runs: 200, p85Width: width }).get('W')!;
      expect(wide.expectedAt).toBe(raw.expectedAt);
      expect(raw.p85At!).toBeGreaterThan(raw.expectedAt!);
      expect(wide.p85At).toBe(Math.round(calibratedP85(shifts.factory, raw.expectedAt!, raw.p85At!, factor)));
      expect(wide.p85At!).toBeGreaterThan(raw.p85At!);
    }
    // the kept factors widen, never narrow, the runs' own 85th percentile
    expect(P85_WIDTH.justReleased).toBeGreaterThanOrEqual(1);
    expect(P85_WIDTH.underWay).toBeGreaterThanOrEqual(1);
  });
});
