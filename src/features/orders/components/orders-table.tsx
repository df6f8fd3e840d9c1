import { useMemo, useState } from 'react';
import { Link, useNavigate } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import type { OrderListItem } from '@shared/schemas/orders';
import { ORDER_STATUSES, PROCESSES } from '@shared/domain/vocabulary';
import { DataTable } from '@/components/ui/data-table';
import { Pill } from '@/components/ui/panels';
import { CheckboxField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { formatDate, humanise, ORDER_STATUS_LABELS } from '@/lib/labels';

const col = createColumnHelper<OrderListItem>();

const statusTone = (s: OrderListItem['status']) =>
  s === 'shipped' ? 'ok' : s === 'on_hold' || s === 'cancelled' ? 'stop' : s === 'awaiting_payment' || s === 'awaiting_proof' ? 'warn' : s === 'draft' ? 'info' : 'neutral';

const columns = [
  col.accessor('number', {
    header: 'Order',
    cell: (c) => (
      <Link className="font-bold text-harbour-800 underline" to={paths.order(c.row.original.id)} onClick={(e) => e.stopPropagation()}>
        {c.getValue()}
      </Link>
    ),
    sortingFn: (a, b) => Number(a.original.number) - Number(b.original.number),
  }),
  col.accessor('customer', { header: 'Customer' }),
  col.accessor('title', { header: 'Title' }),
  col.accessor('process', { header: 'Process', cell: (c) => humanise(c.getValue()) }),
  col.accessor('quantity', { header: 'Qty' }),
  col.accessor('status', { header: 'Status', cell: (c) => <Pill tone={statusTone(c.getValue())}>{ORDER_STATUS_LABELS[c.getValue()]}</Pill> }),
  col.accessor('dueDate', { header: 'Due', cell: (c) => formatDate(`${c.getValue()}T12:00:00Z`) }),
  col.accessor('projectedShipAt', { header: 'Projected ship', cell: (c) => formatDate(c.getValue()), sortUndefined: 'last' }),
  col.accessor('late', { header: 'Late', cell: (c) => (c.getValue() ? <Pill tone="stop">Late</Pill> : '') }),
  col.accessor('trays', { header: 'Trays' }),
];

const select = 'min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2 font-normal';

/** Orders with filters by status, process, customer, due date and lateness, plus a quick search. */
export function OrdersTable({ orders }: { orders: OrderListItem[] }) {
  const navigate = useNavigate();
  const [status, setStatus] = useState('');
  const [process, setProcess] = useState('');
  const [customer, setCustomer] = useState('');
  const [dueBy, setDueBy] = useState('');
  const [lateOnly, setLateOnly] = useState(false);
  const customers = useMemo(() => [...new Set(orders.map((o) => o.customer))].sort(), [orders]);
  const rows = useMemo(
    () =>
      orders.filter(
        (o) =>
          (!status || (status === 'open_gates' ? o.openGates.length > 0 : o.status === status)) &&
          (!process || o.process === process) &&
          (!customer || o.customer === customer) &&
          (!dueBy || o.dueDate <= dueBy) &&
          (!lateOnly || o.late),
      ),
    [orders, status, process, customer, dueBy, lateOnly],
  );
  return (
    <DataTable
      data={rows}
      columns={columns}
      filterLabel="Search orders"
      caption="Orders"
      emptyTitle="No order matches"
      onRowClick={(o) => navigate(paths.order(o.id))}
      initialSorting={[{ id: 'number', desc: true }]}
      toolbar={
        <>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Status
            <select className={select} value={status} onChange={(e) => setStatus(e.target.value)}>
              <option value="">Any</option>
              <option value="open_gates">Payment or proof missing</option>
              {ORDER_STATUSES.map((s) => (
                <option key={s} value={s}>
                  {ORDER_STATUS_LABELS[s]}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Process
            <select className={select} value={process} onChange={(e) => setProcess(e.target.value)}>
              <option value="">Any</option>
              {PROCESSES.map((p) => (
                <option key={p} value={p}>
                  {humanise(p)}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Customer
            <select className={select} value={customer} onChange={(e) => setCustomer(e.target.value)}>
              <option value="">Any</option>
              {customers.map((c) => (
                <option key={c} value={c}>
                  {c}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Due by
            <input type="date" className={select} value={dueBy} onChange={(e) => setDueBy(e.target.value)} />
          </label>
          <CheckboxField label="Late only" checked={lateOnly} onChange={(e) => setLateOnly(e.target.checked)} />
          <span role="status" className="self-center text-sm text-harbour-700">
            {rows.length} of {orders.length} orders
          </span>
        </>
      }
    />
  );
}
