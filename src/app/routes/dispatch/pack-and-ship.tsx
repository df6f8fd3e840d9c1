import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { Trash2 } from 'lucide-react';
import { SHIPPING } from '@shared/domain/access';
import type { StationKind } from '@shared/domain/vocabulary';
import { useTranslation } from 'react-i18next';
import type { TrayOnFloor } from '@shared/schemas/shipping';
import { queryClient } from '@/lib/query-client';
import { packingQueryOptions, usePacking } from '@/features/shipping/api/get-packing';
import { useRemoveCarton } from '@/features/shipping/api/pack-cartons';
import { PackCartonsForm } from '@/features/shipping/components/pack-cartons-form';
import { ShipmentForm } from '@/features/shipping/components/shipment-form';
import { ShipmentsTable } from '@/features/shipping/components/shipments-table';
import { Button } from '@/components/ui/button';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { paths } from '@/config/paths';
import { formatDueDay } from '@/lib/datetime';
import { errorText } from '@/lib/error-text';

export const handle = { roles: SHIPPING };
export const loader = ({ params }: LoaderFunctionArgs) => queryClient.ensureQueryData(packingQueryOptions(params.id!));

function Trays({ trays, empty }: { trays: TrayOnFloor[]; empty: string }) {
  const { t } = useTranslation('shipping');
  const { t: tc } = useTranslation('common');
  if (trays.length === 0) return <p className="text-harbour-700">{empty}</p>;
  return (
    <table className="w-full text-left">
      <caption className="sr-only">{t('pack.trays')}</caption>
      <thead className="sr-only">
        <tr>
          <th scope="col">{t('pack.tray')}</th>
          <th scope="col">{t('pack.pieces')}</th>
          <th scope="col">{t('pack.where')}</th>
        </tr>
      </thead>
      <tbody>
        {trays.map((tray) => (
          <tr key={tray.id} className="border-t border-harbour-100 first:border-t-0">
            <td className="py-2 pr-3 font-mono font-bold">{tray.number}</td>
            <td className="py-2 pr-3 text-right">{t('pack.trayPieces', { count: tray.quantity })}</td>
            <td className="py-2">
              {tray.phase === 'done'
                ? t('pack.dispatched')
                : tray.stationKind
                  ? t('pack.at', { station: tc(`kind.${tray.stationKind as StationKind}`) })
                  : tc(`phase.${tray.phase as 'waiting'}`, { defaultValue: tray.phase })}
              {tray.onHold && (
                <span className="ml-2">
                  <Pill tone="stop">{t('pack.trayOnHold')}</Pill>
                </span>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function Component() {
  const { id = '' } = useParams();
  const packing = usePacking(id);
  const remove = useRemoveCarton(id);
  const { t } = useTranslation('shipping');
  if (packing.isPending) return <Loading />;
  if (packing.error) return <ErrorPanel message={errorText(packing.error)} />;
  const v = packing.data;
  const q = v.quantities;
  const closed = v.order.status === 'cancelled' || v.order.status === 'on_hold';
  return (
    <>
      <PageHeader
        title={t('pack.title', { number: v.order.number })}
        subtitle={
          <>
            {v.order.customer}: {v.order.title}. {t('pack.due', { date: formatDueDay(v.order.dueDate) })}{' '}
            <Link className="font-bold underline" to={paths.salesOrder(v.order.id)}>
              {t('pack.orderStatus')}
            </Link>
          </>
        }
        actions={v.shipped ? <Pill tone="ok">{t('pack.shipped')}</Pill> : undefined}
      />
      <div className="mb-6 grid grid-cols-2 gap-3 md:grid-cols-5" aria-label={t('pack.quantities')}>
        {[
          [t('pack.ordered'), q.ordered],
          [t('pack.finished'), q.finished],
          [t('pack.onFloor'), q.onFloor],
          [t('pack.inCartons'), q.inCartons],
          [t('pack.shippedQty'), q.shipped],
        ].map(([label, n]) => (
          <Card key={label as string} className="!p-3">
            <p className="text-sm text-harbour-700">{label}</p>
            <p className="text-2xl font-bold">{n}</p>
          </Card>
        ))}
      </div>
      {q.verdict === 'over_allowance' && (
        <p className="mb-4 rounded-lg border-2 border-warn-700 bg-warn-50 p-3 font-bold text-warn-700">
          {t('pack.over', { over: q.overBy, pct: q.overrunPct, max: q.maxExpected })}
        </p>
      )}
      {closed && <ErrorPanel title={t('pack.notForShipping')} message={v.order.status === 'on_hold' ? t('pack.onHold') : t('pack.cancelled')} />}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-2">
        <div className="flex flex-col gap-6">
          <Card>
            <h2 className="mb-3 text-xl font-bold">{t('pack.recordShipment')}</h2>
            {q.availableToShip > 0 && !closed ? <ShipmentForm view={v} /> : <p className="text-harbour-700">{t('pack.nothingToShip')}</p>}
          </Card>
          <Card>
            <h2 className="mb-3 text-xl font-bold">{t('pack.packCartons')}</h2>
            {v.cartons.length > 0 && (
              <ul className="mb-4 flex flex-col divide-y divide-harbour-100" aria-label={t('pack.packedCartons')}>
                {v.cartons.map((c) => (
                  <li key={c.id} className="flex items-center justify-between gap-2 py-1">
                    <span>
                      {c.weightKg != null
                        ? t('pack.cartonLineKg', { count: c.count, per: c.piecesPerCarton, kg: c.weightKg })
                        : t('pack.cartonLine', { count: c.count, per: c.piecesPerCarton })}
                    </span>
                    <Button variant="ghost" aria-label={t('pack.takeApart', { count: c.count, per: c.piecesPerCarton })} onClick={() => remove.mutate(c.id)}>
                      <Trash2 className="h-5 w-5" aria-hidden />
                    </Button>
                  </li>
                ))}
              </ul>
            )}
            {!closed && <PackCartonsForm orderId={v.order.id} available={Math.max(0, q.availableToShip - q.inCartons)} />}
          </Card>
        </div>
        <div className="flex flex-col gap-6">
          <Card>
            <h2 className="mb-3 text-xl font-bold">{t('pack.stillOnFloor')}</h2>
            <Trays trays={v.onFloor} empty={t('pack.allPacked')} />
          </Card>
          <Card>
            <h2 className="mb-3 text-xl font-bold">{t('pack.packedTrays')}</h2>
            <Trays trays={v.packedTrays} empty={t('pack.noneFinished')} />
          </Card>
          <Card>
            <h2 className="mb-3 text-xl font-bold">{t('pack.shipments')}</h2>
            <ShipmentsTable orderId={v.order.id} shipments={v.shipments} />
          </Card>
        </div>
      </div>
    </>
  );
}
