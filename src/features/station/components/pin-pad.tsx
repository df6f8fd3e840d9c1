import { useTranslation } from 'react-i18next';
import { Delete } from 'lucide-react';

/** A big on-screen number pad for gloved hands; the field beside it also takes a keyboard. */
export function PinPad({ value, onChange, label, id }: { value: string; onChange: (v: string) => void; label: string; id: string }) {
  const { t } = useTranslation('station');
  const press = (d: string) => onChange((value + d).slice(0, 8));
  return (
    <div className="flex flex-col gap-3">
      <label htmlFor={id} className="text-lg font-bold">
        {label}
      </label>
      <input
        id={id}
        type="password"
        inputMode="numeric"
        autoComplete="off"
        value={value}
        onChange={(e) => onChange(e.target.value.replace(/\D/g, '').slice(0, 8))}
        className="min-h-16 rounded-xl border-2 border-harbour-800 bg-white px-4 text-center font-mono text-4xl tracking-[0.5em]"
      />
      <div className="grid grid-cols-3 gap-3" role="group" aria-label={`${label} 0–9`}>
        {['1', '2', '3', '4', '5', '6', '7', '8', '9'].map((d) => (
          <button
            key={d}
            type="button"
            onClick={() => press(d)}
            className="min-h-16 rounded-xl bg-harbour-50 text-3xl font-bold text-harbour-900 active:bg-harbour-100"
          >
            {d}
          </button>
        ))}
        <button type="button" onClick={() => onChange('')} className="min-h-16 rounded-xl bg-white text-lg font-bold text-harbour-800 ring-2 ring-harbour-100">
          {t('signIn.clear')}
        </button>
        <button
          type="button"
          onClick={() => press('0')}
          className="min-h-16 rounded-xl bg-harbour-50 text-3xl font-bold text-harbour-900 active:bg-harbour-100"
        >
          0
        </button>
        <button
          type="button"
          onClick={() => onChange(value.slice(0, -1))}
          aria-label={t('signIn.delete')}
          className="flex min-h-16 items-center justify-center rounded-xl bg-white text-harbour-800 ring-2 ring-harbour-100"
        >
          <Delete className="h-8 w-8" aria-hidden />
        </button>
      </div>
    </div>
  );
}
