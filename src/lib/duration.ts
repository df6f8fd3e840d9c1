// Short, plain durations and times for screens read at a glance.
import { formatDayTime } from '@/lib/datetime';
import { currentLocale, i18n } from '@/lib/i18n';

/**
 * A duration in the reader's language: 95 -> "1 h 35 min", 2900 -> "2 d 0 h". `glance` (the wall,
 * read from across the room) drops the minutes from 10 hours on: 2315 -> "38 h".
 */
export function minutesText(min: number | null | undefined, options: { glance?: boolean } = {}): string {
  if (min == null || !Number.isFinite(min)) return '–';
  const m = Math.max(0, Math.round(min));
  if (m < 60) return i18n.t('common:duration.minutes', { m });
  const h = Math.floor(m / 60);
  if (options.glance && h >= 10 && h < 48) return i18n.t('common:duration.hours', { h });
  if (h < 48) return i18n.t('common:duration.hoursMinutes', { h, m: m % 60 });
  return i18n.t('common:duration.days', { d: Math.floor(h / 24), h: h % 24 });
}

/** hours with one decimal below 10 and whole above */
export function hoursText(h: number | null | undefined): string {
  if (h == null || !Number.isFinite(h)) return '–';
  return h < 10 ? `${h.toFixed(1)} h` : `${Math.round(h).toLocaleString('en-GB')} h`;
}

/** a time in the factory's zone: "Tue 14 Oct, 15:00" (the one formatter, in the reader's language) */
export function factoryTime(iso: string | null | undefined, timeZone: string | undefined, withDay = true): string {
  if (!iso) return '–';
  return formatDayTime(iso, currentLocale(), timeZone, withDay ? 'dayTime' : 'time');
}

/** 0.4304 -> "43.0 %" */
export function percentText(x: number | null | undefined, digits = 1): string {
  if (x == null || !Number.isFinite(x)) return '–';
  return `${(x * 100).toFixed(digits)} %`;
}
