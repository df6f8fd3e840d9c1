import { useState } from 'react';
import { AlertTriangle, Flame, Layers, Split } from 'lucide-react';
import { FLOOR_LEADS } from '@shared/domain/access';
import type { LoadGroup, LoadView } from '@shared/schemas/loads';
import { queryClient } from '@/lib/query-client';
import { loadsQueryOptions, useCreateLoad, useLoads, useSplitLoad } from '@/features/loads/api/get-loads';
import { Button } from '@/components/ui/button';
import { Card, EmptyState, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { minutesText } from '@/lib/duration';
import { humanise } from '@/lib/labels';
import { LOAD_KIND_TRAITS, type LoadKind } from '@shared/domain/traveller/station-kinds';

export const handle = { roles: FLOOR_LEADS };
export const loader = () => queryClient.ensureQueryData(loadsQueryOptions());

function GroupCard({ kind, group }: { kind: LoadKind; group: LoadGroup }) {
  const create = useCreateLoad();
  const [chosen, setChosen] = useState<Set<string>>(() => new Set());
  const toggle = (id: string) => setChosen((s) => {
    const n = new Set(s);
    if (n.has(id)) n.delete(id);
    else n.add(id);
    return n;
  });
  const pieces = group.trays.filter((t) => chosen.has(t.trayId)).reduce((s, t) => s + t.quantity, 0);
  const title = LOAD_KIND_TRAITS[kind].groupedBy === 'cure profile' ? group.label : humanise(group.key);
  return (
    <Card>
      <header className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-xl font-bold text-harbour-900">{title}</h3>
        <span className="text-harbour-700">
          {group.trays.length} trays · {group.pieces.toLocaleString('en-GB')} pieces · oldest waiting {minutesText(group.oldestMinutes)}
        </span>
      </header>
      <table className="w-full text-left text-sm" aria-label={`Trays waiting: ${title}`}>
        <thead>
          <tr className="border-b-2 border-harbour-100">
            <th className="w-10 px-2 py-1">
              <span className="sr-only">Choose</span>
            </th>
            <th className="px-2 py-1">Tray</th>
            <th className="px-2 py-1">Order</th>
            <th className="px-2 py-1">Customer</th>
            <th className="px-2 py-1 text-right">Pieces</th>
            <th className="px-2 py-1 text-right">Waiting</th>
          </tr>
        </thead>
        <tbody>
          {group.trays.map((t) => (
            <tr key={t.trayId} className="border-b border-harbour-50">
              <td className="px-2 py-1">
                <input type="checkbox" className="h-6 w-6" checked={chosen.has(t.trayId)} onChange={() => toggle(t.trayId)} aria-label={`Put tray ${t.number} in the load`} />
              </td>
              <td className="px-2 py-1 font-bold">{t.number}</td>
              <td className="px-2 py-1">{t.orderNumber}</td>
              <td className="px-2 py-1">{t.customer}</td>
              <td className="px-2 py-1 text-right tabular-nums">{t.quantity.toLocaleString('en-GB')}</td>
              <td className="px-2 py-1 text-right">{minutesText(t.waitingMinutes)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <Button disabled={chosen.size === 0 || create.isPending} onClick={() => create.mutate({ kind, trayIds: [...chosen] }, { onSuccess: () => setChosen(new Set()) })}>
          <Layers className="h-5 w-5" aria-hidden /> Make {LOAD_KIND_TRAITS[kind].loadName} of {chosen.size} trays ({pieces.toLocaleString('en-GB')} pieces)
        </Button>
        {create.error && <span className="font-bold text-stop-700">{create.error.message}</span>}
      </div>
    </Card>
  );
}

function OpenLoad({ load }: { load: LoadView }) {
  const split = useSplitLoad();
  return (
    <Card>
      <header className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-xl font-bold text-harbour-900">
          {load.number} · {LOAD_KIND_TRAITS[load.kind].groupedBy === 'cure profile' ? LOAD_KIND_TRAITS[load.kind].label(load.groupKey) : humanise(load.groupKey)}
        </h3>
        <Pill tone="info">{load.pieces.toLocaleString('en-GB')} pieces</Pill>
      </header>
      <p className="mb-2 text-sm text-harbour-700">Each order keeps its own trays and pieces; splitting the load gives every order back exactly what it put in.</p>
      <ul className="mb-3 flex flex-col gap-1">
        {load.orders.map((o) => (
          <li key={o.orderId}>
            Order <strong>{o.orderNumber}</strong>: {o.pieces.toLocaleString('en-GB')} pieces in {load.trays.filter((t) => t.orderId === o.orderId).map((t) => t.number).join(', ')}
          </li>
        ))}
      </ul>
      <Button variant="secondary" disabled={split.isPending} onClick={() => split.mutate(load.id)}>
        <Split className="h-5 w-5" aria-hidden /> Split back into its trays
      </Button>
      {split.error && <p className="mt-2 font-bold text-stop-700">{split.error.message}</p>}
    </Card>
  );
}

export function Component() {
  const loads = useLoads();
  return (
    <>
      <PageHeader title="Oven & bath loads" subtitle="Trays waiting for the oven, by cure profile, and for plating, by finish: choose trays from any orders to fill a load." />
      <p className="mb-4 flex items-start gap-2 rounded-xl border-2 border-warn-700/30 bg-warn-50 p-3 text-warn-700">
        <AlertTriangle className="mt-0.5 h-5 w-5 shrink-0" aria-hidden />
        Ovens are hot and plating baths hold corrosive and toxic chemicals: heat-resistant gloves, goggles and ventilation as the station notes say. Local regulations and the
        factory’s own procedures take precedence.
      </p>
      {loads.isPending ? (
        <Loading />
      ) : loads.error ? (
        <ErrorPanel message={loads.error.message} />
      ) : (
        <div className="flex flex-col gap-6">
          {loads.data.open.length > 0 && (
            <section aria-label="Open loads" className="flex flex-col gap-3">
              <h2 className="text-2xl font-bold text-harbour-900">Open loads</h2>
              {loads.data.open.map((l) => (
                <OpenLoad key={l.id} load={l} />
              ))}
            </section>
          )}
          <section aria-label="Waiting for the oven" className="flex flex-col gap-3">
            <h2 className="flex items-center gap-2 text-2xl font-bold text-harbour-900">
              <Flame className="h-6 w-6" aria-hidden /> Waiting for the oven
            </h2>
            {loads.data.oven.length === 0 ? <EmptyState title="No tray waits for the oven" /> : loads.data.oven.map((g) => <GroupCard key={g.key} kind="cure" group={g} />)}
          </section>
          <section aria-label="Waiting for plating" className="flex flex-col gap-3">
            <h2 className="flex items-center gap-2 text-2xl font-bold text-harbour-900">
              <Layers className="h-6 w-6" aria-hidden /> Waiting for plating
            </h2>
            {loads.data.plating.length === 0 ? <EmptyState title="No tray waits for plating" /> : loads.data.plating.map((g) => <GroupCard key={g.key} kind="plate" group={g} />)}
          </section>
        </div>
      )}
    </>
  );
}
