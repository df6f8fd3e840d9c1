import { useDeferredValue, useMemo, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Link, useNavigate } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import type { DispatchRow } from '@shared/schemas/shipping';
import { SHIPPING } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { dispatchOrdersQueryOptions, useDispatchOrders } from '@/features/shipping/api/get-dispatch-orders';
import { DataTable } from '@/components/ui/data-table';
import { ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { paths } from '@/config/paths';
import { formatDueDay } from '@/lib/datetime';
import { errorText } from '@/lib/error-text';

export const handle = { roles: SHIPPING };
export const loader = () => queryClient.ensureQueryData(dispatchOrdersQueryOptions(''));

const col = createColumnHelper<DispatchRow>();
function useColumns() {
  const { t } = useTranslation('shipping');
  return useMemo(
    () => [
      col.accessor('number', {
        header: t('list.col.number'),
        cell: (c) => (
          <Link className="font-bold text-harbour-700 underline" to={paths.dispatchOrder(c.row.original.id)} onClick={(e) => e.stopPropagation()}>
            {c.getValue()}
          </Link>
        ),
      }),
      col.accessor('customer', { header: t('list.col.customer') }),
      col.accessor('title', { header: t('list.col.title') }),
      col.accessor('dueDate', { header: t('list.col.due'), cell: (c) => formatDueDay(c.getValue()) }),
      col.accessor('availableToShip', { header: t('list.col.ready'), cell: (c) => <span className="font-bold">{c.getValue()}</span> }),
      col.accessor('inCartons', { header: t('list.col.inCartons') }),
      col.accessor('onFloor', { header: t('list.col.onFloor') }),
      col.accessor('shipped', { header: t('list.col.shipped') }),
      col.display({
        id: 'flags',
        header: t('list.col.check'),
        cell: (c) => (c.row.original.needsDecision ? <Pill tone="warn">{t('list.underQuantity')}</Pill> : null),
      }),
    ],
    [t],
  );
}

export function Component() {
  const [text, setText] = useState('');
  const q = useDeferredValue(text.trim());
  const list = useDispatchOrders(q);
  const navigate = useNavigate();
  const { t } = useTranslation('shipping');
  const columns = useColumns();
  return (
    <>
      <PageHeader title={t('list.title')} subtitle={t('list.subtitle')} />
      <label className="mb-4 flex max-w-xl flex-col gap-1 font-bold">
        {t('list.find')}
        <input
          type="search"
          value={text}
          onChange={(e) => setText(e.target.value)}
          placeholder={t('list.placeholder')}
          className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-3 font-normal"
        />
      </label>
      {list.isPending ? (
        <Loading />
      ) : list.error ? (
        <ErrorPanel message={errorText(list.error)} />
      ) : (
        <DataTable
          data={list.data}
          columns={columns}
          caption={t('list.caption')}
          emptyTitle={q ? t('list.noMatch', { q }) : t('list.nothing')}
          onRowClick={(o) => navigate(paths.dispatchOrder(o.id))}
        />
      )}
    </>
  );
}
