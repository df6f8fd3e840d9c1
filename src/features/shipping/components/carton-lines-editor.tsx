import { Plus, Trash2 } from 'lucide-react';
import { useTranslation } from 'react-i18next';
import { currentLocale } from '@/lib/i18n';
import { cartonTotals } from '@shared/domain/shipping';
import { Button } from '@/components/ui/button';

export interface CartonDraft {
  count: string;
  piecesPerCarton: string;
  weightKg: string;
}

export const emptyCarton = (): CartonDraft => ({ count: '1', piecesPerCarton: '', weightKg: '' });

/** Carton lines as typed; complete lines become numbers, the rest are left out of the totals. */
export function parseCartons(lines: CartonDraft[]) {
  const parsed = lines.map((l) => ({ count: Number(l.count), piecesPerCarton: Number(l.piecesPerCarton), weightKg: Number(l.weightKg) }));
  const valid = parsed.filter(
    (l) => Number.isInteger(l.count) && l.count > 0 && Number.isInteger(l.piecesPerCarton) && l.piecesPerCarton > 0 && l.weightKg > 0,
  );
  return { valid, complete: valid.length === lines.length, totals: valid.length ? cartonTotals(valid) : { cartons: 0, pieces: 0, weightKg: 0 } };
}

const input = 'min-h-11 w-full rounded-lg border-2 border-harbour-100 bg-white px-2 text-base';

export function CartonLinesEditor({ lines, onChange, idPrefix }: { lines: CartonDraft[]; onChange: (lines: CartonDraft[]) => void; idPrefix: string }) {
  const set = (i: number, patch: Partial<CartonDraft>) => onChange(lines.map((l, j) => (j === i ? { ...l, ...patch } : l)));
  const { totals } = parseCartons(lines);
  const { t } = useTranslation('shipping');
  const kg = totals.weightKg.toLocaleString(currentLocale(), { maximumFractionDigits: 3 });
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 font-bold">{t('cartons.legend')}</legend>
      {lines.map((l, i) => (
        <div key={i} className="grid grid-cols-[1fr_1fr_1fr_auto] items-end gap-2">
          <label className="flex flex-col gap-1 text-sm font-bold" htmlFor={`${idPrefix}-count-${i}`}>
            {t('cartons.count')}
            <input
              id={`${idPrefix}-count-${i}`}
              className={input}
              inputMode="numeric"
              value={l.count}
              onChange={(e) => set(i, { count: e.target.value.replace(/\D/g, '') })}
            />
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold" htmlFor={`${idPrefix}-per-${i}`}>
            {t('cartons.perCarton')}
            <input
              id={`${idPrefix}-per-${i}`}
              className={input}
              inputMode="numeric"
              value={l.piecesPerCarton}
              onChange={(e) => set(i, { piecesPerCarton: e.target.value.replace(/\D/g, '') })}
            />
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold" htmlFor={`${idPrefix}-kg-${i}`}>
            {t('cartons.kgPerCarton')}
            <input
              id={`${idPrefix}-kg-${i}`}
              className={input}
              inputMode="decimal"
              value={l.weightKg}
              onChange={(e) => set(i, { weightKg: e.target.value.replace(',', '.').replace(/[^\d.]/g, '') })}
            />
          </label>
          <Button
            variant="ghost"
            aria-label={t('cartons.removeLine', { n: i + 1 })}
            disabled={lines.length === 1}
            onClick={() => onChange(lines.filter((_, j) => j !== i))}
          >
            <Trash2 className="h-5 w-5" aria-hidden />
          </Button>
        </div>
      ))}
      <div className="flex flex-wrap items-center justify-between gap-2">
        <Button variant="ghost" onClick={() => onChange([...lines, emptyCarton()])}>
          <Plus className="h-5 w-5" aria-hidden /> {t('cartons.another')}
        </Button>
        <p className="font-bold" aria-live="polite">
          {t(totals.cartons === 1 ? 'cartons.totalOne' : 'cartons.totalMany', { cartons: totals.cartons, pieces: totals.pieces, kg })}
        </p>
      </div>
    </fieldset>
  );
}
