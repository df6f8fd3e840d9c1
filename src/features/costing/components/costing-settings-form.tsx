import { useForm, type FieldPath, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useTranslation } from 'react-i18next';
import { costingSettingsSchema, type CostingSettings } from '@shared/schemas/costing';
import { BACKING_TYPES, MATERIALS, PACKAGINGS, PLATINGS, STATION_KINDS } from '@shared/domain/vocabulary';
import { TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';

type Scalar = Exclude<keyof CostingSettings, 'currency' | Grouped>;
type Grouped = 'densities' | 'materialPricePerKg' | 'labourRatePerHour' | 'platingPerDm2' | 'fittingPrice' | 'packagingPrice';

const SCALARS: Scalar[][] = [
  ['marginPct', 'traySize', 'orderSetupMinutes', 'orderSetupRatePerHour'],
  ['strikeLossPct', 'castLossPct', 'defaultOutlineFactor', 'defaultThicknessMm', 'enamelPerColourPerPiece'],
  ['ovenKwhPerLoadHour', 'tariffPerKwh', 'ovenPiecesPerLoad'],
  ['mouldHoursBase', 'mouldHoursPerMm', 'backMouldFactor', 'cuttersPerMould', 'cutterPrice', 'mouldBlockPrice'],
];

const GROUPS: { name: Grouped; keys: readonly string[]; labels: string }[] = [
  { name: 'densities', keys: MATERIALS, labels: 'common:material' },
  { name: 'materialPricePerKg', keys: MATERIALS, labels: 'common:material' },
  { name: 'labourRatePerHour', keys: STATION_KINDS, labels: 'common:kind' },
  { name: 'platingPerDm2', keys: PLATINGS, labels: 'common:plating' },
  { name: 'fittingPrice', keys: BACKING_TYPES, labels: 'common:backing' },
  { name: 'packagingPrice', keys: PACKAGINGS, labels: 'common:packaging' },
];

/** Every rate a quote is priced with, in one form checked by the shared schema. */
export function CostingSettingsForm({
  initial,
  pending,
  error,
  saved,
  onSubmit,
}: {
  initial: CostingSettings;
  pending: boolean;
  error?: string | null;
  saved: boolean;
  onSubmit: (s: CostingSettings) => void;
}) {
  const { t } = useTranslation(['costing', 'common']);
  // the schema's per-key records read as unknown on the way in; the form holds numbers
  const form = useForm<CostingSettings, unknown, CostingSettings>({
    resolver: zodResolver(costingSettingsSchema) as unknown as Resolver<CostingSettings, unknown, CostingSettings>,
    defaultValues: initial,
  });
  const { register, handleSubmit, formState } = form;
  const e = formState.errors as Record<string, { message?: string } & Record<string, { message?: string }>>;
  return (
    <form noValidate onSubmit={handleSubmit(onSubmit)} className="flex flex-col gap-6" aria-label={t('settings.title')}>
      <fieldset className="grid gap-4 md:grid-cols-4">
        <legend className="mb-2 text-lg font-bold text-harbour-900">{t('settings.general')}</legend>
        <TextField label={t('settings.field.currency')} {...register('currency')} error={e.currency?.message} hint={t('settings.hint.currency')} />
        {SCALARS.flat().map((k) => (
          <TextField
            key={k}
            label={t(`settings.field.${k}`)}
            type="number"
            step="any"
            inputMode="decimal"
            {...register(k, { valueAsNumber: true })}
            error={e[k]?.message}
          />
        ))}
      </fieldset>
      {GROUPS.map((g) => (
        <fieldset key={g.name} className="grid gap-4 md:grid-cols-4 xl:grid-cols-6">
          <legend className="mb-2 text-lg font-bold text-harbour-900">{t(`settings.field.${g.name}`)}</legend>
          {g.keys.map((k) => (
            <TextField
              key={k}
              label={t(`${g.labels}.${k}` as 'common:material.iron', { defaultValue: k })}
              type="number"
              step="any"
              inputMode="decimal"
              {...register(`${g.name}.${k}` as FieldPath<CostingSettings>, { valueAsNumber: true })}
              error={e[g.name]?.[k]?.message}
            />
          ))}
        </fieldset>
      ))}
      {error && <ErrorPanel title={t('settings.notSaved')} message={error} />}
      {saved && !formState.isDirty && (
        <p role="status" className="font-bold text-ok-700">
          {t('settings.saved')}
        </p>
      )}
      <div>
        <Button type="submit" size="lg" disabled={pending}>
          {pending ? t('settings.saving') : t('settings.save')}
        </Button>
      </div>
    </form>
  );
}
