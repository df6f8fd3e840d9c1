// Short, plain durations and times for screens read at a glance.
import { formatDayTime } from '@/lib/datetime';
import { currentLocale } from '@/lib/i18n';

/** 95 -> "1 h 35 min"; 2900 -> "2 d 0 h" */
export function minutesText(min: number | null | undefined): string {
  if (min == null || !Number.isFinite(min)) return '–';
  const m = Math.max(0, Math.round(min));
  if (m < 60) return `${m} min`;
  const h = Math.floor(m / 60);
  if (h < 48) return `${h} h ${m % 60} min`;
  return `${Math.floor(h / 24)} d ${h % 24} h`;
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
