import { describe, expect, it } from 'vitest';
import { compileCalendar, type Shift } from './calendar';
import { projectTrays, type TrayOutlook } from './projection';

// Hand-worked cases on a UTC factory working Mon-Fri 08:00-16:00; the oven cures around the clock.
// 2025-06-09 is a Monday.
const day: Shift[] = [{ start: '08:00', end: '16:00' }];
const calendar = compileCalendar({
  timeZone: 'UTC',
  week: { mon: day, tue: day, wed: day, thu: day, fri: day, sat: [], sun: [] },
  daysOff: [],
  stations: { cure: { continuous: true } },
});
const at = (s: string) => Date.parse(`${s}:00Z`);
const iso = (ms: number | null) => (ms === null ? null : new Date(ms).toISOString().slice(0, 16));

describe('projected finish (hand-worked)', () => {
  it('adds queue and standard times step by step within a day', () => {
    // queue trim 120 -> 10:00, trim 60 -> 11:00, queue pack 60 -> 12:00, pack 30 -> 12:30
    const tray: TrayOutlook = {
      trayId: 'a',
      phase: 'waiting',
      waitingSince: at('2025-06-09T08:00'),
      steps: [
        { seq: 1, stationKind: 'trim', standardMinutes: 60 },
        { seq: 2, stationKind: 'pack', standardMinutes: 30 },
      ],
    };
    const p = projectTrays([tray], {
      now: at('2025-06-09T08:00'),
      calendar,
      queueSamples: { trim: [120, 120, 120, 120, 120], pack: [60, 60, 60, 60, 60] },
    });
    expect(iso(p.expectedAt)).toBe('2025-06-09T12:30');
    expect(iso(p.p85At)).toBe('2025-06-09T12:30'); // no spread in the samples
    expect(p).toMatchObject({ remainingSteps: 2, standardMinutes: 90, queueMinutes: 180, cureMinutes: 0, criticalTrayId: 'a' });
  });

  it('cures through the evening and resumes next morning', () => {
    // fill 14:00-15:00; queue at oven 30 (continuous) -> 15:30; cure 180 -> 18:30;
    // stone queue 60 working min from 18:30 -> Tue 09:00; stone 90 -> Tue 10:30
    const tray: TrayOutlook = {
      trayId: 'b',
      phase: 'waiting',
      waitingSince: at('2025-06-09T14:00'),
      steps: [
        { seq: 3, stationKind: 'fill', standardMinutes: 60 },
        { seq: 4, stationKind: 'cure', standardMinutes: 10, cureMinutes: 180 },
        { seq: 5, stationKind: 'stone', standardMinutes: 90 },
      ],
    };
    const samples = { fill: [0, 0, 0, 0, 0], cure: [30, 30, 30, 30, 30], stone: [60, 60, 60, 60, 60] };
    const p = projectTrays([tray], { now: at('2025-06-09T14:00'), calendar, queueSamples: samples });
    expect(iso(p.expectedAt)).toBe('2025-06-10T10:30');
    expect(p.cureMinutes).toBe(180);
  });

  it('finishes the rest of a step in process, across the night', () => {
    // started 15:00 on a 120-min step, now 15:30: 90 left = 30 today + 60 from Tue 08:00 -> Tue 09:00
    const tray: TrayOutlook = {
      trayId: 'c',
      phase: 'in_process',
      startedAt: at('2025-06-09T15:00'),
      steps: [{ seq: 7, stationKind: 'polish', standardMinutes: 120 }],
    };
    const p = projectTrays([tray], { now: at('2025-06-09T15:30'), calendar, queueSamples: {} });
    expect(iso(p.expectedAt)).toBe('2025-06-10T09:00');
    expect(p.standardMinutes).toBe(90);
    expect(p.queueMinutes).toBe(0);
  });

  it('waits out a running cure before the next step', () => {
    // curing since 13:00 for 240 min -> ready 17:00; next step queue 0, 30 min -> Tue 08:30
    const tray: TrayOutlook = {
      trayId: 'd',
      phase: 'curing',
      startedAt: at('2025-06-09T13:00'),
      steps: [
        { seq: 4, stationKind: 'cure', standardMinutes: 5, cureMinutes: 240 },
        { seq: 5, stationKind: 'fill', standardMinutes: 30 },
      ],
    };
    const p = projectTrays([tray], { now: at('2025-06-09T14:00'), calendar, queueSamples: { fill: [0, 0, 0, 0, 0] } });
    expect(iso(p.expectedAt)).toBe('2025-06-10T08:30');
    expect(p.cureMinutes).toBe(180); // what is left of it
  });

  it('only counts the rest of a queue for a tray that has already waited', () => {
    // samples 30, 90, 150; waited 60 -> remaining 30 or 90, mean 60 -> start 11:00, 30 min -> 11:30
    const tray: TrayOutlook = {
      trayId: 'e',
      phase: 'waiting',
      waitingSince: at('2025-06-09T09:00'),
      steps: [{ seq: 2, stationKind: 'plate', standardMinutes: 30 }],
    };
    const p = projectTrays([tray], { now: at('2025-06-09T10:00'), calendar, queueSamples: { plate: [30, 90, 150] }, minSamples: 1 });
    expect(p.queueMinutes).toBe(60);
    expect(iso(p.expectedAt)).toBe('2025-06-09T11:30');
    // sampled runs: start at 10:30 or 11:30 -> finish 11:00 or 12:00, each half the time
    expect(iso(p.p85At)).toBe('2025-06-09T12:00');
  });

  it('respects a cure that is not over yet for a waiting tray', () => {
    const tray: TrayOutlook = {
      trayId: 'f',
      phase: 'waiting',
      waitingSince: at('2025-06-09T09:00'),
      cureReadyAt: at('2025-06-09T12:00'),
      steps: [{ seq: 6, stationKind: 'fill', standardMinutes: 30 }],
    };
    const p = projectTrays([tray], { now: at('2025-06-09T09:00'), calendar, queueSamples: { fill: [0, 0, 0, 0, 0] } });
    expect(iso(p.expectedAt)).toBe('2025-06-09T12:30');
  });
});

describe('order projection by sampling', () => {
  // two trays, one pack step of 60 min; the measured pack queue is either 0 or 480 working min
  // (a full day) with equal chance. The order ships when the later tray does: both short with
  // probability 1/4, so its 85th percentile is the long case. Expected (mean 240) -> 13:00.
  const trays: TrayOutlook[] = ['t1', 't2'].map((id) => ({
    trayId: id,
    phase: 'waiting' as const,
    waitingSince: at('2025-06-09T08:00'),
    steps: [{ seq: 9, stationKind: 'pack', standardMinutes: 60 }],
  }));
  const samples = { pack: [0, 480, 0, 480, 0, 480] };
  const opts = { now: at('2025-06-09T08:00'), calendar, queueSamples: samples, runs: 400, seed: 5 };

  it('gives the expected date from mean queues and the 85th percentile from the sampled runs', () => {
    const p = projectTrays(trays, opts);
    expect(iso(p.expectedAt)).toBe('2025-06-09T13:00');
    // long case: queue 480 -> Tue 08:00, pack 60 -> Tue 09:00
    expect(iso(p.p85At)).toBe('2025-06-10T09:00');
    expect(p.runs).toBe(400);
  });

  it('is repeatable for a seed', () => {
    expect(projectTrays(trays, opts)).toEqual(projectTrays(trays, opts));
  });

  it('with one tray the long case has probability 1/2, so the 85th percentile is still long', () => {
    expect(iso(projectTrays([trays[0]], opts).p85At)).toBe('2025-06-10T09:00');
  });

  it('falls back to pooled samples, then to the default queue time', () => {
    const one: TrayOutlook = { ...trays[0], steps: [{ seq: 9, stationKind: 'bag', standardMinutes: 60 }] };
    // bag has no samples: pooled pack samples, mean 240 -> 13:00
    expect(iso(projectTrays([one], opts).expectedAt)).toBe('2025-06-09T13:00');
    // no history at all: default 45 min -> 08:45 + 60 -> 09:45
    expect(iso(projectTrays([one], { ...opts, queueSamples: {}, defaultQueueMinutes: 45 }).expectedAt)).toBe('2025-06-09T09:45');
  });

  it('uses the finish of trays that are done and counts trays on hold', () => {
    const done: TrayOutlook = { trayId: 'x', phase: 'done', steps: [], finishedAt: at('2025-06-11T10:00') };
    const p = projectTrays([done, { ...trays[0], onHold: true }], opts);
    expect(iso(p.expectedAt)).toBe('2025-06-11T10:00');
    expect(iso(p.p85At)).toBe('2025-06-11T10:00');
    expect(p.traysOnHold).toBe(1);
    expect(projectTrays([], opts).expectedAt).toBeNull();
  });
});
