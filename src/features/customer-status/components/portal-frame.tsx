import type { ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { currentLocale, rememberLocale } from '@/lib/i18n';
import { formatAnyDay } from '@/lib/datetime';
import { LOCALES, type Locale } from '@shared/domain/vocabulary';

// The frame of the customer's pages (her quote and her order): made for a phone, no sign-in, no
// navigation into the app, not for search engines, in English or Chinese.

const LANG_NAMES: Record<Locale, string> = { en: 'English', 'zh-CN': '简体中文' };

export function usePortalFormats() {
  const { i18n } = useTranslation();
  const lang = i18n.language;
  return {
    // the one formatter: the factory's zone once known (a signed-in preview), else this device's
    longDate: (iso: string) => formatAnyDay(iso, currentLocale(), true),
    day: (iso: string) => formatAnyDay(iso, currentLocale()),
    money: (amount: number, currency: string) => new Intl.NumberFormat(lang, { style: 'currency', currency }).format(amount),
  };
}

function LanguageSwitch() {
  // the choice is remembered in this browser: there is no sign-in on this page
  const { t, i18n } = useTranslation('portal');
  const lang = i18n.language;
  return (
    <div role="group" aria-label={t('language')} className="flex justify-end gap-2">
      {LOCALES.map((l) => (
        <button
          key={l}
          type="button"
          lang={l}
          aria-pressed={lang === l}
          onClick={() => rememberLocale(l)}
          className={`min-h-11 rounded-lg px-3 font-bold ${lang === l ? 'bg-harbour-800 text-white' : 'border-2 border-harbour-100 bg-white text-harbour-800'}`}
        >
          {LANG_NAMES[l]}
        </button>
      ))}
    </div>
  );
}

export function PortalFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="min-h-full bg-paper">
      <title>{title}</title>
      <meta name="robots" content="noindex, nofollow" />
      <meta name="referrer" content="no-referrer" />
      <main className="mx-auto flex w-full max-w-md flex-col gap-5 px-4 py-6">
        <LanguageSwitch />
        {children}
      </main>
    </div>
  );
}

export function PortalCard({ id, heading, icon, children }: { id: string; heading: ReactNode; icon?: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="rounded-xl border border-harbour-100 bg-white p-5">
      <h2 id={id} className="flex items-center gap-2 text-lg font-bold text-harbour-900">
        {icon}
        {heading}
      </h2>
      <div className="mt-3 flex flex-col gap-3">{children}</div>
    </section>
  );
}
