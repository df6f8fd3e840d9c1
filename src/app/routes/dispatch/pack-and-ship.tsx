import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { Trash2 } from 'lucide-react';
import { SHIPPING } from '@shared/domain/access';
import { STATION_KIND_NAMES } from '@shared/domain/vocabulary';
import type { StationKind } from '@shared/domain/vocabulary';
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

export const handle = { roles: SHIPPING };
export const loader = ({ params }: LoaderFunctionArgs) => queryClient.ensureQueryData(packingQueryOptions(params.id!));

function Trays({ trays, empty }: { trays: TrayOnFloor[]; empty: string }) {
  if (trays.length === 0) return <p className="text-harbour-700">{empty}</p>;
  return (
    <table className="w-full text-left">
      <caption className="sr-only">Trays</caption>
      <thead className="sr-only">
        <tr>
          <th scope="col">Tray</th>
          <th scope="col">Pieces</th>
          <th scope="col">Where</th>
        </tr>
      </thead>
      <tbody>
        {trays.map((t) => (
          <tr key={t.id} className="border-t border-harbour-100 first:border-t-0">
            <td className="py-2 pr-3 font-mono font-bold">{t.number}</td>
            <td className="py-2 pr-3 text-right">{t.quantity} pieces</td>
            <td className="py-2">
              {t.phase === 'done' ? 'Dispatched' : t.stationKind ? `At ${STATION_KIND_NAMES[t.stationKind as StationKind]}` : t.phase}
              {t.onHold && (
                <span className="ml-2">
                  <Pill tone="stop">On hold</Pill>
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
  if (packing.isPending) return <Loading />;
  if (packing.error) return <ErrorPanel message={packing.error.message} />;
  const v = packing.data;
  const q = v.quantities;
  const closed = v.order.status === 'cancelled' || v.order.status === 'on_hold';
  return (
    <>
      <PageHeader
        title={`Pack and ship ${v.order.number}`}
        subtitle={
          <>
            {v.order.customer}: {v.order.title}. Due {v.order.dueDate}.{' '}
            <Link className="font-bold underline" to={paths.salesOrder(v.order.id)}>
              Order status
            </Link>
          </>
        }
        actions={v.shipped ? <Pill tone="ok">Shipped</Pill> : undefined}
      />
      <div className="mb-6 grid grid-cols-2 gap-3 md:grid-cols-5" aria-label="Quantities">
        {[
          ['Ordered', q.ordered],
          ['Finished', q.finished],
          ['Still on the floor', q.onFloor],
          ['In cartons', q.inCartons],
          ['Shipped', q.shipped],
        ].map(([label, n]) => (
          <Card key={label as string} className="!p-3">
            <p className="text-sm text-harbour-700">{label}</p>
            <p className="text-2xl font-bold">{n}</p>
          </Card>
        ))}
      </div>
      {q.verdict === 'over_allowance' && (
        <p className="mb-4 rounded-lg border-2 border-warn-700 bg-warn-50 p-3 font-bold text-warn-700">
          {q.overBy} pieces more than ordered plus the {q.overrunPct} % allowance ({q.maxExpected}). Ship only what the customer expects.
        </p>
      )}
      {closed && <ErrorPanel title="Not for shipping" message={v.order.status === 'on_hold' ? 'The order is on hold.' : 'The order is cancelled.'} />}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-2">
        <div className="flex flex-col gap-6">
          <Card>
            <h2 className="mb-3 text-xl font-bold">Record a shipment</h2>
            {q.availableToShip > 0 && !closed ? <ShipmentForm view={v} /> : <p className="text-harbour-700">No finished pieces are waiting to ship.</p>}
          </Card>
          <Card>
            <h2 className="mb-3 text-xl font-bold">Pack cartons</h2>
            {v.cartons.length > 0 && (
              <ul className="mb-4 flex flex-col divide-y divide-harbour-100" aria-label="Packed cartons waiting for dispatch">
                {v.cartons.map((c) => (
                  <li key={c.id} className="flex items-center justify-between gap-2 py-1">
                    <span>
                      {c.count} × {c.piecesPerCarton} pieces{c.weightKg != null ? `, ${c.weightKg} kg each` : ''}
                    </span>
                    <Button variant="ghost" aria-label={`Take apart ${c.count} × ${c.piecesPerCarton}`} onClick={() => remove.mutate(c.id)}>
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
            <h2 className="mb-3 text-xl font-bold">Still on the floor</h2>
            <Trays trays={v.onFloor} empty="Every tray has been packed." />
          </Card>
          <Card>
            <h2 className="mb-3 text-xl font-bold">Packed trays</h2>
            <Trays trays={v.packedTrays} empty="No tray has finished packing yet." />
          </Card>
          <Card>
            <h2 className="mb-3 text-xl font-bold">Shipments</h2>
            <ShipmentsTable orderId={v.order.id} shipments={v.shipments} />
          </Card>
        </div>
      </div>
    </>
  );
}
