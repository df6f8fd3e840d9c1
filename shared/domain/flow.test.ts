import { describe, expect, it } from 'vitest';
import { compileCalendar, type Shift } from './calendar';
import { averageWip, countPerBucket, cumulativeFlowOfItems, flowEfficiency, makeBuckets, wipOverTime, type Interval } from './flow';
import { seededRandom } from './stats';

const H = 3_600_000;
const MIN = 60_000;

const exponential = (rnd: () => number, mean: number) => -Math.log(1 - rnd()) * mean;

describe('flow efficiency (Modig & Ahlstrom 2012, This is Lean)', () => {
  it('is 3.3 % for 95 min of touch time in 6 working days of 8 h (computed)', () => {
    const fe = flowEfficiency({ processMinutes: 95, flowMinutes: 6 * 8 * 60 });
    expect(fe.flowEfficiency).toBeCloseTo(0.033, 3);
    expect(Math.round((fe.flowEfficiency as number) * 1000) / 10).toBe(3.3);
  });

  it('measures the 6 working days on the working calendar', () => {
    const day: Shift[] = [{ start: '08:00', end: '16:00' }];
    const cal = compileCalendar({ timeZone: 'UTC', week: { mon: day, tue: day, wed: day, thu: day, fri: day, sat: day, sun: [] }, daysOff: [] });
    // released Monday 08:00, shipped Saturday 16:00 of the same week: six 8-hour days
    const flow = cal.factory.workingMinutesBetween('2025-06-09T08:00:00Z', '2025-06-14T16:00:00Z');
    expect(flow).toBe(2880);
    expect(flowEfficiency({ processMinutes: 95, flowMinutes: flow }).flowEfficiency).toBeCloseTo(95 / 2880, 12);
  });

  it('reports oven cure separately, not as value-adding', () => {
    const fe = flowEfficiency({ processMinutes: 95, cureMinutes: 240, flowMinutes: 2880 });
    expect(fe.flowEfficiency).toBeCloseTo(95 / 2880, 12);
    expect(fe.cureShare).toBeCloseTo(240 / 2880, 12);
    expect(fe.withCure).toBeCloseTo(335 / 2880, 12);
    expect(flowEfficiency({ processMinutes: 0, flowMinutes: 0 }).flowEfficiency).toBeNull();
  });
});

describe('cumulative flow diagram (Reinertsen 2009 pp. 71-72; Anderson 2010 p. 25)', () => {
  // random items moving forward through 5 stages, some skipping stages, some not finished
  const rnd = seededRandom(11);
  const STAGES = 5;
  const paths = new Map<string, { stage: number; at: number }[]>();
  for (let i = 0; i < 400; i++) {
    let t = rnd() * 200 * H;
    const path: { stage: number; at: number }[] = [];
    let s = 0;
    while (s < STAGES && rnd() < 0.93) {
      path.push({ stage: s, at: t });
      t += rnd() * 30 * H;
      s += rnd() < 0.15 ? 2 : 1; // sometimes a stage is skipped
    }
    paths.set(`t${i}`, path);
  }
  const times = Array.from({ length: 120 }, (_, k) => k * 2.5 * H);
  // each item's first arrival per stage (NaN: not reached)
  const rows = [...paths.values()].map((path) => {
    const row = new Array(STAGES).fill(Number.NaN);
    for (const p of path) row[p.stage] = Number.isNaN(row[p.stage]) ? p.at : Math.min(row[p.stage], p.at);
    return row;
  });
  const cfd = cumulativeFlowOfItems(rows, STAGES, times);

  it('never lets a line fall', () => {
    for (let s = 0; s < STAGES; s++) for (let k = 1; k < times.length; k++) expect(cfd[k][s]).toBeGreaterThanOrEqual(cfd[k - 1][s]);
  });

  it('keeps the lines nested: an earlier stage is never below a later one', () => {
    for (const row of cfd) for (let s = 1; s < STAGES; s++) expect(row[s - 1]).toBeGreaterThanOrEqual(row[s]);
  });

  it('makes the vertical gap between two lines the WIP between those stages', () => {
    for (const [a, b] of [
      [0, 1],
      [1, 3],
      [0, 4],
    ]) {
      const gap = cfd.map((row) => row[a] - row[b]);
      times.forEach((t, k) => {
        // brute force: items whose furthest stage reached by t lies in [a, b)
        let wip = 0;
        for (const path of paths.values()) {
          const reached = path.filter((p) => p.at <= t).map((p) => p.stage);
          const furthest = reached.length ? Math.max(...reached) : -1;
          if (furthest >= a && furthest < b) wip++;
        }
        expect(gap[k]).toBe(wip);
      });
    }
  });

  it('shows only history: nothing before the first arrival, nothing counted ahead of time', () => {
    const c = cumulativeFlowOfItems([[Number.NaN, Number.NaN, 100]], 3, [99, 100, 101]);
    expect(c).toEqual([
      [0, 0, 0],
      [1, 1, 1],
      [1, 1, 1],
    ]);
  });
});

describe('buckets, throughput and WIP over time', () => {
  it('makes local days and Monday weeks in the factory zone', () => {
    const tz = 'Asia/Shanghai';
    const days = makeBuckets(tz, Date.parse('2025-06-13T20:00:00Z'), Date.parse('2025-06-16T03:00:00Z'), 'day');
    expect(days.map((d) => d.label)).toEqual(['2025-06-14', '2025-06-15', '2025-06-16']);
    expect(new Date(days[0].start).toISOString()).toBe('2025-06-13T16:00:00.000Z');
    const weeks = makeBuckets(tz, Date.parse('2025-06-13T20:00:00Z'), Date.parse('2025-06-24T00:00:00Z'), 'week');
    expect(weeks.map((w) => w.label)).toEqual(['2025-06-09', '2025-06-16', '2025-06-23']);
  });

  it('counts completions per bucket, each exactly once', () => {
    const b = makeBuckets('UTC', 0, 3 * 24 * H, 'day');
    const times = [0, 1, 24 * H - 1, 24 * H, 50 * H, 72 * H];
    expect(countPerBucket(times, b)).toEqual([3, 1, 1]);
  });

  it('averages WIP over time by hand: stays 0-10 h, 5-15 h and 12 h-open, now = 20 h', () => {
    const items: Interval[] = [
      { start: 0, end: 10 * H },
      { start: 5 * H, end: 15 * H },
      { start: 12 * H, end: null },
    ];
    const b = makeBuckets('UTC', 0, 24 * H, 'day');
    // (10 + 10 + 8) item-hours over 20 h = 1.4; one item left at 20 h
    expect(wipOverTime(items, b, 20 * H)).toEqual([{ average: 1.4, atEnd: 1 }]);
  });
});

describe("Little's Law, L = lambda W (Little 1961; Little & Graves 2008)", () => {
  // L from averageWip; lambda and W counted here from the items that left in the window
  function littlesLaw(items: readonly Interval[], from: number, to: number) {
    const L = averageWip(items, from, to);
    const departed = items.filter((i) => i.end !== null && i.end >= from && i.end < to);
    const lambda = departed.length / ((to - from) / MIN);
    const W = departed.length ? departed.reduce((s, i) => s + ((i.end as number) - i.start), 0) / departed.length / MIN : null;
    const implied = lambda > 0 ? L / lambda : null;
    return {
      averageWip: L,
      throughputPerMinute: lambda,
      meanFlowMinutes: W,
      relativeGap: W && implied !== null ? Math.abs(W - implied) / W : null,
      departures: departed.length,
    };
  }

  it('recovers L = 160 from lambda = 8 per month and W = 20 months (Little & Graves worked example)', () => {
    const month = 30 * 24 * H;
    const items: Interval[] = [];
    for (let t = 0; t < 200 * month; t += month / 8) items.push({ start: t, end: t + 20 * month });
    const r = littlesLaw(items, 50 * month, 150 * month);
    expect(r.averageWip).toBeCloseTo(160, 6);
    expect((r.throughputPerMinute * month) / MIN).toBeCloseTo(8, 6);
    expect(r.meanFlowMinutes).toBeCloseTo((20 * month) / MIN, 6);
    expect(r.relativeGap).toBeCloseTo(0, 9);
  });

  it('recovers the shop check: 36 trays in WIP at 12 trays a day is 3 days of flow (computed)', () => {
    const items: Interval[] = [];
    for (let t = 0; t < 60 * 24 * H; t += 2 * H) items.push({ start: t, end: t + 72 * H });
    expect(averageWip(items, 10 * 24 * H, 50 * 24 * H)).toBeCloseTo(36, 9);
  });

  // A seeded steady-state floor: Poisson arrivals (mean 10 min) through three single-server
  // stations in series with exponential service (6, 8 and 7 min).
  function simulate(seed: number, count: number) {
    const rnd = seededRandom(seed);
    const means = [6, 8, 7];
    const free = [0, 0, 0];
    const items: Interval[] = [];
    const queueAtSecond: number[] = [];
    let arrival = 0;
    for (let i = 0; i < count; i++) {
      arrival += exponential(rnd, 10);
      let t = arrival;
      means.forEach((m, s) => {
        const start = Math.max(t, free[s]);
        if (s === 1) queueAtSecond.push(start - t);
        t = start + exponential(rnd, m);
        free[s] = t;
      });
      items.push({ start: arrival * MIN, end: t * MIN });
    }
    return { items, queueAtSecond };
  }

  it('agrees within 5 % with the mean flow time on a simulated steady-state floor', () => {
    const { items } = simulate(2024, 60_000);
    const end = items[items.length - 1].start;
    const r = littlesLaw(items, 0.1 * end, 0.9 * end);
    expect(r.departures).toBeGreaterThan(40_000);
    expect(r.relativeGap).not.toBeNull();
    expect(r.relativeGap as number).toBeLessThan(0.05);
    // three M/M/1 stations in series (Jackson network): W = sum 1/(mu - lambda) = 15 + 40 + 23.33
    // = 78.33 min (textbook formula, from memory)
    expect(Math.abs((r.meanFlowMinutes as number) - 78.33) / 78.33).toBeLessThan(0.05);
  });

  it('matches the M/M/1 queue time at the 8-minute station (Kingman 1961: ca2 = cs2 = 1 gives 32 min, computed)', () => {
    // output of an M/M/1 station is Poisson (Burke's theorem), so the second station is M/M/1 too
    const { queueAtSecond } = simulate(99, 200_000);
    const steady = queueAtSecond.slice(20_000);
    const mean = steady.reduce((s, x) => s + x, 0) / steady.length;
    expect(Math.abs(mean - 32) / 32).toBeLessThan(0.1);
  });
});
