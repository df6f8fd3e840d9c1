import { useState } from 'react';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { useQueryClient } from '@tanstack/react-query';
import { useTranslation } from 'react-i18next';
import { Ban, Copy, Pause, Pencil, Play, Printer, RefreshCw } from 'lucide-react';
import { COSTING_READERS, FLOOR_LEADS, PLANNING } from '@shared/domain/access';
import type { TravellerSummary } from '@shared/schemas/orders';
import { queryClient } from '@/lib/query-client';
import { orderQueryOptions, useOrder } from '@/features/orders/api/get-order';
import { ordersKeys } from '@/features/orders/api/orders-keys';
import { useUpdateOrder } from '@/features/orders/api/save-order';
import { useOrderStatus } from '@/features/orders/api/order-status';
import { OrderForm } from '@/features/orders/components/order-form';
import { GatesPanel } from '@/features/orders/components/gates-panel';
import { RoutingEditor } from '@/features/orders/components/routing-editor';
import { ReleasePanel } from '@/features/orders/components/release-panel';
import { TravellersPanel } from '@/features/orders/components/travellers-panel';
import { HistoryList, SpecCard } from '@/features/orders/components/spec-card';
import { CostingCard } from '@/features/costing/components/costing-card';
import { DateHistoryChart } from '@/features/projections/components/date-history-chart';
import { ProjectedP85 } from '@/features/projections/components/projected-p85';
import { useReprint } from '@/features/trays/api/tray-actions';
import { trayPdfUrl } from '@/features/trays/api/get-tray';
import { useMe } from '@/features/auth/api/get-me';
import { Button } from '@/components/ui/button';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { paths } from '@/config/paths';
import { errorText } from '@/lib/error-text';

export const handle = { roles: FLOOR_LEADS };
export const loader = ({ params }: LoaderFunctionArgs) => queryClient.ensureQueryData(orderQueryOptions(params.id!));

function TravellerActions({ t, onChanged }: { t: TravellerSummary; onChanged: () => void }) {
  const { t: tr } = useTranslation('orders');
  const reprint = useReprint(onChanged);
  if (t.phase === 'merged') return <span className="text-sm text-harbour-700">{tr('detail.merged')}</span>;
  return (
    <span className="flex flex-wrap gap-1">
      <a
        className="inline-flex min-h-11 items-center gap-1 rounded-lg px-2 font-bold text-harbour-800 hover:bg-harbour-50"
        href={trayPdfUrl(t.id)}
        download
        aria-label={tr('detail.printN', { number: t.number })}
      >
        <Printer className="h-5 w-5" aria-hidden /> {tr('detail.print')}
      </a>
      <Button
        variant="ghost"
        aria-label={tr('detail.reprintN', { number: t.number })}
        disabled={reprint.isPending}
        onClick={() => {
          if (window.confirm(tr('detail.reprintConfirm', { number: t.number, revision: t.revision }))) reprint.mutate(t.id);
        }}
      >
        <RefreshCw className="h-5 w-5" aria-hidden /> {tr('detail.reprint')}
      </Button>
    </span>
  );
}

export function Component() {
  const { id } = useParams();
  const { t } = useTranslation(['orders', 'common']);
  const order = useOrder(id!);
  const me = useMe();
  const qc = useQueryClient();
  const [editing, setEditing] = useState(false);
  const update = useUpdateOrder(id!);
  const status = useOrderStatus(id!);
  if (order.isPending || !me.data) return <Loading />;
  if (order.error) return <ErrorPanel message={errorText(order.error)} />;
  const o = order.data;
  const role = me.data.user.role;
  const mayPlan = PLANNING.includes(role);
  const released = o.releasedAt != null;
  const refresh = () => qc.invalidateQueries({ queryKey: ordersKeys.all });

  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={t('detail.title', { number: o.number })}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            {o.customer.name} · {o.spec.title} · {t(`common:process.${o.spec.process}`)}
            <Pill tone={o.openGates.length ? 'warn' : 'info'}>{t(`common:status.${o.status}`)}</Pill>
            {o.late && <Pill tone="stop">{t('detail.late')}</Pill>}
          </span>
        }
        actions={
          mayPlan && (
            <>
              {!released && !editing && o.status !== 'cancelled' && (
                <Button variant="secondary" onClick={() => setEditing(true)}>
                  <Pencil className="h-5 w-5" aria-hidden /> {t('detail.changeSpec')}
                </Button>
              )}
              {!released && o.status === 'on_hold' && (
                <Button variant="secondary" disabled={status.isPending} onClick={() => status.mutate({ action: 'resume' })}>
                  <Play className="h-5 w-5" aria-hidden /> {t('detail.liftHold')}
                </Button>
              )}
              {!released && o.status !== 'on_hold' && o.status !== 'cancelled' && (
                <Button
                  variant="ghost"
                  disabled={status.isPending}
                  onClick={() => {
                    const reason = window.prompt(t('detail.holdWhy'));
                    if (reason) status.mutate({ action: 'hold', reason });
                  }}
                >
                  <Pause className="h-5 w-5" aria-hidden /> {t('detail.hold')}
                </Button>
              )}
              {!released && o.status !== 'cancelled' && (
                <Button
                  variant="ghost"
                  disabled={status.isPending}
                  onClick={() => {
                    const reason = window.prompt(t('detail.cancelWhy', { number: o.number }));
                    if (reason) status.mutate({ action: 'cancel', reason });
                  }}
                >
                  <Ban className="h-5 w-5" aria-hidden /> {t('detail.cancel')}
                </Button>
              )}
              <Link
                className="inline-flex min-h-11 items-center gap-2 rounded-lg px-4 font-bold text-harbour-800 hover:bg-harbour-50"
                to={`${paths.newOrder}?repeat=${o.id}`}
              >
                <Copy className="h-5 w-5" aria-hidden /> {t('detail.repeat')}
              </Link>
            </>
          )
        }
      />
      {status.error && <ErrorPanel title={t('detail.notChanged')} message={errorText(status.error)} />}
      {o.holdReason && (o.status === 'on_hold' || o.status === 'cancelled') && (
        <div role="status" className="rounded-xl border-2 border-stop-700/40 bg-stop-50 p-4 font-bold text-stop-700">
          {t(o.status === 'on_hold' ? 'detail.onHold' : 'detail.cancelled', { reason: o.holdReason })}
        </div>
      )}
      {editing ? (
        <Card>
          <h2 className="mb-4 text-xl font-bold text-harbour-900">{t('detail.editTitle')}</h2>
          <OrderForm
            initial={{ ...o.spec, customer: o.customer.name }}
            submitLabel={t('detail.saveChanges')}
            pending={update.isPending}
            error={update.error ? errorText(update.error) : undefined}
            onSubmit={(spec) => {
              const { reorderOf: _r, ...patch } = spec;
              void _r;
              update.mutate(patch, { onSuccess: () => setEditing(false) });
            }}
            onCancel={() => setEditing(false)}
          />
        </Card>
      ) : (
        <SpecCard order={o} projected={released && <ProjectedP85 orderId={o.id} />} />
      )}
      {(!released || o.payments.length > 0 || o.proofs.length > 0) && mayPlan && <GatesPanel order={o} role={role} />}
      <RoutingEditor order={o} canEdit={mayPlan} />
      {!released && mayPlan && o.status !== 'cancelled' && <ReleasePanel order={o} />}
      {released && <TravellersPanel order={o} actions={(t) => <TravellerActions t={t} onChanged={refresh} />} />}
      {released && (
        <Card>
          <DateHistoryChart orderId={o.id} />
        </Card>
      )}
      {COSTING_READERS.includes(role) && <CostingCard orderId={o.id} />}
      <HistoryList entries={o.history} />
    </div>
  );
}
