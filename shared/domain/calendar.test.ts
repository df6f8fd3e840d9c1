import { describe, expect, it } from 'vitest';
import { compileCalendar, validateCalendar, type CalendarConfig, type Shift } from './calendar';

// Hand-worked examples. The factory is in Asia/Shanghai (UTC+8 all year, no daylight saving),
// so local 08:00 is 00:00Z. Week: Mon-Fri 08:00-12:00 and 13:00-17:00, Sat 08:00-12:00, Sun off;
// Wednesday 2025-06-18 is a day off. Ovens cure around the clock; plating runs a night shift.
const day: Shift[] = [
  { start: '08:00', end: '12:00' },
  { start: '13:00', end: '17:00' },
];
const night: Shift[] = [{ start: '22:00', end: '06:00' }];
const CONFIG: CalendarConfig = {
  timeZone: 'Asia/Shanghai',
  week: { mon: day, tue: day, wed: day, thu: day, fri: day, sat: [{ start: '08:00', end: '12:00' }], sun: [] },
  daysOff: ['2025-06-18'],
  stations: {
    cure: { continuous: true },
    plate: { week: { mon: night, tue: night, wed: night, thu: night, fri: night, sat: [], sun: [] } },
    'station-7': { daysOff: ['2025-06-19'] },
  },
};
const cal = compileCalendar(CONFIG);
const local = (s: string) => Date.parse(`${s}+08:00`);

describe('working minutes between two instants (hand-worked)', () => {
  it('across a night: Tue 16:00 -> Wed 09:30 is 60 + 90 = 150 min', () => {
    expect(cal.factory.workingMinutesBetween(local('2025-06-10T16:00'), local('2025-06-11T09:30'))).toBe(150);
  });

  it('across a weekend: Fri 15:00 -> Mon 10:00 is 120 + 240 (Sat) + 0 (Sun) + 120 = 480 min', () => {
    expect(cal.factory.workingMinutesBetween(local('2025-06-13T15:00'), local('2025-06-16T10:00'))).toBe(480);
  });

  it('across a day off: Tue 11:00 -> Thu 14:00 is 300 + 0 (Wed off) + 300 = 600 min', () => {
    expect(cal.factory.workingMinutesBetween(local('2025-06-17T11:00'), local('2025-06-19T14:00'))).toBe(600);
  });

  it('skips the lunch break and counts nothing outside shifts', () => {
    expect(cal.factory.workingMinutesBetween(local('2025-06-10T11:30'), local('2025-06-10T13:30'))).toBe(60);
    expect(cal.factory.workingMinutesBetween(local('2025-06-10T18:00'), local('2025-06-11T07:59'))).toBe(0);
    expect(cal.factory.workingMinutesBetween(local('2025-06-15T00:00'), local('2025-06-16T00:00'))).toBe(0); // Sunday
  });

  it('is negative when the interval runs backwards', () => {
    expect(cal.factory.workingMinutesBetween(local('2025-06-11T09:30'), local('2025-06-10T16:00'))).toBe(-150);
  });

  it('lets the oven cure through the night and on days off: Tue 11:00 -> Thu 14:00 is 51 h', () => {
    expect(cal.forStation('cure').workingMinutesBetween(local('2025-06-17T11:00'), local('2025-06-19T14:00'))).toBe(51 * 60);
  });

  it('counts a night shift that runs past midnight on the day it starts', () => {
    const plate = cal.forStation('plate');
    // Mon 23:00 -> Tue 07:00: 23:00-06:00 = 420 min
    expect(plate.workingMinutesBetween(local('2025-06-09T23:00'), local('2025-06-10T07:00'))).toBe(420);
    // Friday's night shift ends Saturday 06:00; there is none on Saturday night
    expect(plate.isWorking(local('2025-06-14T05:00'))).toBe(true);
    expect(plate.isWorking(local('2025-06-14T23:00'))).toBe(false);
    // Wednesday 2025-06-18 is a factory day off: no night shift starting that evening
    expect(plate.workingMinutesBetween(local('2025-06-18T12:00'), local('2025-06-19T12:00'))).toBe(0);
  });

  it('picks a station exception by id before kind and adds its own days off', () => {
    const t = cal.forStation('station-7', 'fill');
    expect(t.workingMinutesBetween(local('2025-06-19T00:00'), local('2025-06-20T00:00'))).toBe(0);
    expect(cal.forStation('other-id', 'fill').workingMinutesBetween(local('2025-06-19T00:00'), local('2025-06-20T00:00'))).toBe(480);
    expect(cal.forStation(null, 'cure').continuous).toBe(true);
  });

  it('does not count overlapping shifts twice', () => {
    const both: Shift[] = [
      { start: '06:00', end: '14:00' },
      { start: '12:00', end: '20:00' },
    ];
    const c = compileCalendar({ timeZone: 'UTC', week: { mon: both, tue: both, wed: both, thu: both, fri: both, sat: [], sun: [] }, daysOff: [] });
    expect(c.factory.workingMinutesBetween('2025-06-09T00:00:00Z', '2025-06-10T00:00:00Z')).toBe(14 * 60);
  });

  it('follows daylight saving: a 00:00-08:00 shift is 7 h in spring and 9 h in autumn', () => {
    const s: Shift[] = [{ start: '00:00', end: '08:00' }];
    const c = compileCalendar({ timeZone: 'Europe/London', week: { mon: s, tue: s, wed: s, thu: s, fri: s, sat: s, sun: s }, daysOff: [] });
    expect(c.factory.workingMinutesBetween('2025-03-29T12:00:00Z', '2025-03-30T12:00:00Z')).toBe(7 * 60);
    expect(c.factory.workingMinutesBetween('2025-10-25T12:00:00Z', '2025-10-26T12:00:00Z')).toBe(9 * 60);
  });
});

describe('adding working minutes (hand-worked)', () => {
  it('over a night: Tue 16:00 + 150 min = Wed 09:30', () => {
    expect(cal.factory.addWorkingMinutes(local('2025-06-10T16:00'), 150)).toBe(local('2025-06-11T09:30'));
  });

  it('over a weekend: Fri 16:30 + 120 min = Sat 09:30; + 400 min = Mon 09:10', () => {
    expect(cal.factory.addWorkingMinutes(local('2025-06-13T16:30'), 120)).toBe(local('2025-06-14T09:30'));
    // 30 (Fri) + 240 (Sat) = 270; 400 - 270 = 130 left -> Mon 08:00 + 130 min = 10:10
    expect(cal.factory.addWorkingMinutes(local('2025-06-13T16:30'), 400)).toBe(local('2025-06-16T10:10'));
  });

  it('over a day off: Tue 16:00 + 120 min = Thu 09:00', () => {
    expect(cal.factory.addWorkingMinutes(local('2025-06-17T16:00'), 120)).toBe(local('2025-06-19T09:00'));
  });

  it('starting in the lunch break or at night begins at the next shift', () => {
    expect(cal.factory.addWorkingMinutes(local('2025-06-10T12:30'), 30)).toBe(local('2025-06-10T13:30'));
    expect(cal.factory.addWorkingMinutes(local('2025-06-10T03:00'), 1)).toBe(local('2025-06-10T08:01'));
    expect(cal.factory.addWorkingMinutes(local('2025-06-10T17:00'), 240)).toBe(local('2025-06-11T12:00'));
  });

  it('adds calendar time on a continuous station', () => {
    expect(cal.forStation('cure').addWorkingMinutes(local('2025-06-13T16:30'), 180)).toBe(local('2025-06-13T19:30'));
  });

  it('is the inverse of workingMinutesBetween at random points', () => {
    let seed = 7;
    const rnd = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
    for (const t of [cal.factory, cal.forStation('plate')]) {
      for (let i = 0; i < 300; i++) {
        const from = local('2025-06-01T00:00') + Math.floor(rnd() * 40 * 1440) * 60_000;
        const m = Math.floor(rnd() * 5000);
        const to = t.addWorkingMinutes(from, m);
        expect(t.workingMinutesBetween(from, to)).toBeCloseTo(m, 9);
        expect(to).toBeGreaterThanOrEqual(from);
      }
    }
  });

  it('refuses negative minutes and a calendar without working time', () => {
    expect(() => cal.factory.addWorkingMinutes(local('2025-06-10T16:00'), -1)).toThrow(RangeError);
    const none = compileCalendar({ timeZone: 'UTC', week: { mon: [], tue: [], wed: [], thu: [], fri: [], sat: [], sun: [] }, daysOff: [] });
    expect(() => none.factory.addWorkingMinutes(0, 10)).toThrow(RangeError);
  });
});

describe('validation', () => {
  it('names a bad time zone, a bad time and a bad date', () => {
    const bad = validateCalendar({
      timeZone: 'Mars/Olympus',
      week: { mon: [{ start: '25:00', end: '08:00' }], tue: [{ start: '08:00', end: '08:00' }], wed: [], thu: [], fri: [], sat: [], sun: [] },
      daysOff: ['2025-13-45x', '2025-02-30'],
    });
    expect(bad).toHaveLength(5);
    expect(() => compileCalendar({ ...CONFIG, timeZone: 'Nowhere/Else' })).toThrow(/time zone/);
    expect(validateCalendar(CONFIG)).toEqual([]);
  });
});
