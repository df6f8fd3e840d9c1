import { useTranslation } from 'react-i18next';
import { currentLocale } from '@/lib/i18n';
import { formatAnyDay } from '@/lib/datetime';

/** Money and minutes in the reader's language. */
export function useCostFormats() {
  const { i18n } = useTranslation();
  const lang = i18n.language;
  return {
    money: (amount: number, currency: string) => new Intl.NumberFormat(lang, { style: 'currency', currency }).format(amount),
    /** a variance with its sign, so "more than quoted" reads at a glance */
    signed: (amount: number, currency: string) => new Intl.NumberFormat(lang, { style: 'currency', currency, signDisplay: 'exceptZero' }).format(amount),
    number: (x: number, digits = 1) => x.toLocaleString(lang, { maximumFractionDigits: digits }),
    pct: (x: number | null) => (x === null ? '–' : `${x.toLocaleString(lang, { maximumFractionDigits: 1, signDisplay: 'exceptZero' })} %`),
    day: (iso: string) => formatAnyDay(iso, currentLocale()),
  };
}
