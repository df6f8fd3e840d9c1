// The tablet uses the app's one i18next instance (its words are the `station` namespace); it
// switches language per tablet and per operator, and the office screens switch it back to the
// signed-in person's language when they open.
import { applyLocale, i18n } from '@/lib/i18n';
import type { StationLang } from '../lib/refusal-text';

export const STATION_LANGS: StationLang[] = ['en', 'zh-CN'];

export const stationI18n = i18n;

export function setStationLang(lang: StationLang) {
  applyLocale(lang);
}
