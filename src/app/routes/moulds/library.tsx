import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { errorText } from '@/lib/error-text';
import { Link } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import { FLOOR_LEADS } from '@shared/domain/access';
import type { MouldLibraryItem } from '@shared/schemas/trays';
import { queryClient } from '@/lib/query-client';
import { mouldsQueryOptions, useMoulds, useUpdateMould } from '@/features/moulds/api/get-moulds';
import { useMe } from '@/features/auth/api/get-me';
import { DataTable } from '@/components/ui/data-table';
import { Button } from '@/components/ui/button';
import { ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/labels';

export const handle = { roles: FLOOR_LEADS };
export const loader = () => queryClient.ensureQueryData(mouldsQueryOptions());

const col = createColumnHelper<MouldLibraryItem>();
const tone = (s: MouldLibraryItem['status']) => (s === 'ready' ? 'ok' : s === 'retired' ? 'neutral' : 'warn');

function StorageCell({ mould }: { mould: MouldLibraryItem }) {
  const update = useUpdateMould();
  const { t } = useTranslation('moulds');
  const [value, setValue] = useState(mould.storageLocation ?? '');
  const changed = value !== (mould.storageLocation ?? '');
  return (
    <form
      className="flex items-center gap-2"
      onClick={(e) => e.stopPropagation()}
      onSubmit={(e) => {
        e.preventDefault();
        update.mutate({ id: mould.id, patch: { storageLocation: value.trim() || null } });
      }}
    >
      <input
        aria-label={t('storageOf', { number: mould.number })}
        className="min-h-11 w-36 rounded-lg border-2 border-harbour-100 bg-white px-2"
        value={value}
        placeholder={t('storageExample')}
        onChange={(e) => setValue(e.target.value)}
      />
      {changed && (
        <Button type="submit" variant="secondary" disabled={update.isPending}>
          {t('save')}
        </Button>
      )}
      {update.error && (
        <span role="alert" className="text-sm font-bold text-stop-700">
          {errorText(update.error)}
        </span>
      )}
    </form>
  );
}

function RetireButton({ mould }: { mould: MouldLibraryItem }) {
  const update = useUpdateMould();
  const { t } = useTranslation('moulds');
  const retired = mould.status === 'retired';
  return (
    <Button variant="ghost" disabled={update.isPending} onClick={() => update.mutate({ id: mould.id, patch: { retired: !retired } })}>
      {retired ? t('unretire') : t('retire')}
    </Button>
  );
}

export function Component() {
  const moulds = useMoulds();
  const me = useMe();
  const { t } = useTranslation('moulds');
  const columns = [
    col.accessor('number', { header: t('col.number') }),
    col.accessor('side', { header: t('col.side'), cell: (c) => t(`side.${c.getValue()}`) }),
    col.accessor('status', { header: t('col.state'), cell: (c) => <Pill tone={tone(c.getValue())}>{t(`status.${c.getValue()}`)}</Pill> }),
    col.accessor('storageLocation', { header: t('col.storedAt'), cell: (c) => <StorageCell mould={c.row.original} /> }),
    col.accessor('useCount', { header: t('col.useCount') }),
    col.accessor((m) => m.firstOrder?.customer ?? '', { id: 'customer', header: t('col.customer') }),
    col.accessor((m) => m.firstOrder?.number ?? '', {
      id: 'firstOrder',
      header: t('col.firstOrder'),
      cell: (c) =>
        c.row.original.firstOrder ? (
          <Link className="font-bold text-harbour-800 underline" to={paths.order(c.row.original.firstOrder.id)}>
            {c.row.original.firstOrder.number} · {c.row.original.firstOrder.title}
          </Link>
        ) : (
          '—'
        ),
    }),
    col.accessor('lastUsedAt', { header: t('col.lastUsed'), cell: (c) => formatDate(c.getValue()) }),
    ...(me.data && me.data.user.role !== 'sales'
      ? [col.display({ id: 'retire', header: t('col.actions'), cell: (c) => <RetireButton mould={c.row.original} /> })]
      : []),
  ];
  return (
    <>
      <PageHeader title={t('title')} subtitle={t('subtitle')} />
      {moulds.isPending ? (
        <Loading />
      ) : moulds.error ? (
        <ErrorPanel message={errorText(moulds.error)} />
      ) : (
        <DataTable data={moulds.data} columns={columns} filterLabel={t('filter')} caption={t('caption')} emptyTitle={t('empty')} />
      )}
    </>
  );
}
