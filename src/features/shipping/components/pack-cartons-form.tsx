import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { usePackCartons } from '../api/pack-cartons';
import { CartonLinesEditor, emptyCarton, parseCartons, type CartonDraft } from './carton-lines-editor';

/** At packing: record the cartons filled from the finished trays. */
export function PackCartonsForm({ orderId, available }: { orderId: string; available: number }) {
  const pack = usePackCartons(orderId);
  const [lines, setLines] = useState<CartonDraft[]>([emptyCarton()]);
  const { valid, complete, totals } = parseCartons(lines);
  const tooMany = totals.pieces > available;
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        pack.mutate({ cartons: valid }, { onSuccess: () => setLines([emptyCarton()]) });
      }}
    >
      <CartonLinesEditor idPrefix="pack" lines={lines} onChange={setLines} />
      <p className="text-sm text-harbour-700">{available} finished pieces are not in a carton yet.</p>
      {tooMany && (
        <p role="alert" className="font-bold text-stop-700">
          These cartons hold {totals.pieces} pieces: more than the {available} finished.
        </p>
      )}
      {pack.error && <ErrorPanel message={pack.error.message} />}
      <div>
        <Button type="submit" disabled={!complete || valid.length === 0 || tooMany || pack.isPending}>
          Record packed cartons
        </Button>
      </div>
    </form>
  );
}
