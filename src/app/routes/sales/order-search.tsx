import { useDeferredValue, useState } from 'react';
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

export const handle = { roles: SALES_VIEW };
export const loader = ({ request }: { request: Request }) =>
  queryClient.ensureQueryData(salesSearchQueryOptions(new URL(request.url).searchParams.get('q') ?? ''));

const day = (iso: string | null) => formatDate(iso);
const dueDay = (d: string) => formatDueDay(d);

function When({ o }: { o: SalesOrderRow }) {
  if (o.shippedAt) return <Pill tone="ok">Shipped {day(o.shippedAt)}</Pill>;
  if (o.status === 'cancelled') return <Pill tone="neutral">Cancelled</Pill>;
  return (
    <span className="flex flex-wrap items-center gap-2">
      <span className="font-bold">{day(o.projectedShipAt)}</span>
      {o.late && <Pill tone="stop">Late</Pill>}
    </span>
  );
}

const col = createColumnHelper<SalesOrderRow>();
const columns = [
  col.accessor('number', {
    header: 'Order',
    cell: (c) => (
      <Link className="font-bold text-harbour-700 underline" to={paths.salesOrder(c.row.original.id)} onClick={(e) => e.stopPropagation()}>
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor('customer', { header: 'Customer' }),
  col.accessor('title', { header: 'Title' }),
  col.accessor('stage', { header: 'Stage', cell: (c) => <span title={c.row.original.stageText}>{c.getValue()}</span> }),
  col.accessor((o) => o.shippedAt ?? o.projectedShipAt ?? '', { id: 'ship', header: 'Ships', cell: (c) => <When o={c.row.original} /> }),
  col.accessor('dueDate', { header: 'Due', cell: (c) => dueDay(c.getValue()) }),
  col.accessor((o) => o.trackingNumbers.join(', '), { id: 'tracking', header: 'Tracking', cell: (c) => <span className="font-mono">{c.getValue() || '—'}</span> }),
];

export function Component() {
  const [params, setParams] = useSearchParams();
  const [text, setText] = useState(params.get('q') ?? '');
  const q = useDeferredValue(text.trim());
  const result = useSalesSearch(q);
  const navigate = useNavigate();
  const { t } = useTranslation('projections');
  const role = useMe().data?.user.role;
  return (
    <>
      <PageHeader
        title="Order status"
        subtitle="Find any order by number, customer or title: where it stands, when it ships, and how it travels."
        actions={
          role && WHAT_IF.includes(role) ? (
            <Link className="inline-flex min-h-11 items-center gap-2 rounded-lg border-2 border-harbour-800 bg-white px-4 font-bold text-harbour-800" to={paths.salesWhatIf}>
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
          Find an order
          <input
            type="search"
            value={text}
            onChange={(e) => setText(e.target.value)}
            placeholder="Order number, customer or title"
            className="min-h-12 rounded-lg border-2 border-harbour-100 bg-white px-3 text-lg font-normal"
            autoFocus
          />
        </label>
      </form>
      {result.isPending ? (
        <Loading />
      ) : result.error ? (
        <ErrorPanel message={result.error.message} />
      ) : (
        <>
          <ul className="flex flex-col gap-3 md:hidden" aria-label="Orders">
            {result.data.map((o) => (
              <li key={o.id}>
                <Link to={paths.salesOrder(o.id)} className="block rounded-xl border border-harbour-100 bg-white p-4">
                  <span className="flex items-baseline justify-between gap-2">
                    <span className="font-bold text-harbour-700 underline">{o.number}</span>
                    <When o={o} />
                  </span>
                  <span className="mt-1 block font-bold">{o.customer}</span>
                  <span className="block text-harbour-700">{o.title}</span>
                  <span className="mt-1 block">{o.stage}</span>
                </Link>
              </li>
            ))}
            {result.data.length === 0 && <li className="text-harbour-700">No order matches “{q}”.</li>}
          </ul>
          <div className="hidden md:block">
            <DataTable data={result.data} columns={columns} caption="Orders" emptyTitle={q ? `No order matches “${q}”` : 'No orders yet'} onRowClick={(o) => navigate(paths.salesOrder(o.id))} />
          </div>
        </>
      )}
    </>
  );
}
