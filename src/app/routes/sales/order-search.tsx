import { useDeferredValue, useMemo, useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import type { SalesOrderRow } from '@shared/schemas/shipping';
import { SALES_VIEW, WHAT_IF } from '@shared/domain/access';
import { useTranslation } from 'react-i18next';
import { CalendarClock } from 'lucide-react';
import { useMe } from '@/features/auth/api/get-me';
import { queryClient } from '@/lib/query-client';
import { salesSearchQueryOptions, useSalesSearch } from '@/features/sales/api/search-orders';
import { DataTable } from '@/components/ui/data-table';
import { ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { paths } from '@/config/paths';
import { formatDate, formatDueDay } from '@/lib/datetime';
import { errorText } from '@/lib/error-text';
import { useStageName } from '@/features/sales/stage-name';
import { useStageNote } from '@/features/sales/stage-note';

export const handle = { roles: SALES_VIEW };
export const loader = ({ request }: { request: Request }) =>
  queryClient.ensureQueryData(salesSearchQueryOptions(new URL(request.url).searchParams.get('q') ?? ''));

const day = (iso: string | null) => formatDate(iso);
const dueDay = (d: string) => formatDueDay(d);

function When({ o }: { o: SalesOrderRow }) {
  const { t } = useTranslation('sales');
  if (o.shippedAt) return <Pill tone="ok">{t('search.shipped', { date: day(o.shippedAt) })}</Pill>;
  if (o.status === 'cancelled') return <Pill tone="neutral">{t('search.cancelled')}</Pill>;
  return (
    <span className="flex flex-wrap items-center gap-2">
      <span className="font-bold">{day(o.projectedShipAt)}</span>
      {o.late && <Pill tone="stop">{t('search.late')}</Pill>}
    </span>
  );
}

const col = createColumnHelper<SalesOrderRow>();
function useColumns() {
  const { t } = useTranslation('sales');
  const stageName = useStageName();
  const stageNote = useStageNote();
  return useMemo(
    () => [
      col.accessor('number', {
        header: t('search.col.number'),
        cell: (c) => (
          <Link className="font-bold text-harbour-700 underline" to={paths.salesOrder(c.row.original.id)} onClick={(e) => e.stopPropagation()}>
            {c.getValue()}
          </Link>
        ),
      }),
      col.accessor('customer', { header: t('search.col.customer') }),
      col.accessor('title', { header: t('search.col.title') }),
      col.accessor('stage', {
        header: t('search.col.stage'),
        cell: (c) => <span title={stageNote(c.row.original.stageTextCode)}>{stageName(c.getValue())}</span>,
      }),
      col.accessor((o) => o.shippedAt ?? o.projectedShipAt ?? '', { id: 'ship', header: t('search.col.ships'), cell: (c) => <When o={c.row.original} /> }),
      col.accessor('dueDate', { header: t('search.col.due'), cell: (c) => dueDay(c.getValue()) }),
      col.accessor((o) => o.trackingNumbers.join(', '), {
        id: 'tracking',
        header: t('search.col.tracking'),
        cell: (c) => <span className="font-mono">{c.getValue() || '—'}</span>,
      }),
    ],
    [t, stageName, stageNote],
  );
}

export function Component() {
  const [params, setParams] = useSearchParams();
  const [text, setText] = useState(params.get('q') ?? '');
  const q = useDeferredValue(text.trim());
  const result = useSalesSearch(q);
  const navigate = useNavigate();
  const { t } = useTranslation('projections');
  const { t: ts } = useTranslation('sales');
  const stageName = useStageName();
  const columns = useColumns();
  const role = useMe().data?.user.role;
  return (
    <>
      <PageHeader
        title={ts('search.title')}
        subtitle={ts('search.subtitle')}
        actions={
          role && WHAT_IF.includes(role) ? (
            <Link
              className="inline-flex min-h-11 items-center gap-2 rounded-lg border-2 border-harbour-800 bg-white px-4 font-bold text-harbour-800"
              to={paths.salesWhatIf}
            >
              <CalendarClock className="h-5 w-5" aria-hidden /> {t('whatIf.pageTitle')}
            </Link>
          ) : undefined
        }
      />
      <form
        role="search"
        className="mb-4 flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          setParams(text.trim() ? { q: text.trim() } : {}, { replace: true });
        }}
      >
        <label className="flex w-full max-w-xl flex-col gap-1 font-bold">
          {ts('search.find')}
          <input
            type="search"
            value={text}
            onChange={(e) => setText(e.target.value)}
            placeholder={ts('search.placeholder')}
            className="min-h-12 rounded-lg border-2 border-harbour-100 bg-white px-3 text-lg font-normal"
            autoFocus
          />
        </label>
      </form>
      {result.isPending ? (
        <Loading />
      ) : result.error ? (
        <ErrorPanel message={errorText(result.error)} />
      ) : (
        <>
          <ul className="flex flex-col gap-3 md:hidden" aria-label={ts('search.caption')}>
            {result.data.map((o) => (
              <li key={o.id}>
                <Link to={paths.salesOrder(o.id)} className="block rounded-xl border border-harbour-100 bg-white p-4">
                  <span className="flex items-baseline justify-between gap-2">
                    <span className="font-bold text-harbour-700 underline">{o.number}</span>
                    <When o={o} />
                  </span>
                  <span className="mt-1 block font-bold">{o.customer}</span>
                  <span className="block text-harbour-700">{o.title}</span>
                  <span className="mt-1 block">{stageName(o.stage)}</span>
                </Link>
              </li>
            ))}
            {result.data.length === 0 && <li className="text-harbour-700">{ts('search.noMatch', { q })}</li>}
          </ul>
          <div className="hidden md:block">
            <DataTable
              data={result.data}
              columns={columns}
              caption={ts('search.caption')}
              emptyTitle={q ? ts('search.noMatch', { q }) : ts('search.noOrders')}
              onRowClick={(o) => navigate(paths.salesOrder(o.id))}
            />
          </div>
        </>
      )}
    </>
  );
}
