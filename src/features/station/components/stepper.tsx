import { Minus, Plus } from 'lucide-react';
import { useTranslation } from 'react-i18next';

/** A count with big minus and plus buttons (gloves) and a field for typing a number. */
export function Stepper({
  id,
  label,
  value,
  onChange,
  min = 0,
  max,
}: {
  id: string;
  label: string;
  value: number;
  onChange: (n: number) => void;
  min?: number;
  max: number;
}) {
  const { t } = useTranslation('station');
  const set = (n: number) => onChange(Math.max(min, Math.min(max, Number.isFinite(n) ? Math.round(n) : min)));
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={id} className="text-lg font-bold">
        {label}
      </label>
      <div className="flex items-stretch gap-2">
        <button
          type="button"
          aria-label={`${label}: ${t('finish.minus')}`}
          onClick={() => set(value - 1)}
          className="flex min-h-16 w-16 items-center justify-center rounded-xl bg-harbour-50 text-harbour-900"
        >
          <Minus className="h-8 w-8" aria-hidden />
        </button>
        <input
          id={id}
          inputMode="numeric"
          value={String(value)}
          onChange={(e) => set(Number(e.target.value.replace(/\D/g, '') || '0'))}
          className="min-h-16 w-28 rounded-xl border-2 border-harbour-800 text-center text-3xl font-bold"
        />
        <button
          type="button"
          aria-label={`${label}: ${t('finish.plus')}`}
          onClick={() => set(value + 1)}
          className="flex min-h-16 w-16 items-center justify-center rounded-xl bg-harbour-50 text-harbour-900"
        >
          <Plus className="h-8 w-8" aria-hidden />
        </button>
      </div>
    </div>
  );
}
