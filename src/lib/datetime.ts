// Dates and times on every screen: the factory's zone (from GET /api/auth/me, or the tablet's own
// device answer) and the reader's language, through the one formatter in shared/domain.
import { formatDay, formatInstant, isCalendarDay, type InstantStyle } from '@shared/domain/time-format';
import { DEFAULT_TIME_ZONE, dateOfDayNumber, dayNumberOfDate, factoryToday, utcOfLocal } from '@shared/domain/time-zone';
import type { Locale } from '@shared/domain/vocabulary';
import { currentLocale } from '@/lib/i18n';

let factoryZone: string | undefined;

/** Set once the factory's zone is known (sign-in, the tablet's device answer). */
export function setFactoryTimeZone(timeZone: string | undefined | null): void {
  if (timeZone) factoryZone = timeZone;
}

export function factoryTimeZone(): string | undefined {
  return factoryZone;
}

/** Today ("2026-12-10") on the factory's clock, as the server counts it: the date pickers' "today". */
export function factoryTodayDate(nowMs: number = Date.now()): string {
  return factoryToday(nowMs, factoryZone ?? DEFAULT_TIME_ZONE);
}

/** The factory's date `days` days from today ("2026-12-10"), e.g. a default due date. */
export function factoryDateInDays(days: number, nowMs: number = Date.now()): string {
  return dateOfDayNumber(dayNumberOfDate(factoryTodayDate(nowMs)) + days);
}

/**
 * A `datetime-local` input's value ("2026-12-10T08:30") read on the factory's clock, whatever the
 * device's zone: the instant as ISO 8601 UTC. Not a full value: undefined.
 */
export function factoryLocalToIso(local: string): string | undefined {
  const m = /^(\d{4}-\d{2}-\d{2})T(\d{2}):(\d{2})/.exec(local);
  if (!m) return undefined;
  const ms = utcOfLocal(factoryZone ?? DEFAULT_TIME_ZONE, dayNumberOfDate(m[1]), Number(m[2]) * 60 + Number(m[3]));
  return Number.isFinite(ms) ? new Date(ms).toISOString() : undefined;
}

type At = string | number | Date | null | undefined;

/** "10 Dec 2026, 10:27" in the factory's zone. */
export function formatDateTime(at: At, locale: Locale = currentLocale(), zoneName = false): string {
  return formatInstant(at, { locale, timeZone: factoryZone }, 'dateTime', zoneName);
}

/** "10 Dec 2026": the factory's day of an instant. */
export function formatDate(at: At, locale: Locale = currentLocale()): string {
  return formatInstant(at, { locale, timeZone: factoryZone }, 'date');
}

/** "10:27" in the factory's zone. */
export function formatClock(at: At, locale: Locale = currentLocale()): string {
  return formatInstant(at, { locale, timeZone: factoryZone }, 'time');
}

/** "Thu 10 Dec, 10:27" in the factory's zone (or the zone given, e.g. a report's or the wall's). */
export function formatDayTime(at: At, locale: Locale = currentLocale(), timeZone: string | undefined = factoryZone, style: InstantStyle = 'dayTime'): string {
  return formatInstant(at, { locale, timeZone: timeZone ?? factoryZone }, style);
}

/** A calendar day such as a due date ("2026-12-10"), in the same format as formatDate. */
export function formatDueDay(day: string | null | undefined, locale: Locale = currentLocale()): string {
  return formatDay(day, locale);
}

/**
 * The day of either a calendar day ("2026-12-10", as it is) or an instant (the factory's day of
 * it), in the date format: for answers that hold both kinds (a quote's valid-until and its dates).
 * `long`: "Thursday 10 December 2026".
 */
export function formatAnyDay(at: string | null | undefined, locale: Locale = currentLocale(), long = false): string {
  if (at && isCalendarDay(at)) return formatDay(at, locale, long ? 'longDate' : 'date');
  return formatInstant(at, { locale, timeZone: factoryZone }, long ? 'longDate' : 'date');
}
