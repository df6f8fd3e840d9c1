import type { ReactNode } from 'react';
import { AlertTriangle } from 'lucide-react';
import type { HistoryEntry, OrderDetail } from '@shared/schemas/orders';
import { Card } from '@/components/ui/panels';
import { formatDateTime, formatDueDay, humanise } from '@/lib/labels';

/** A colour swatch with its name: the word carries the meaning, the colour helps. */
export function Swatch({ name, hex, refCode }: { name: string; hex?: string; refCode?: string }) {
  return (
    <span className="inline-flex items-center gap-2 rounded-full border border-harbour-100 bg-white py-1 pr-3 pl-1">
      <span
        aria-hidden
        className="h-6 w-6 rounded-full border border-ink/30"
        style={hex ? { background: hex } : { background: 'repeating-linear-gradient(45deg,#fff,#fff 3px,#d5e6e6 3px,#d5e6e6 6px)' }}
      />
      <span className="font-bold">{name}</span>
      {refCode && <span className="text-sm text-harbour-700">{refCode}</span>}
    </span>
  );
}

/** `projected`: shown under the projected ship date (the route adds the 85 % date and its measured coverage). */
export function SpecCard({ order, projected }: { order: OrderDetail; projected?: ReactNode }) {
  const s = order.spec;
  const rows: [string, ReactNode][] = [
    ['Customer', order.customer.name],
    ['Product', `${humanise(s.productType)} · ${humanise(s.process)} · ${humanise(s.material)} · ${s.sizeMm} mm`],
    ['Quantity', `${s.quantity} + ${s.overrunPct} % overrun = ${order.releasedQuantity} pieces`],
    ['Plating', s.secondPlating ? `${humanise(s.plating)} and ${humanise(s.secondPlating).toLowerCase()} (two-tone)` : humanise(s.plating)],
    ['Fittings', s.backing.type === 'none' || s.backing.count === 0 ? 'None' : `${s.backing.count} × ${humanise(s.backing.type).toLowerCase()}`],
    ['Extras', [s.backLogo && 'back logo', s.printing && 'printed areas', s.epoxy && 'epoxy dome', s.sandblast && 'sandblasted texture'].filter(Boolean).join(', ') || 'None'],
    ['Packaging', humanise(s.packaging)],
    ['Due', formatDueDay(s.dueDate)],
    [
      'Projected ship',
      <>
        {order.projectedShipAt ? formatDateTime(order.projectedShipAt) : order.releasedAt ? '—' : 'After release'}
        {order.projectedShipAt && projected}
      </>,
    ],
  ];
  if (order.reorderOf) rows.push(['Repeat of', `order ${order.reorderOf.number}`]);
  return (
    <Card>
      <h2 className="mb-4 text-xl font-bold text-harbour-900">Spec</h2>
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[10rem_1fr]">
        {rows.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="font-bold text-harbour-700">{k}</dt>
            <dd>{v}</dd>
          </div>
        ))}
        {order.projectionNote && order.projectedShipAt && (
          <>
            <dt className="font-bold text-harbour-700">How it is projected</dt>
            <dd className="text-sm text-harbour-700">{order.projectionNote}</dd>
          </>
        )}
        <dt className="font-bold text-harbour-700">Colours</dt>
        <dd className="flex flex-wrap gap-2">
          {s.colours.length === 0
            ? 'None'
            : s.colours.map((c, i) => <Swatch key={i} name={`${i + 1}. ${c.name}`} hex={c.hex} refCode={c.ref} />)}
        </dd>
        {s.notes && (
          <>
            <dt className="font-bold text-harbour-700">Notes</dt>
            <dd className="whitespace-pre-wrap">{s.notes}</dd>
          </>
        )}
      </dl>
      {order.warnings.length > 0 && (
        <ul className="mt-4 flex flex-col gap-1" aria-label="Warnings">
          {order.warnings.map((w) => (
            <li key={w.code} className="flex items-start gap-2 font-bold text-warn-700">
              <AlertTriangle className="mt-0.5 h-5 w-5 shrink-0" aria-hidden /> {w.message}
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

export function HistoryList({ entries }: { entries: HistoryEntry[] }) {
  return (
    <Card>
      <h2 className="mb-4 text-xl font-bold text-harbour-900">History</h2>
      <ol className="flex flex-col gap-2">
        {[...entries].reverse().map((h, i) => (
          <li key={i} className="flex flex-wrap gap-x-3 border-b border-harbour-50 pb-2">
            <time className="w-44 shrink-0 text-sm text-harbour-700" dateTime={h.at}>
              {formatDateTime(h.at)}
            </time>
            <span>
              {h.text}
              {h.by && <span className="text-harbour-700"> · {h.by}</span>}
            </span>
          </li>
        ))}
      </ol>
    </Card>
  );
}
