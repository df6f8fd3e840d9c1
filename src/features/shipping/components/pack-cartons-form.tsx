import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { errorText } from '@/lib/error-text';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { usePackCartons } from '../api/pack-cartons';
import { CartonLinesEditor, emptyCarton, parseCartons, type CartonDraft } from './carton-lines-editor';

/** At packing: record the cartons filled from the finished trays. */
export function PackCartonsForm({ orderId, available }: { orderId: string; available: number }) {
  const { t } = useTranslation('shipping');
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
      <p className="text-sm text-harbour-700">{t('cartons.notInCarton', { count: available })}</p>
      {tooMany && (
        <p role="alert" className="font-bold text-stop-700">
          {t('cartons.tooMany', { pieces: totals.pieces, available })}
        </p>
      )}
      {pack.error && <ErrorPanel message={errorText(pack.error)} />}
      <div>
        <Button type="submit" disabled={!complete || valid.length === 0 || tooMany || pack.isPending}>
          {t('cartons.record')}
        </Button>
      </div>
    </form>
  );
}
