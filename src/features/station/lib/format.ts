import type { TFunction } from 'i18next';
import type { RoutingStep } from '@shared/domain/vocabulary';
import type { StationLang } from './refusal-text';
import { kindTraits } from '@shared/domain/traveller/station-kinds';
import { formatClock as clock, formatDateTime as dateTime, formatDueDay } from '@/lib/datetime';

/** "2 h 05 min", "3 d 4 h" … from minutes, in the tablet's language. */
export function formatDuration(t: TFunction<'station'>, minutes: number): string {
  const m = Math.max(0, Math.round(minutes));
  if (m < 60) return t('duration.minutes', { m });
  if (m < 24 * 60) return t('duration.hoursMinutes', { h: Math.floor(m / 60), m: m % 60 });
  return t('duration.days', { d: Math.floor(m / 1440), h: Math.floor((m % 1440) / 60) });
}

/** "10:27" in the factory's zone (the one formatter every screen uses). */
export function formatClock(lang: StationLang, iso: unknown): string {
  return typeof iso === 'string' || typeof iso === 'number' ? clock(iso, lang) : '—';
}

/** "10 Dec 2026, 10:27" in the factory's zone. */
export function formatDateTime(lang: StationLang, iso: unknown): string {
  return typeof iso === 'string' || typeof iso === 'number' ? dateTime(iso, lang) : '—';
}

/** A calendar day ("2026-12-14") as every screen shows it. */
export function formatDate(lang: StationLang, day: string): string {
  return formatDueDay(day, lang);
}

export function formatNumber(lang: StationLang, n: number): string {
  return new Intl.NumberFormat(lang).format(n);
}

/**
 * A step's name for the operator. Colour steps are built from their structure ("Colour 2 of 3:
 * fill"), so they read right in every language; other steps keep the routing's own name in
 * English and the station kind's name in Chinese.
 */
export function stepLabel(t: TFunction<'station'>, lang: StationLang, step: RoutingStep | undefined, routing: readonly RoutingStep[]): string {
  if (!step) return '—';
  if (step.colour != null && kindTraits(step.stationKind).colourStep != null) {
    const total = routing.reduce((m, s) => Math.max(m, s.colour ?? 0), 0);
    return t('step.colourOf', { n: step.colour, total, kind: t(`kind.${step.stationKind}`) });
  }
  return lang === 'en' ? step.name : t(`kind.${step.stationKind}`);
}
