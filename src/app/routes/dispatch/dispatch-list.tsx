import { useDeferredValue, useState } from 'react';
import { Link, useNavigate } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import type { DispatchRow } from '@shared/schemas/shipping';
import { SHIPPING } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { dispatchOrdersQueryOptions, useDispatchOrders } from '@/features/shipping/api/get-dispatch-orders';
import { DataTable } from '@/components/ui/data-table';
import { ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { paths } from '@/config/paths';

export const handle = { roles: SHIPPING };
export const loader = () => queryClient.ensureQueryData(dispatchOrdersQueryOptions(''));

const col = createColumnHelper<DispatchRow>();
const columns = [
  col.accessor('number', {
    header: 'Order',
    cell: (c) => (
      <Link className="font-bold text-harbour-700 underline" to={paths.dispatchOrder(c.row.original.id)} onClick={(e) => e.stopPropagation()}>
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor('customer', { header: 'Customer' }),
  col.accessor('title', { header: 'Title' }),
  col.accessor('dueDate', { header: 'Due' }),
  col.accessor('availableToShip', { header: 'Ready to ship', cell: (c) => <span className="font-bold">{c.getValue()}</span> }),
  col.accessor('inCartons', { header: 'In cartons' }),
  col.accessor('onFloor', { header: 'Still on the floor' }),
  col.accessor('shipped', { header: 'Shipped' }),
  col.display({ id: 'flags', header: 'Check', cell: (c) => (c.row.original.needsDecision ? <Pill tone="warn">Under quantity</Pill> : null) }),
];

export function Component() {
  const [text, setText] = useState('');
  const q = useDeferredValue(text.trim());
  const list = useDispatchOrders(q);
  const navigate = useNavigate();
  return (
    <>
      <PageHeader title="Packing and dispatch" subtitle="Orders with finished pieces or trays near packing. Pick one to pack cartons and record shipments." />
      <label className="mb-4 flex max-w-xl flex-col gap-1 font-bold">
        Find another order
        <input type="search" value={text} onChange={(e) => setText(e.target.value)} placeholder="Order number, customer or title" className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-3 font-normal" />
      </label>
      {list.isPending ? (
        <Loading />
      ) : list.error ? (
        <ErrorPanel message={list.error.message} />
      ) : (
        <DataTable data={list.data} columns={columns} caption="Orders for packing and dispatch" emptyTitle={q ? `No order matches “${q}”` : 'Nothing is waiting for packing'} onRowClick={(o) => navigate(paths.dispatchOrder(o.id))} />
      )}
    </>
  );
}
