// The factory's working calendar: shifts per weekday, days off, and per-station exceptions
// (an oven keeps curing through the night and on days off).
//
// Time zones: the factory has one time-zone setting, an IANA name such as "Asia/Shanghai".
// Shifts ("06:00"-"14:00") and days off ("2025-10-01") are local wall-clock values in that
// zone; every instant in and out of this module is UTC (epoch milliseconds). The conversion
// between the two is ./time-zone.ts (it follows daylight-saving changes: a 00:00-08:00 shift on
// a spring-forward night is 7 h).
// A shift whose end is not after its start runs past midnight and belongs to the day it
// starts on; a day off removes the shifts that start on that date.

import { dayNumberOfDate, isValidTimeZone, localDayNumber, toMs, utcOfLocal, weekdayOfDayNumber, type Instant } from './time-zone';

export const WEEKDAYS = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'] as const;
export type Weekday = (typeof WEEKDAYS)[number];

export interface Shift {
  start: string; // "HH:MM" local
  end: string; // "HH:MM" local; <= start means it ends on the next day
}

export type WeekSchedule = Record<Weekday, Shift[]>;

export interface StationCalendar {
  /** works around the clock, every day (for example a curing oven) */
  continuous?: boolean;
  /** replaces the factory week for this station */
  week?: WeekSchedule;
  /** extra days off for this station, added to the factory's */
  daysOff?: string[];
}

export interface CalendarConfig {
  timeZone: string;
  week: WeekSchedule;
  daysOff: string[]; // "YYYY-MM-DD" local dates
  /** keyed by station id or station kind; an id wins over a kind */
  stations?: Record<string, StationCalendar>;
}

/** A working minute in ms: the unit of the working-time arithmetic. */
export const MINUTE = 60_000;

export function parseHm(hm: string): number {
  const m = /^([01]\d|2[0-3]):([0-5]\d)$/.exec(hm);
  if (!m) throw new RangeError(`not a time of day (HH:MM): ${hm}`);
  return Number(m[1]) * 60 + Number(m[2]);
}

// ---- timelines ---------------------------------------------------------------------------

/** Working time of one station (or of the factory): all arithmetic on working minutes. */
export interface Timeline {
  readonly continuous: boolean;
  /** working intervals [start, end) in UTC ms of the shifts that start on that local day */
  shiftsOfDay(day: number): readonly (readonly [number, number])[];
  /** working minutes in [from, to); negative when to is before from */
  workingMinutesBetween(from: Instant, to: Instant): number;
  /** the instant at which `minutes` working minutes after `from` have passed */
  addWorkingMinutes(from: Instant, minutes: number): number;
  isWorking(t: Instant): boolean;
}

const MAX_SEARCH_DAYS = 3660;
/** the step of the timelines' search index: an hour */
const INDEX_MS = 3_600_000;

class ContinuousTimeline implements Timeline {
  readonly continuous = true;
  constructor(private readonly tz: string) {}
  shiftsOfDay(day: number) {
    return [[utcOfLocal(this.tz, day, 0), utcOfLocal(this.tz, day + 1, 0)] as const];
  }
  workingMinutesBetween(from: Instant, to: Instant) {
    return (toMs(to) - toMs(from)) / MINUTE;
  }
  addWorkingMinutes(from: Instant, minutes: number) {
    if (!(minutes >= 0)) throw new RangeError('minutes must be >= 0');
    return toMs(from) + minutes * MINUTE;
  }
  isWorking() {
    return true;
  }
}

/**
 * A shift timeline keeps a table of its merged working intervals with the working time before
 * each one (a "working clock"), so both directions are two binary searches. The table covers
 * a range of local days and grows when a question falls outside it.
 */
class ShiftTimeline implements Timeline {
  readonly continuous = false;
  private readonly cache = new Map<number, (readonly [number, number])[]>();
  private readonly shiftMinutes: [number, number][][]; // per weekday Monday..Sunday
  private readonly off: Set<number>;
  private readonly hasWork: boolean;
  private firstDay = 0;
  private lastDay = -1; // table empty
  /** instants safely inside the covered days (a day of margin each side) */
  private safeFrom = Infinity;
  private safeTo = -Infinity;
  private starts = new Float64Array(0);
  private ends = new Float64Array(0);
  /** working ms before interval i, and up to its end */
  private cumStart = new Float64Array(0);
  private cumEnd = new Float64Array(0);
  /** per hour from the first interval's start: the last interval starting at or before it */
  private byHour = new Int32Array(0);
  /** per working hour of the clock: the first interval whose end reaches it */
  private byWorkHour = new Int32Array(0);
  private base = 0;

  constructor(
    private readonly tz: string,
    week: WeekSchedule,
    daysOff: readonly string[],
  ) {
    this.shiftMinutes = WEEKDAYS.map((d) =>
      (week[d] ?? [])
        .map((s): [number, number] => {
          const a = parseHm(s.start);
          let b = parseHm(s.end);
          if (b <= a) b += 24 * 60;
          return [a, b];
        })
        .sort((x, y) => x[0] - y[0]),
    );
    this.off = new Set(daysOff.map(dayNumberOfDate));
    this.hasWork = this.shiftMinutes.some((d) => d.length > 0);
  }

  shiftsOfDay(day: number) {
    let r = this.cache.get(day);
    if (!r) {
      r = this.off.has(day)
        ? []
        : this.shiftMinutes[weekdayOfDayNumber(day)].map(([a, b]) => {
            // minutes past 24:00 belong to the next local day
            const s = utcOfLocal(this.tz, day + Math.floor(a / 1440), a % 1440);
            const e = utcOfLocal(this.tz, day + Math.floor(b / 1440), b % 1440);
            return [s, e] as const;
          });
      if (this.cache.size > 20_000) this.cache.clear();
      this.cache.set(day, r);
    }
    return r;
  }

  /** Makes sure the table covers local days [from, to] (plus a margin). */
  private cover(from: number, to: number): void {
    if (from >= this.firstDay && to <= this.lastDay) return;
    const empty = this.lastDay < this.firstDay;
    const first = empty ? from - 60 : Math.min(this.firstDay, from - 60);
    const last = empty ? to + 400 : Math.max(this.lastDay, to + 400);
    const raw: (readonly [number, number])[] = [];
    // the day before `first` may run a night shift into it
    for (let d = first - 1; d <= last; d++) for (const iv of this.shiftsOfDay(d)) if (iv[1] > iv[0]) raw.push(iv);
    raw.sort((x, y) => x[0] - y[0]);
    const starts: number[] = [];
    const ends: number[] = [];
    for (const [s, e] of raw) {
      const n = ends.length;
      if (n && s <= ends[n - 1]) ends[n - 1] = Math.max(ends[n - 1], e);
      else {
        starts.push(s);
        ends.push(e);
      }
    }
    this.starts = Float64Array.from(starts);
    this.ends = Float64Array.from(ends);
    this.cumStart = new Float64Array(starts.length);
    this.cumEnd = new Float64Array(starts.length);
    let run = 0;
    for (let i = 0; i < starts.length; i++) {
      this.cumStart[i] = run;
      run += ends[i] - starts[i];
      this.cumEnd[i] = run;
    }
    this.firstDay = first;
    this.lastDay = last;
    this.safeFrom = utcOfLocal(this.tz, first + 2, 0);
    this.safeTo = utcOfLocal(this.tz, last - 1, 0);
    // an index by hour of both clocks, so a question starts its search next to its answer
    // (the ship-date projection asks some millions of them)
    const n = starts.length;
    this.base = n ? this.starts[0] : 0;
    const hours = n ? Math.ceil((this.ends[n - 1] - this.base) / INDEX_MS) + 1 : 0;
    this.byHour = new Int32Array(hours);
    for (let h = 0, i = 0; h < hours; h++) {
      const at = this.base + h * INDEX_MS;
      while (i + 1 < n && this.starts[i + 1] <= at) i++;
      this.byHour[h] = i;
    }
    const workHours = n ? Math.ceil(this.cumEnd[n - 1] / INDEX_MS) + 1 : 0;
    this.byWorkHour = new Int32Array(workHours);
    for (let h = 0, i = 0; h < workHours; h++) {
      while (i + 1 < n && this.cumEnd[i] < h * INDEX_MS) i++;
      this.byWorkHour[h] = i;
    }
  }

  /** the instant at which the working clock reads `target` (first interval whose end reaches it) */
  private locate(target: number): number {
    const ce = this.cumEnd;
    const h = Math.floor(target / INDEX_MS);
    // the first interval whose end reaches the target: from the hour's first candidate on
    let i = h >= 0 && h < this.byWorkHour.length ? this.byWorkHour[h] : 0;
    const last = ce.length - 1;
    while (i < last && ce[i] < target) i++;
    return this.starts[i] + (target - this.cumStart[i]);
  }

  /** working ms from the table's start up to t (t inside the table's range) */
  private clock(t: number): number {
    const st = this.starts;
    const n = st.length;
    if (n === 0 || t < st[0]) return 0;
    const h = Math.floor((t - this.base) / INDEX_MS);
    // the last interval starting at or before t: from the hour's last start at or before it on
    let i = h < this.byHour.length ? this.byHour[h] : n - 1;
    while (i + 1 < n && st[i + 1] <= t) i++;
    return t < this.ends[i] ? this.cumStart[i] + (t - st[i]) : this.cumEnd[i];
  }

  workingMinutesBetween(fromI: Instant, toI: Instant): number {
    const from = toMs(fromI);
    const to = toMs(toI);
    const lo = Math.min(from, to);
    const hi = Math.max(from, to);
    if (lo < this.safeFrom || hi > this.safeTo) this.cover(localDayNumber(this.tz, lo) - 1, localDayNumber(this.tz, hi) + 1);
    return (this.clock(to) - this.clock(from)) / MINUTE;
  }

  addWorkingMinutes(fromI: Instant, minutes: number): number {
    if (!(minutes >= 0)) throw new RangeError('minutes must be >= 0');
    const from = toMs(fromI);
    if (minutes === 0) return from;
    if (!this.hasWork) throw new RangeError('the calendar has no working time');
    // fast path: the table already reaches far enough
    if (from >= this.safeFrom && from <= this.safeTo) {
      const target = this.clock(from) + minutes * MINUTE;
      const ce = this.cumEnd;
      const last = ce.length - 1;
      if (last >= 0 && ce[last] >= target) return this.locate(target);
    }
    const fromDay = localDayNumber(this.tz, from);
    let horizon = fromDay + Math.ceil(minutes / 1440) + 14;
    for (;;) {
      this.cover(fromDay - 1, horizon);
      const target = this.clock(from) + minutes * MINUTE;
      const ce = this.cumEnd;
      if (ce.length && ce[ce.length - 1] >= target) return this.locate(target);
      if (horizon - fromDay > MAX_SEARCH_DAYS) throw new RangeError('no working time within ten years');
      horizon = fromDay + (horizon - fromDay) * 2;
    }
  }

  isWorking(tI: Instant): boolean {
    const t = toMs(tI);
    const day = localDayNumber(this.tz, t);
    for (const d of [day - 1, day]) for (const [s, e] of this.shiftsOfDay(d)) if (t >= s && t < e) return true;
    return false;
  }
}

export interface WorkingCalendar {
  readonly timeZone: string;
  /** the factory's own timeline */
  readonly factory: Timeline;
  /** a station's timeline: the first key with an exception wins (pass id before kind) */
  forStation(...keys: (string | null | undefined)[]): Timeline;
}

export function validateCalendar(config: CalendarConfig): string[] {
  const problems: string[] = [];
  if (!isValidTimeZone(config.timeZone)) problems.push(`unknown time zone: ${config.timeZone}`);
  const checkWeek = (w: WeekSchedule | undefined, where: string) => {
    if (!w) return;
    for (const d of WEEKDAYS)
      for (const s of w[d] ?? []) {
        try {
          if (parseHm(s.start) === parseHm(s.end)) problems.push(`${where} ${d}: a shift needs a length`);
        } catch (e) {
          problems.push(`${where} ${d}: ${(e as Error).message}`);
        }
      }
  };
  const checkDays = (ds: readonly string[] | undefined, where: string) => {
    for (const d of ds ?? []) {
      try {
        dayNumberOfDate(d);
      } catch (e) {
        problems.push(`${where}: ${(e as Error).message}`);
      }
    }
  };
  checkWeek(config.week, 'factory');
  checkDays(config.daysOff, 'factory days off');
  for (const [k, st] of Object.entries(config.stations ?? {})) {
    checkWeek(st.week, k);
    checkDays(st.daysOff, `${k} days off`);
  }
  return problems;
}

export function compileCalendar(config: CalendarConfig): WorkingCalendar {
  const problems = validateCalendar(config);
  if (problems.length) throw new RangeError(problems.join('; '));
  const tz = config.timeZone;
  const factory = new ShiftTimeline(tz, config.week, config.daysOff);
  const continuous = new ContinuousTimeline(tz);
  const perKey = new Map<string, Timeline>();
  for (const [key, st] of Object.entries(config.stations ?? {})) {
    if (st.continuous) perKey.set(key, continuous);
    else if (st.week || st.daysOff?.length) perKey.set(key, new ShiftTimeline(tz, st.week ?? config.week, [...config.daysOff, ...(st.daysOff ?? [])]));
  }
  return {
    timeZone: tz,
    factory,
    forStation(...keys) {
      for (const k of keys) {
        if (k == null) continue;
        const t = perKey.get(k);
        if (t) return t;
      }
      return factory;
    },
  };
}

/** Monday to Friday 08:00-12:00 and 13:00-17:00, ovens continuous: a simple starting point. */
export function defaultCalendarConfig(timeZone = 'UTC'): CalendarConfig {
  const day: Shift[] = [
    { start: '08:00', end: '12:00' },
    { start: '13:00', end: '17:00' },
  ];
  return {
    timeZone,
    week: { mon: day, tue: day, wed: day, thu: day, fri: day, sat: [], sun: [] },
    daysOff: [],
    stations: { cure: { continuous: true } },
  };
}
