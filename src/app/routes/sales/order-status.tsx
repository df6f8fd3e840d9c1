import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { SALES_VIEW, SHARE_LINKS, SHIPPING } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { salesOrderQueryOptions, useSalesOrder } from '@/features/sales/api/get-sales-order';
import { useMe } from '@/features/auth/api/get-me';
import { ShareLinkPanel } from '@/features/sales/components/share-link-panel';
import { ContactForm } from '@/features/sales/components/contact-form';
import { SendProof } from '@/features/sales/components/send-proof';
import { ShipmentsTable } from '@/features/shipping/components/shipments-table';
import { StageLine } from '@/components/ui/stage-line';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { paths } from '@/config/paths';
import { DateHistoryChart } from '@/features/projections/components/date-history-chart';
import { ProjectedP85 } from '@/features/projections/components/projected-p85';
import { formatDate, formatDateTime, formatDueDay } from '@/lib/datetime';
import { useTranslation } from 'react-i18next';
import { errorText } from '@/lib/error-text';
import { useStageName } from '@/features/sales/stage-name';
import { useStageNote } from '@/features/sales/stage-note';
import { useProjectionNote } from '@/lib/projection-note';
import type { HistoryEntry } from '@shared/schemas/shipping';

export const handle = { roles: SALES_VIEW };
export const loader = ({ params }: LoaderFunctionArgs) => queryClient.ensureQueryData(salesOrderQueryOptions(params.id!));

const longDate = (iso: string) => formatDate(iso);
const when = (iso: string) => formatDateTime(iso);

export function Component() {
  const { id = '' } = useParams();
  const order = useSalesOrder(id);
  const me = useMe();
  const role = me.data?.user.role;
  const { t } = useTranslation('sales');
  const stageName = useStageName();
  const stageNote = useStageNote();
  const projectionNote = useProjectionNote();
  const historyLine = (h: HistoryEntry) => {
    const p = h.params;
    const key =
      h.code === 'tray_hold' && p.note
        ? 'tray_hold_note'
        : h.code === 'tray_scrap' && p.reason
          ? 'tray_scrap_reason'
          : h.code === 'shipment' && p.short
            ? 'shipment_short'
            : h.code;
    return t(`history.${key}`, { ...p, ...(h.code === 'released' ? { count: Number(p.trays) } : {}), defaultValue: h.what });
  };
  if (order.isPending) return <Loading />;
  if (order.error) return <ErrorPanel message={errorText(order.error)} />;
  const o = order.data;
  const canShare = !!role && SHARE_LINKS.includes(role);
  const canShip = !!role && SHIPPING.includes(role);
  const q = o.quantities;
  return (
    <>
      <PageHeader
        title={`${o.number}: ${o.title}`}
        subtitle={o.customer}
        actions={
          <>
            {o.late && <Pill tone="stop">{t('order.late')}</Pill>}
            {canShip && (
              <Link
                className="inline-flex min-h-11 items-center rounded-lg border-2 border-harbour-800 bg-white px-4 font-bold text-harbour-800"
                to={paths.dispatchOrder(o.id)}
              >
                {t('order.packAndShip')}
              </Link>
            )}
          </>
        }
      />
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="flex flex-col gap-6">
          <Card>
            <h2 className="text-xl font-bold">{t('order.whereItStands')}</h2>
            <p className="mt-2 text-lg" data-testid="stage-text">
              {stageNote(o.stageTextCode)}
            </p>
            <div className="mt-4 grid grid-cols-[minmax(0,1fr)] gap-6 md:grid-cols-2">
              <StageLine stages={o.stages.map((s) => ({ ...s, name: stageName(s.name) }))} current={stageName(o.stage)} />
              <div>
                <h3 className="font-bold text-harbour-700">{o.shippedAt ? t('order.shipped') : t('order.projected')}</h3>
                <p className="text-2xl font-bold" data-testid="projected-ship-date">
                  {o.shippedAt ? longDate(o.shippedAt) : o.projectedShipAt ? longDate(o.projectedShipAt) : t('order.notYet')}
                </p>
                {!o.shippedAt && o.projectedShipAt && <ProjectedP85 orderId={o.id} />}
                <p className="mt-1 text-sm text-harbour-700">{projectionNote(o.projectionNoteCode)}</p>
                <p className="mt-3">
                  {t('order.due')} <span className="font-bold">{formatDueDay(o.dueDate)}</span>
                  {o.late && !o.shippedAt && <span className="font-bold text-stop-700">{t('order.afterDue')}</span>}
                </p>
              </div>
            </div>
          </Card>
          {q && (
            <Card>
              <h2 className="mb-2 text-xl font-bold">{t('order.quantities')}</h2>
              <dl className="grid grid-cols-2 gap-x-6 gap-y-1 md:grid-cols-3">
                <dt className="text-harbour-700">{t('order.ordered')}</dt>
                <dd className="font-bold md:col-span-2">{t('order.orderedValue', { ordered: q.ordered, max: q.maxExpected, pct: q.overrunPct })}</dd>
                <dt className="text-harbour-700">{t('order.finished')}</dt>
                <dd className="font-bold md:col-span-2">{q.finished}</dd>
                <dt className="text-harbour-700">{t('order.onFloor')}</dt>
                <dd className="font-bold md:col-span-2">{q.onFloor}</dd>
                <dt className="text-harbour-700">{t('order.shippedQty')}</dt>
                <dd className="font-bold md:col-span-2">{q.shipped}</dd>
              </dl>
              {q.needsDecision && (
                <p className="mt-3 rounded-lg border-2 border-warn-700 bg-warn-50 p-3 font-bold text-warn-700">{t('order.under', { short: q.shortBy })}</p>
              )}
            </Card>
          )}
          {!o.shippedAt && o.projectedShipAt && (
            <Card>
              <DateHistoryChart orderId={o.id} />
            </Card>
          )}
          <Card>
            <h2 className="mb-2 text-xl font-bold">{t('order.shipments')}</h2>
            <ShipmentsTable orderId={o.id} shipments={o.shipments} />
          </Card>
          <Card>
            <h2 className="mb-2 text-xl font-bold">{t('order.history')}</h2>
            <ol className="flex flex-col gap-1">
              {o.history.map((h, i) => (
                <li key={i} className="grid grid-cols-1 gap-x-3 sm:grid-cols-[11rem_1fr] border-t border-harbour-100 py-1 first:border-t-0">
                  <span className="text-sm text-harbour-700">{when(h.at)}</span>
                  <span>
                    {historyLine(h)}
                    {h.who && <span className="text-harbour-700"> · {h.who}</span>}
                  </span>
                </li>
              ))}
            </ol>
          </Card>
        </div>
        <div className="flex flex-col gap-6">
          <Card>
            <h2 className="mb-2 text-xl font-bold">{t('order.statusLink')}</h2>
            {canShare ? (
              <ShareLinkPanel orderId={o.id} links={o.shareLinks} disabled={o.status === 'cancelled'} />
            ) : (
              <p className="text-harbour-700">{t('order.whoMakesLinks')}</p>
            )}
          </Card>
          {canShare && (
            <>
              <Card>
                <h2 className="mb-2 text-xl font-bold">{t('order.whoHears')}</h2>
                <ContactForm order={o} />
              </Card>
              <Card>
                <h2 className="mb-2 text-xl font-bold">{t('order.proof')}</h2>
                <SendProof order={o} />
              </Card>
            </>
          )}
        </div>
      </div>
    </>
  );
}
