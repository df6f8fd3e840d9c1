// The one way the product writes a date or a time for people: always in the factory's time zone
// (never the reading device's), one format per language, 24-hour clock. Screens, the tablet and
// printouts all call these, so the same instant reads the same everywhere.
import type { Locale } from './vocabulary';

export type InstantStyle =
  /** "10 Dec 2026, 10:27" · "2026年12月10日 10:27" */
  | 'dateTime'
  /** "10 Dec 2026" · "2026年12月10日" */
  | 'date'
  /** "10:27" */
  | 'time'
  /** "Thu 10 Dec, 10:27" · "12月10日周四 10:27": this week's times on the floor */
  | 'dayTime'
  /** "Thursday 10 December 2026" · "2026年12月10日星期四": a customer's ship date, written out */
  | 'longDate';

export interface TimeSettings {
  locale: Locale;
  /** IANA name of the factory's zone; undefined only before it is known (then the device's) */
  timeZone: string | undefined;
}

const INTL_LOCALE: Record<Locale, string> = { en: 'en-GB', 'zh-CN': 'zh-CN' };

const STYLES: Record<InstantStyle, Intl.DateTimeFormatOptions> = {
  dateTime: { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' },
  date: { day: 'numeric', month: 'short', year: 'numeric' },
  time: { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' },
  dayTime: { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' },
  longDate: { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric' },
};

const cache = new Map<string, Intl.DateTimeFormat>();
function formatter(locale: Locale, timeZone: string | undefined, style: InstantStyle, zoneName: boolean): Intl.DateTimeFormat {
  const key = `${locale}|${timeZone ?? ''}|${style}|${zoneName}`;
  let f = cache.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(INTL_LOCALE[locale] ?? 'en-GB', { ...STYLES[style], timeZone, ...(zoneName ? { timeZoneName: 'short' } : {}) });
    cache.set(key, f);
  }
  return f;
}

/** Milliseconds of an ISO 8601 text or epoch milliseconds; null when there is no valid time. */
function toMs(at: string | number | Date | null | undefined): number | null {
  if (at == null) return null;
  const ms = at instanceof Date ? at.getTime() : typeof at === 'number' ? at : Date.parse(at);
  return Number.isFinite(ms) ? ms : null;
}

/**
 * An instant in the factory's zone. `zoneName` adds the zone ("GMT+8") where a reader could take
 * the time for their own (a customer abroad, a report read elsewhere). No time: "—".
 */
export function formatInstant(
  at: string | number | Date | null | undefined,
  settings: TimeSettings,
  style: InstantStyle = 'dateTime',
  zoneName = false,
): string {
  const ms = toMs(at);
  if (ms == null) return '—';
  return formatter(settings.locale, settings.timeZone, style, zoneName).format(ms);
}

/**
 * A calendar day ("2026-12-10", a due date): the same day everywhere, whatever the zone, in the
 * same format as `formatInstant(…, 'date')`.
 */
export function formatDay(day: string | null | undefined, locale: Locale, style: 'date' | 'longDate' = 'date'): string {
  if (!day || !isCalendarDay(day)) return '—';
  return formatter(locale, 'UTC', style, false).format(Date.parse(`${day}T12:00:00Z`));
}

/** "2026-12-10": a calendar day (a due date, a valid-until), not an instant. */
export function isCalendarDay(x: string): boolean {
  return /^\d{4}-\d{2}-\d{2}$/.test(x);
}
