import { useState } from 'react';
import { Lock, Rocket } from 'lucide-react';
import type { OrderDetail, OrderGate } from '@shared/schemas/orders';
import { MAX_TRAYS_PER_RELEASE, splitIntoTrays } from '@shared/domain/trays';
import { MOULD_TOOL_NAMES } from '@shared/domain/routing';
import { Card, ErrorPanel } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { CheckboxField, TextField } from '@/components/ui/field';
import { useReleaseOrder } from '../api/release-order';

const GATE_TEXT: Record<OrderGate, string> = {
  payment_missing: 'a recorded payment (or a manager’s exception)',
  proof_not_approved: 'the customer’s approval of the latest proof revision',
};

function describeTrays(total: number, size: number): string {
  const trays = splitIntoTrays(total, size);
  const full = trays.filter((q) => q === size).length;
  const rest = trays.length - full;
  return `${trays.length} tray${trays.length === 1 ? '' : 's'}: ${full} × ${size}${rest ? ` + 1 × ${trays[trays.length - 1]}` : ''}`;
}

/** Release to the floor: chooses the tray size; refuses (and says why) while a gate is open. */
export function ReleasePanel({ order }: { order: OrderDetail }) {
  const release = useReleaseOrder(order.id);
  const [traySize, setTraySize] = useState(Math.min(100, order.releasedQuantity));
  const [onFloor, setOnFloor] = useState(false);
  const [releasedAt, setReleasedAt] = useState('');
  const sizeOk = Number.isInteger(traySize) && traySize >= 1;
  const tooMany = sizeOk && Math.ceil(order.releasedQuantity / traySize) > MAX_TRAYS_PER_RELEASE;
  const blocked = order.openGates.length > 0;
  const moulds = order.mouldPlan
    .map(
      (m) =>
        `${MOULD_TOOL_NAMES[m.tool].toLowerCase()} ${m.reuse ? `(stored ${m.mouldNumber}: check only)` : `(new: ${m.tool === 'cutting_die' ? 'make' : 'engrave'} and check)`}`,
    )
    .join(', ');

  return (
    <Card>
      <h2 className="mb-2 flex items-center gap-2 text-xl font-bold text-harbour-900">
        <Rocket className="h-6 w-6" aria-hidden /> Release to the floor
      </h2>
      {blocked && (
        <div role="status" className="mb-4 flex items-start gap-3 rounded-lg border-2 border-warn-700/40 bg-warn-50 p-4">
          <Lock className="mt-0.5 h-5 w-5 shrink-0 text-warn-700" aria-hidden />
          <div>
            <p className="font-bold text-warn-700">Not ready to release. Still missing:</p>
            <ul className="list-disc pl-6">
              {order.openGates.map((g) => (
                <li key={g}>{GATE_TEXT[g]}</li>
              ))}
            </ul>
          </div>
        </div>
      )}
      <p className="mb-4">
        {order.spec.quantity} ordered + {order.spec.overrunPct} % overrun = <strong>{order.releasedQuantity} pieces</strong>. Moulds: {moulds}.
      </p>
      <form
        aria-label="Release"
        className="flex flex-col gap-4"
        onSubmit={(e) => {
          e.preventDefault();
          release.mutate({ traySize, ...(onFloor && releasedAt ? { releasedAt: new Date(releasedAt).toISOString() } : {}) });
        }}
      >
        <div className="grid gap-4 md:grid-cols-3">
          <TextField
            label="Pieces per tray"
            type="number"
            min={1}
            inputMode="numeric"
            value={Number.isNaN(traySize) ? '' : traySize}
            onChange={(e) => setTraySize(Math.round(Number(e.target.value)))}
            error={!sizeOk ? 'A whole number above 0' : tooMany ? `More than ${MAX_TRAYS_PER_RELEASE} trays: choose a larger tray` : undefined}
            hint={sizeOk ? describeTrays(order.releasedQuantity, traySize) : undefined}
          />
          <div className="flex flex-col gap-2">
            <CheckboxField label="Already on the floor before Trayce" checked={onFloor} onChange={(e) => setOnFloor(e.target.checked)} />
            {onFloor && (
              <TextField
                label="On the floor since"
                type="datetime-local"
                value={releasedAt}
                onChange={(e) => setReleasedAt(e.target.value)}
                hint="Not in the future, at most 90 days back."
              />
            )}
          </div>
        </div>
        <div>
          <Button type="submit" size="lg" disabled={release.isPending || !sizeOk || tooMany}>
            Release order {order.number}
          </Button>
        </div>
      </form>
      {release.error && (
        <div className="mt-4">
          <ErrorPanel title="Not released" message={release.error.message} />
        </div>
      )}
    </Card>
  );
}
