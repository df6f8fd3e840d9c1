// The tablet's own i18next instance: the station screens switch language per tablet without
// touching the rest of the app.
import i18next from 'i18next';
import { initReactI18next } from 'react-i18next';
import { en } from './en';
import { zhCN } from './zh-CN';
import type { StationLang } from '../lib/refusal-text';

export const STATION_LANGS: StationLang[] = ['en', 'zh-CN'];

export const stationI18n = i18next.createInstance();
void stationI18n.use(initReactI18next).init({
  resources: { en: { station: en }, 'zh-CN': { station: zhCN } },
  lng: 'en',
  fallbackLng: 'en',
  ns: ['station'],
  defaultNS: 'station',
  interpolation: { escapeValue: false },
  initAsync: false,
});

export function setStationLang(lang: StationLang) {
  if (stationI18n.language !== lang) void stationI18n.changeLanguage(lang);
  if (typeof document !== 'undefined') document.documentElement.lang = lang;
}
