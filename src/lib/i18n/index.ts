// The one i18next instance of the app: office screens and the station tablet share it. Each
// person's language comes from their user setting (GET /api/auth/me); before sign-in from the
// choice remembered in this browser, else the browser's own language.
import i18next from 'i18next';
import { initReactI18next } from 'react-i18next';
import { z } from 'zod';
import { LOCALES, type Locale } from '@shared/domain/vocabulary';
import { resources } from './resources';

const STORAGE_KEY = 'trayce.locale';

function isLocale(x: unknown): x is Locale {
  return typeof x === 'string' && (LOCALES as readonly string[]).includes(x);
}

/** The remembered choice of this browser, else the browser's language (any Chinese → zh-CN). */
export function browserLocale(): Locale {
  try {
    const stored = globalThis.localStorage?.getItem(STORAGE_KEY);
    if (isLocale(stored)) return stored;
  } catch {
    // storage switched off: fall through to the browser's language
  }
  const langs = typeof navigator === 'undefined' ? [] : (navigator.languages ?? [navigator.language]);
  for (const l of langs) {
    if (/^zh\b/i.test(l)) return 'zh-CN';
    if (/^en\b/i.test(l)) return 'en';
  }
  return 'en';
}

export const i18n = i18next.createInstance();
void i18n.use(initReactI18next).init({
  resources,
  lng: browserLocale(),
  fallbackLng: 'en',
  supportedLngs: [...LOCALES],
  ns: Object.keys(resources.en),
  defaultNS: 'common',
  interpolation: { escapeValue: false },
  returnNull: false,
  initAsync: false,
});

function markDocument(locale: Locale) {
  if (typeof document !== 'undefined') document.documentElement.lang = locale;
  // zod's own messages (those our schemas do not word themselves) in the same language
  z.config(locale === 'zh-CN' ? z.locales.zhCN() : z.locales.en());
}
markDocument(i18n.language as Locale);

/** Shows the app in this language now (and says so to screen readers through <html lang>). */
export function applyLocale(locale: Locale) {
  if (i18n.language !== locale) void i18n.changeLanguage(locale);
  markDocument(locale);
}

/** Before sign-in: remember the choice in this browser too. */
export function rememberLocale(locale: Locale) {
  try {
    globalThis.localStorage?.setItem(STORAGE_KEY, locale);
  } catch {
    // storage switched off: the choice lasts for this page only
  }
  applyLocale(locale);
}

export function currentLocale(): Locale {
  return isLocale(i18n.language) ? i18n.language : 'en';
}
