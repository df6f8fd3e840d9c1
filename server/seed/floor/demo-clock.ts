// The demo factory's working time, on the product's own factory calendar (shared/domain/calendar
// and shared/domain/time-zone): shifts Monday to Saturday 08:00–12:00 and 13:00–17:30 in the
// factory's zone, the oven curing around the clock. Work started near the end of a shift carries
// on the next morning; plating runs in loads at fixed times of day; the courier collects at 16:30.
import { compileCalendar, MINUTE, type CalendarConfig, type Shift, type Timeline } from '@shared/domain/calendar';
import { DEFAULT_TIME_ZONE, localDate, localDayNumber, utcOfLocal } from '@shared/domain/time-zone';

export const HOUR = 60 * MINUTE;

/** The demo factory's zone: the app's default (Asia/Shanghai). */
export const DEMO_TIME_ZONE = DEFAULT_TIME_ZONE;
/** Shifts in minutes after local midnight, Monday to Saturday (weekday 1–6; 0 = Sunday, as stored). */
export const DEMO_SHIFTS = [
  { start: 8 * 60, end: 12 * 60 },
  { start: 13 * 60, end: 17 * 60 + 30 },
];
export const DEMO_WORKDAYS = [1, 2, 3, 4, 5, 6];
/** Plating loads and the courier, in minutes after local midnight. */
export const PLATING_LOADS = [8 * 60 + 30, 10 * 60 + 30, 14 * 60, 16 * 60];
export const COURIER_PICKUP = 16 * 60 + 30;

const hm = (m: number) => `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
const WEEK = ['sun', 'mon', 'tue', 'wed', 'thu', 'fri', 'sat'] as const;

/** The demo floor's calendar as the factory settings hold it. */
export function demoCalendarConfig(): CalendarConfig {
  const shifts: Shift[] = DEMO_SHIFTS.map((s) => ({ start: hm(s.start), end: hm(s.end) }));
  const week = Object.fromEntries(WEEK.map((d, i) => [d, DEMO_WORKDAYS.includes(i) ? shifts : []])) as CalendarConfig['week'];
  return { timeZone: DEMO_TIME_ZONE, week, daysOff: [], stations: { cure: { continuous: true } } };
}

const shifts: Timeline = compileCalendar(demoCalendarConfig()).factory;

/** The first working moment at or after `t`. */
export function nextWorking(t: number): number {
  const today = localDayNumber(DEMO_TIME_ZONE, t);
  for (let day = today - 1; day < today + 14; day++) for (const [start, end] of shifts.shiftsOfDay(day)) if (t < end) return Math.max(t, start);
  throw new Error('no working time within two weeks');
}

/** `minutes` of working time after `t` (work stops between shifts and carries on). */
export function addWorking(t: number, minutes: number): number {
  return minutes > 0 ? shifts.addWorkingMinutes(t, minutes) : nextWorking(t);
}

/** The next of the day's fixed times (plating loads, courier) at or after `t`, on a working day. */
export function nextFixed(t: number, times: readonly number[]): number {
  let cur = nextWorking(t);
  for (let i = 0; i < 14; i++) {
    const day = localDayNumber(DEMO_TIME_ZONE, cur);
    const midnight = utcOfLocal(DEMO_TIME_ZONE, day, 0);
    if (shifts.shiftsOfDay(day).length) {
      const m = times.find((x) => x >= (cur - midnight) / MINUTE);
      if (m != null) return utcOfLocal(DEMO_TIME_ZONE, day, m);
    }
    cur = nextWorking(utcOfLocal(DEMO_TIME_ZONE, day + 1, 0));
  }
  throw new Error('no fixed time within two weeks');
}

/** The factory's date ("YYYY-MM-DD") at `t`. */
export const factoryDate = (t: number) => localDate(DEMO_TIME_ZONE, t);

/** Whole seconds, as a tablet stamps a scan. */
export const toSecond = (t: number) => Math.round(t / 1000) * 1000;
