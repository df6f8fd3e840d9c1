import { useMemo } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { useTranslation } from 'react-i18next';
import { createColumnHelper } from '@tanstack/react-table';
import type { OrderListItem } from '@shared/schemas/orders';
import { ORDER_STATUSES, PROCESSES, type Process } from '@shared/domain/vocabulary';
import { actionReasons, orderMatchesSearch } from '@shared/domain/order-search';
import { DataTable } from '@/components/ui/data-table';
import { Pill } from '@/components/ui/panels';
import { CheckboxField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { formatDate, formatDueDay } from '@/lib/labels';

const col = createColumnHelper<OrderListItem>();

const statusTone = (s: OrderListItem['status']) =>
  s === 'shipped'
    ? 'ok'
    : s === 'on_hold' || s === 'cancelled'
      ? 'stop'
      : s === 'awaiting_payment' || s === 'awaiting_proof'
        ? 'warn'
        : s === 'draft'
          ? 'info'
          : 'neutral';

const select = 'min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2 font-normal';

/** The filters live in the address (?status=…&q=…), so a reload or a shared link keeps them. */
export function useOrderFilters() {
  const [params, setParams] = useSearchParams();
  const get = (k: string) => params.get(k) ?? '';
  const set = (k: string, v: string | boolean) =>
    setParams(
      (p) => {
        const next = new URLSearchParams(p);
        if (v === '' || v === false) next.delete(k);
        else next.set(k, v === true ? '1' : v);
        return next;
      },
      { replace: true },
    );
  return {
    q: get('q'),
    status: get('status'),
    process: get('process'),
    customer: get('customer'),
    dueBy: get('due'),
    lateOnly: get('late') === '1',
    view: get('view'),
    set,
  };
}

/** Orders with filters by status, process, customer, due date and lateness, plus a search that also finds tray numbers. */
export function OrdersTable({ orders, showReasons = false }: { orders: OrderListItem[]; showReasons?: boolean }) {
  const { t } = useTranslation(['orders', 'common']);
  const navigate = useNavigate();
  const f = useOrderFilters();
  const processName = (p: string) => ((PROCESSES as readonly string[]).includes(p) ? t(`common:process.${p as Process}`) : p);
  const customers = useMemo(() => [...new Set(orders.map((o) => o.customer))].sort(), [orders]);
  const rows = useMemo(
    () =>
      orders.filter(
        (o) =>
          orderMatchesSearch(o, f.q, processName(o.process)) &&
          (!f.status || (f.status === 'open_gates' ? o.openGates.length > 0 : o.status === f.status)) &&
          (!f.process || o.process === f.process) &&
          (!f.customer || o.customer === f.customer) &&
          (!f.dueBy || o.dueDate <= f.dueBy) &&
          (!f.lateOnly || o.late),
      ),
    // processName follows the language, which t stands for
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [orders, f.q, f.status, f.process, f.customer, f.dueBy, f.lateOnly, t],
  );
  const columns = [
    col.accessor('number', {
      header: t('list.col.number'),
      cell: (c) => (
        <Link className="font-bold text-harbour-800 underline" to={paths.order(c.row.original.id)} onClick={(e) => e.stopPropagation()}>
          {c.getValue()}
        </Link>
      ),
      sortingFn: (a, b) => Number(a.original.number) - Number(b.original.number),
    }),
    col.accessor('customer', { header: t('list.col.customer') }),
    col.accessor('title', { header: t('list.col.title') }),
    col.accessor('process', { header: t('list.col.process'), cell: (c) => processName(c.getValue()) }),
    col.accessor('quantity', { header: t('list.col.quantity') }),
    col.accessor('status', { header: t('list.col.status'), cell: (c) => <Pill tone={statusTone(c.getValue())}>{t(`common:status.${c.getValue()}`)}</Pill> }),
    ...(showReasons
      ? [
          col.display({
            id: 'reasons',
            header: t('list.reasons'),
            cell: (c) => (
              <span className="flex flex-wrap gap-1">
                {actionReasons(c.row.original).map((r) => (
                  <Pill key={r} tone={r === 'late' || r === 'hold' ? 'stop' : r === 'gates' ? 'warn' : 'info'}>
                    {t(`list.reason_${r}`)}
                  </Pill>
                ))}
              </span>
            ),
          }),
        ]
      : []),
    col.accessor('dueDate', { header: t('list.col.due'), cell: (c) => <span className="whitespace-nowrap">{formatDueDay(c.getValue())}</span> }),
    col.accessor('projectedShipAt', {
      header: t('list.col.projected'),
      cell: (c) => <span className="whitespace-nowrap">{formatDate(c.getValue())}</span>,
      sortUndefined: 'last',
    }),
    col.accessor('late', { header: t('list.col.late'), cell: (c) => (c.getValue() ? <Pill tone="stop">{t('list.late')}</Pill> : '') }),
    col.accessor('trays', { header: t('list.col.trays') }),
  ];
  return (
    <DataTable
      data={rows}
      columns={columns}
      filterLabel={t('list.search')}
      search={f.q}
      onSearchChange={(v) => f.set('q', v)}
      searchHint={t('list.searchHint')}
      caption={t('list.caption')}
      emptyTitle={t('list.noMatch')}
      onRowClick={(o) => navigate(paths.order(o.id))}
      initialSorting={[{ id: showReasons ? 'dueDate' : 'number', desc: !showReasons }]}
      toolbar={
        <>
          <label className="flex flex-col gap-1 text-sm font-bold">
            {t('list.status')}
            <select className={select} value={f.status} onChange={(e) => f.set('status', e.target.value)}>
              <option value="">{t('list.any')}</option>
              <option value="open_gates">{t('list.openGates')}</option>
              {ORDER_STATUSES.map((s) => (
                <option key={s} value={s}>
                  {t(`common:status.${s}`)}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            {t('list.process')}
            <select className={select} value={f.process} onChange={(e) => f.set('process', e.target.value)}>
              <option value="">{t('list.any')}</option>
              {PROCESSES.map((p) => (
                <option key={p} value={p}>
                  {t(`common:process.${p}`)}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            {t('list.customer')}
            <select className={select} value={f.customer} onChange={(e) => f.set('customer', e.target.value)}>
              <option value="">{t('list.any')}</option>
              {customers.map((c) => (
                <option key={c} value={c}>
                  {c}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            {t('list.dueBy')}
            <input type="date" className={select} value={f.dueBy} onChange={(e) => f.set('due', e.target.value)} />
          </label>
          <CheckboxField label={t('list.lateOnly')} checked={f.lateOnly} onChange={(e) => f.set('late', e.target.checked)} />
          <span role="status" className="self-center text-sm text-harbour-700">
            {t('list.count', { shown: rows.length, total: orders.length })}
          </span>
        </>
      }
    />
  );
}
