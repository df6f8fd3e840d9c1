import { describe, expect, it } from 'vitest';
import { DEFAULT_TIME_ZONE, factoryToday, iso as isoOf, dayNumberOfDate, localDate, startOfLocalDate, weekdayOfDayNumber, zoneOffsetMs } from './time-zone';

// Offsets: Asia/Shanghai is UTC+8 all year; Europe/London is UTC+0 in winter and UTC+1 in summer (IANA time zone database).
const iso = (ms: number) => new Date(ms).toISOString();

describe('time-zone helpers', () => {
  it('knows weekdays and local dates', () => {
    expect(weekdayOfDayNumber(dayNumberOfDate('2025-06-13'))).toBe(4); // a Friday, Monday = 0
    expect(weekdayOfDayNumber(dayNumberOfDate('1970-01-01'))).toBe(3); // a Thursday
    expect(localDate('Asia/Shanghai', '2025-06-13T17:00:00Z')).toBe('2025-06-14');
    expect(localDate('America/New_York', '2025-06-13T03:00:00Z')).toBe('2025-06-12');
    expect(startOfLocalDate('Asia/Shanghai', '2025-06-14')).toBe(Date.parse('2025-06-13T16:00:00Z'));
    expect(zoneOffsetMs('Europe/London', Date.parse('2025-07-01T12:00:00Z'))).toBe(3_600_000);
    expect(zoneOffsetMs('Europe/London', Date.parse('2025-01-01T12:00:00Z'))).toBe(0);
  });

  it('reads a local midnight on daylight-saving days', () => {
    // London: clocks go forward 2025-03-30 01:00 GMT and back 2025-10-26 01:00 GMT
    expect(iso(startOfLocalDate('Europe/London', '2025-03-30'))).toBe('2025-03-30T00:00:00.000Z');
    expect(iso(startOfLocalDate('Europe/London', '2025-03-31'))).toBe('2025-03-30T23:00:00.000Z');
    expect(iso(startOfLocalDate('Europe/London', '2025-10-27'))).toBe('2025-10-27T00:00:00.000Z');
  });
});

describe('one factory clock: "today" is the factory’s date', () => {
  // China keeps UTC+8 all year, with no daylight saving since 1991 (IANA time zone database, Asia/Shanghai).
  it('is already tomorrow in Shanghai from 16:00 UTC, while the UTC date is still today', () => {
    const lateEvening = Date.parse('2026-06-16T23:30:00Z'); // 07:30 on the 17th in the factory
    expect(new Date(lateEvening).toISOString().slice(0, 10)).toBe('2026-06-16');
    expect(factoryToday(lateEvening, 'Asia/Shanghai')).toBe('2026-06-17');
    expect(factoryToday(Date.parse('2026-06-16T15:59:59Z'), 'Asia/Shanghai')).toBe('2026-06-16');
    expect(factoryToday(Date.parse('2026-06-16T16:00:00Z'), 'Asia/Shanghai')).toBe('2026-06-17');
  });

  it('follows the zone it is given, daylight saving included', () => {
    // New York is UTC-4 in June (EDT): 02:00 UTC on the 17th is 22:00 on the 16th there
    expect(factoryToday(Date.parse('2026-06-17T02:00:00Z'), 'America/New_York')).toBe('2026-06-16');
    expect(factoryToday(Date.parse('2026-06-17T02:00:00Z'), 'UTC')).toBe('2026-06-17');
  });

  it('has one default zone, the one the calendar and the factory settings fall back to', () => {
    expect(DEFAULT_TIME_ZONE).toBe('Asia/Shanghai');
    expect(zoneOffsetMs(DEFAULT_TIME_ZONE, Date.parse('2026-01-15T00:00:00Z'))).toBe(8 * 3_600_000);
  });
});

describe('one ISO helper', () => {
  it('writes an instant as ISO 8601 UTC and keeps null as null', () => {
    expect(isoOf(Date.parse('2026-06-16T23:30:00+08:00'))).toBe('2026-06-16T15:30:00.000Z');
    expect(isoOf(new Date(0))).toBe('1970-01-01T00:00:00.000Z');
    expect(isoOf(null)).toBeNull();
    expect(isoOf(undefined)).toBeNull();
  });

  it('answers right when the same instants come again in any order (it remembers its last answers)', () => {
    const times = [0, 1, 0, 2, 2, 1, 86_400_000, 0, -1, 1, 86_400_000];
    for (const t of times) expect(isoOf(t)).toBe(new Date(t).toISOString()); // reference: the built-in Date
    expect(isoOf(new Date(5))).toBe('1970-01-01T00:00:00.005Z');
  });
});
