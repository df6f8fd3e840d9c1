import { useTranslation } from 'react-i18next';
import { LOCALES, type Locale } from '@shared/domain/vocabulary';

const NAMES: Record<Locale, string> = { en: 'English', 'zh-CN': '简体中文' };

/** Two buttons, each language named in itself; the pressed one is the language shown. */
export function LanguageSwitch({
  value,
  onChange,
  tone = 'dark',
  disabled,
}: {
  value: Locale;
  onChange: (l: Locale) => void;
  tone?: 'dark' | 'light';
  disabled?: boolean;
}) {
  const { t } = useTranslation();
  const on = tone === 'dark' ? 'bg-brass-400 text-harbour-900' : 'bg-harbour-800 text-white';
  const off = tone === 'dark' ? 'text-white hover:bg-harbour-700' : 'text-harbour-800 hover:bg-harbour-50';
  return (
    <div
      role="group"
      aria-label={t('app.language')}
      className={`flex shrink-0 rounded-lg border ${tone === 'dark' ? 'border-harbour-600' : 'border-harbour-100'}`}
    >
      {LOCALES.map((l) => (
        <button
          key={l}
          type="button"
          lang={l}
          aria-pressed={value === l}
          disabled={disabled}
          onClick={() => value !== l && onChange(l)}
          className={`min-h-11 whitespace-nowrap rounded-md px-2.5 text-sm font-bold ${value === l ? on : off}`}
        >
          {NAMES[l]}
        </button>
      ))}
    </div>
  );
}
