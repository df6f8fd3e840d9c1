// Time-zone conversion for the factory's clock: UTC instants (epoch milliseconds) to local
// dates, day numbers and wall-clock times in an IANA zone such as "Asia/Shanghai", and back.
// Offsets come from the platform's Intl time-zone data through @date-fns/tz, so it runs in the
// browser and on the server alike and follows daylight-saving changes. The working-time tables
// (shifts, days off, working minutes) built on it are in ./calendar.ts.

import { tzOffset } from '@date-fns/tz';

/** The factory's time zone until an admin sets one: the one default for every part of the app. */
export const DEFAULT_TIME_ZONE = 'Asia/Shanghai';

/** A calendar day in ms: the unit of day numbers (days since 1970-01-01). */
export const DAY = 86_400_000;
const MINUTE_MS = 60_000;
const HOUR = 3_600_000;

export type Instant = number | string | Date;
export function toMs(t: Instant): number {
  if (typeof t === 'number') return t;
  if (t instanceof Date) return t.getTime();
  const ms = Date.parse(t);
  if (Number.isNaN(ms)) throw new RangeError(`not a time: ${t}`);
  return ms;
}

/** An instant as an ISO 8601 UTC string (what the API and stored rows carry); null stays null. */
export function iso(ms: number | Date): string;
export function iso(ms: number | Date | null | undefined): string | null;
export function iso(ms: number | Date | null | undefined): string | null {
  if (ms == null) return null;
  const t = typeof ms === 'number' ? ms : ms.getTime();
  // the guards and the replay write the same few instants many times over (an event's time into
  // several fields): the last two answers are kept, as toISOString is the dearest step of a replay
  if (t === lastIsoMs[0]) return lastIso[0];
  if (t === lastIsoMs[1]) return lastIso[1];
  const text = new Date(t).toISOString();
  lastIsoMs[1] = lastIsoMs[0];
  lastIso[1] = lastIso[0];
  lastIsoMs[0] = t;
  lastIso[0] = text;
  return text;
}
const lastIsoMs: [number, number] = [NaN, NaN];
const lastIso: [string, string] = ['', ''];

export function isValidTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

/** The zone's offset from UTC at an instant, from the platform's time-zone data (through @date-fns/tz). */
function exactOffsetMs(tz: string, utcMs: number): number {
  const minutes = tzOffset(tz, new Date(utcMs));
  if (Number.isNaN(minutes)) throw new RangeError(`unknown time zone: ${tz}`);
  return Math.round(minutes * MINUTE_MS);
}

const offsetCache = new Map<string, Map<number, number>>();

/** Offset of local time from UTC in the zone at that instant (ms; east positive). */
export function zoneOffsetMs(tz: string, utcMs: number): number {
  if (tz === 'UTC' || tz === 'Etc/UTC') return 0;
  let cache = offsetCache.get(tz);
  if (!cache) offsetCache.set(tz, (cache = new Map()));
  const bucket = Math.floor(utcMs / HOUR);
  let o = cache.get(bucket);
  if (o === undefined) {
    const a = exactOffsetMs(tz, bucket * HOUR);
    const b = exactOffsetMs(tz, bucket * HOUR + HOUR - 1000);
    // NaN marks an hour with a change inside it: those are computed exactly each time
    o = a === b ? a : Number.NaN;
    if (cache.size > 200_000) cache.clear();
    cache.set(bucket, o);
  }
  return Number.isNaN(o) ? exactOffsetMs(tz, utcMs) : o;
}

/** Days since 1970-01-01 of the local date at that instant. */
export function localDayNumber(tz: string, utcMs: number): number {
  return Math.floor((utcMs + zoneOffsetMs(tz, utcMs)) / DAY);
}

export function dayNumberOfDate(date: string): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  const ms = m ? Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])) : Number.NaN;
  if (!m || new Date(ms).toISOString().slice(0, 10) !== date) throw new RangeError(`not a date (YYYY-MM-DD): ${date}`);
  return Math.floor(ms / DAY);
}

export function dateOfDayNumber(day: number): string {
  return new Date(day * DAY).toISOString().slice(0, 10);
}

/** The local date ("YYYY-MM-DD") in the zone at that instant. */
export function localDate(tz: string, t: Instant): string {
  return dateOfDayNumber(localDayNumber(tz, toMs(t)));
}

/**
 * "Today" on the factory's clock: the local date in the factory's zone at `nowMs`. Lateness, the
 * approval-date check, progress and reports all ask this, never the UTC date (which is still
 * yesterday in Shanghai until 08:00).
 */
export function factoryToday(nowMs: number, zone: string): string {
  return localDate(zone, nowMs);
}

/** Monday = 0 ... Sunday = 6 (1970-01-01 was a Thursday). */
export function weekdayOfDayNumber(day: number): number {
  return (((day + 3) % 7) + 7) % 7;
}

/**
 * The UTC instant of a local wall-clock time. A time that a spring-forward change skips is
 * read with the offset from before the change (it lands just after the gap); a repeated
 * autumn time takes its first occurrence.
 */
export function utcOfLocal(tz: string, day: number, minuteOfDay: number): number {
  const wall = day * DAY + minuteOfDay * MINUTE_MS;
  // real zones change their offset at most once within a day around any wall time
  const before = zoneOffsetMs(tz, wall - DAY / 2);
  const after = zoneOffsetMs(tz, wall + DAY / 2);
  const first = wall - before;
  if (first + zoneOffsetMs(tz, first) === wall) return first;
  const second = wall - after;
  if (second + zoneOffsetMs(tz, second) === wall) return second;
  return first; // inside a skipped hour
}

/** The UTC instant at which a local date starts. */
export function startOfLocalDate(tz: string, date: string): number {
  return utcOfLocal(tz, dayNumberOfDate(date), 0);
}
