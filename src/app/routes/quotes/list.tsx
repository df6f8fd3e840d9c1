import { Link } from 'react-router';
import { useTranslation } from 'react-i18next';
import { currentLocale } from '@/lib/i18n';
import { formatAnyDay } from '@/lib/datetime';
import { FilePlus2 } from 'lucide-react';
import { QUOTING } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { errorText } from '@/lib/error-text';
import { quotesQueryOptions, useQuotes } from '@/features/quotes/api/quotes';
import { EmptyState, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';

export const handle = { roles: QUOTING };
export const loader = () => queryClient.ensureQueryData(quotesQueryOptions());

const tone = { draft: 'neutral', sent: 'info', accepted: 'ok', expired: 'warn' } as const;

export function Component() {
  const { t, i18n } = useTranslation(['quotes', 'common']);
  const quotes = useQuotes();
  const money = (x: number, c: string) => new Intl.NumberFormat(i18n.language, { style: 'currency', currency: c }).format(x);
  const day = (iso: string) => formatAnyDay(iso, currentLocale());
  return (
    <>
      <PageHeader
        title={t('list.title')}
        subtitle={t('list.subtitle')}
        actions={
          <Link className="inline-flex min-h-11 items-center gap-2 rounded-lg bg-harbour-800 px-4 font-bold text-white hover:bg-harbour-700" to="/quotes/new">
            <FilePlus2 className="h-5 w-5" aria-hidden /> {t('list.newQuote')}
          </Link>
        }
      />
      {quotes.isPending ? (
        <Loading />
      ) : quotes.error ? (
        <ErrorPanel message={errorText(quotes.error)} />
      ) : quotes.data.length === 0 ? (
        <EmptyState title={t('list.none')} />
      ) : (
        <div className="overflow-x-auto rounded-xl border border-harbour-100 bg-white" tabIndex={0} aria-label={t('list.caption')}>
          <table className="w-full text-left">
            <caption className="sr-only">{t('list.caption')}</caption>
            <thead>
              <tr className="border-b-2 border-harbour-100">
                {(['number', 'customer', 'title', 'process', 'quantities', 'from', 'validUntil', 'status', 'order'] as const).map((k) => (
                  <th key={k} scope="col" className="px-3 py-2 text-sm">
                    {t(`list.col.${k}`)}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {quotes.data.map((q) => (
                <tr key={q.id} className="border-b border-harbour-50">
                  <th scope="row" className="px-3 py-2">
                    <Link className="font-bold text-harbour-800 underline" to={`/quotes/${q.id}`}>
                      {q.number}
                    </Link>
                    <span className="ml-1 text-sm text-harbour-700">v{q.version}</span>
                  </th>
                  <td className="px-3 py-2">{q.customer}</td>
                  <td className="px-3 py-2">{q.title}</td>
                  <td className="px-3 py-2">{t(`common:process.${q.process}` as 'common:process.hard_enamel', { defaultValue: q.process })}</td>
                  <td className="px-3 py-2 tabular-nums">{q.quantities.map((n) => n.toLocaleString(i18n.language)).join(' · ')}</td>
                  <td className="px-3 py-2 tabular-nums">{q.fromTotal != null ? money(q.fromTotal, q.currency) : '–'}</td>
                  <td className="px-3 py-2">{day(q.validUntil)}</td>
                  <td className="px-3 py-2">
                    <Pill tone={tone[q.status]}>{t(`status.${q.status}`)}</Pill>
                  </td>
                  <td className="px-3 py-2">{q.orderNumber ?? ''}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
