import { useState } from 'react';
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
import { formatDate, humanise } from '@/lib/labels';

export const handle = { roles: FLOOR_LEADS };
export const loader = () => queryClient.ensureQueryData(mouldsQueryOptions());

const col = createColumnHelper<MouldLibraryItem>();
const tone = (s: MouldLibraryItem['status']) => (s === 'ready' ? 'ok' : s === 'retired' ? 'neutral' : 'warn');

function StorageCell({ mould }: { mould: MouldLibraryItem }) {
  const update = useUpdateMould();
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
        aria-label={`Storage place of mould ${mould.number}`}
        className="min-h-11 w-36 rounded-lg border-2 border-harbour-100 bg-white px-2"
        value={value}
        placeholder="e.g. Shelf B-4"
        onChange={(e) => setValue(e.target.value)}
      />
      {changed && (
        <Button type="submit" variant="secondary" disabled={update.isPending}>
          Save
        </Button>
      )}
      {update.error && <span role="alert" className="text-sm font-bold text-stop-700">{update.error.message}</span>}
    </form>
  );
}

function RetireButton({ mould }: { mould: MouldLibraryItem }) {
  const update = useUpdateMould();
  const retired = mould.status === 'retired';
  return (
    <Button variant="ghost" disabled={update.isPending} onClick={() => update.mutate({ id: mould.id, patch: { retired: !retired } })}>
      {retired ? 'Put back in use' : 'Retire'}
    </Button>
  );
}

export function Component() {
  const moulds = useMoulds();
  const me = useMe();
  const columns = [
    col.accessor('number', { header: 'Mould' }),
    col.accessor('side', { header: 'Side', cell: (c) => humanise(c.getValue()) }),
    col.accessor('status', { header: 'State', cell: (c) => <Pill tone={tone(c.getValue())}>{humanise(c.getValue())}</Pill> }),
    col.accessor('storageLocation', { header: 'Stored at', cell: (c) => <StorageCell mould={c.row.original} /> }),
    col.accessor('useCount', { header: 'Orders made' }),
    col.accessor((m) => m.firstOrder?.customer ?? '', { id: 'customer', header: 'Customer' }),
    col.accessor((m) => m.firstOrder?.number ?? '', {
      id: 'firstOrder',
      header: 'First order',
      cell: (c) =>
        c.row.original.firstOrder ? (
          <Link className="font-bold text-harbour-800 underline" to={paths.order(c.row.original.firstOrder.id)}>
            {c.row.original.firstOrder.number} · {c.row.original.firstOrder.title}
          </Link>
        ) : (
          '—'
        ),
    }),
    col.accessor('lastUsedAt', { header: 'Last used', cell: (c) => formatDate(c.getValue()) }),
    ...(me.data && me.data.user.role !== 'sales' ? [col.display({ id: 'retire', header: 'Actions', cell: (c) => <RetireButton mould={c.row.original} /> })] : []),
  ];
  return (
    <>
      <PageHeader
        title="Mould library"
        subtitle="Every mould made, where it is stored and how often it was used. A repeat order of the same design reuses its mould and skips engraving."
      />
      {moulds.isPending ? (
        <Loading />
      ) : moulds.error ? (
        <ErrorPanel message={moulds.error.message} />
      ) : (
        <DataTable data={moulds.data} columns={columns} filterLabel="Find a mould, customer or order" caption="Mould library" emptyTitle="No moulds yet: they are made when an order is released" />
      )}
    </>
  );
}
