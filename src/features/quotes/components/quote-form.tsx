import { useFieldArray, useForm, type FieldErrors, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useTranslation } from 'react-i18next';
import { Plus, Trash2 } from 'lucide-react';
import { MAX_COLOURS } from '@shared/schemas/orders';
import { MAX_QUANTITY_BREAKS, quoteBodySchema, type QuoteBody, type QuoteBodyInput } from '@shared/schemas/quotes';
import { BACKING_TYPES, MATERIALS, PACKAGINGS, PLATINGS, PROCESSES } from '@shared/domain/vocabulary';
import { CheckboxField, SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';

/** The form holds the quantities as six text boxes; the body sends the filled ones as numbers. */
export type QuoteFormValues = Omit<QuoteBodyInput, 'quantities'> & { breaks: string[] };

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

export const blankQuote = (): QuoteFormValues => ({
  customer: '',
  contactName: '',
  contactEmail: '',
  spec: {
    title: '',
    process: 'hard_enamel',
    material: 'iron',
    sizeMm: 25,
    heightMm: 25,
    thicknessMm: 1.5,
    overrunPct: 5,
    colours: [{ name: '' }],
    plating: 'gold',
    backing: { type: 'butterfly_clutch', count: 1 },
    backLogo: false,
    printing: false,
    epoxy: false,
    packaging: 'individual_bag',
  },
  breaks: ['100', '250', '500', '1000', '', ''],
  validUntil: day(30),
  notes: '',
});

const emptyToUndefined = (v: unknown) => (v === '' || v == null || (typeof v === 'number' && Number.isNaN(v)) ? undefined : v);

const toBody = (v: QuoteFormValues) => {
  const { breaks, ...rest } = v;
  return { ...rest, quantities: breaks.filter((b) => b.trim() !== '').map((b) => Number(b)) };
};

const schemaResolver = zodResolver(quoteBodySchema);
const resolver: Resolver<QuoteFormValues, unknown, QuoteBody> = async (values, ctx, options) => {
  const result = await schemaResolver(toBody(values), ctx, options as never);
  const errors = result.errors as FieldErrors & { quantities?: unknown };
  if (errors.quantities) {
    // the quantities' problems show under the boxes
    const { quantities, ...others } = errors;
    return { values: {}, errors: { ...others, breaks: quantities } } as never;
  }
  return result as never;
};

export function QuoteForm({
  initial,
  submitLabel,
  pending,
  error,
  onSubmit,
  onCancel,
  customers,
}: {
  /** names offered as the customer is typed */
  customers: { id: string; name: string }[];
  initial: QuoteFormValues;
  submitLabel: string;
  pending: boolean;
  error?: string | null;
  onSubmit: (body: QuoteBody) => void;
  onCancel: () => void;
}) {
  const { t } = useTranslation(['quotes', 'common']);
  const form = useForm<QuoteFormValues, unknown, QuoteBody>({ resolver, defaultValues: initial });
  const { register, control, handleSubmit, formState } = form;
  const e = formState.errors;
  const se = e.spec;
  const colours = useFieldArray({ control, name: 'spec.colours' });
  const breakErrors = e.breaks as unknown as ({ message?: string } | undefined)[] & { message?: string; root?: { message?: string } };
  const breakProblem =
    breakErrors?.message ?? breakErrors?.root?.message ?? (Array.isArray(breakErrors) ? breakErrors.find((x) => x?.message)?.message : undefined);
  const num = { valueAsNumber: true } as const;

  return (
    <form noValidate onSubmit={handleSubmit(onSubmit)} className="flex flex-col gap-6" aria-label={submitLabel}>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold text-harbour-900">{t('form.customerHeading')}</legend>
        <TextField
          label={t('form.customer')}
          list="quote-customers"
          autoComplete="off"
          {...register('customer', { setValueAs: emptyToUndefined })}
          error={e.customer?.message}
        />
        <datalist id="quote-customers">
          {customers.map((c) => (
            <option key={c.id} value={c.name} />
          ))}
        </datalist>
        <TextField
          label={t('form.contactName')}
          autoComplete="off"
          {...register('contactName', { setValueAs: emptyToUndefined })}
          error={e.contactName?.message}
        />
        <TextField label={t('form.contactEmail')} type="email" autoComplete="off" {...register('contactEmail')} error={e.contactEmail?.message} />
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-4">
        <legend className="mb-2 text-lg font-bold text-harbour-900">{t('form.specHeading')}</legend>
        <div className="md:col-span-2">
          <TextField label={t('form.title')} {...register('spec.title')} error={se?.title?.message} />
        </div>
        <SelectField label={t('form.process')} {...register('spec.process')} error={se?.process?.message}>
          {PROCESSES.map((p) => (
            <option key={p} value={p}>
              {t(`common:process.${p}`)}
            </option>
          ))}
        </SelectField>
        <SelectField label={t('form.material')} {...register('spec.material')} error={se?.material?.message}>
          {MATERIALS.map((m) => (
            <option key={m} value={m}>
              {t(`common:material.${m}`)}
            </option>
          ))}
        </SelectField>
        <TextField label={t('form.size')} type="number" step="0.1" inputMode="decimal" {...register('spec.sizeMm', num)} error={se?.sizeMm?.message} />
        <TextField label={t('form.height')} type="number" step="0.1" inputMode="decimal" {...register('spec.heightMm', num)} error={se?.heightMm?.message} />
        <TextField
          label={t('form.thickness')}
          type="number"
          step="0.1"
          inputMode="decimal"
          {...register('spec.thicknessMm', num)}
          error={se?.thicknessMm?.message}
        />
        <TextField
          label={t('form.outline')}
          type="number"
          step="0.001"
          inputMode="decimal"
          {...register('spec.outlineFactor', { setValueAs: (v: string) => (v === '' || v == null ? undefined : Number(v)) })}
          error={se?.outlineFactor?.message}
          hint={t('form.outlineHint')}
        />
        <SelectField label={t('form.plating')} {...register('spec.plating')} error={se?.plating?.message}>
          {PLATINGS.map((p) => (
            <option key={p} value={p}>
              {t(`common:plating.${p}`)}
            </option>
          ))}
        </SelectField>
        <SelectField label={t('form.backing')} {...register('spec.backing.type')} error={se?.backing?.type?.message}>
          {BACKING_TYPES.map((b) => (
            <option key={b} value={b}>
              {t(`common:backing.${b}`)}
            </option>
          ))}
        </SelectField>
        <TextField
          label={t('form.backingCount')}
          type="number"
          inputMode="numeric"
          {...register('spec.backing.count', num)}
          error={se?.backing?.count?.message}
        />
        <SelectField label={t('form.packaging')} {...register('spec.packaging')} error={se?.packaging?.message}>
          {PACKAGINGS.map((p) => (
            <option key={p} value={p}>
              {t(`common:packaging.${p}`)}
            </option>
          ))}
        </SelectField>
        <TextField
          label={t('form.overrun')}
          type="number"
          step="0.5"
          inputMode="decimal"
          {...register('spec.overrunPct', num)}
          error={se?.overrunPct?.message}
        />
        <div className="flex flex-col justify-end gap-1 md:col-span-3">
          <CheckboxField label={t('form.backLogo')} {...register('spec.backLogo')} />
          {se?.backLogo?.message && (
            <p role="alert" className="text-sm font-bold text-stop-700">
              {se.backLogo.message}
            </p>
          )}
          <CheckboxField label={t('form.printing')} {...register('spec.printing')} />
          <CheckboxField label={t('form.epoxy')} {...register('spec.epoxy')} />
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-lg font-bold text-harbour-900">{t('form.colours')}</legend>
        {(se?.colours?.message || se?.colours?.root?.message) && (
          <p role="alert" className="text-sm font-bold text-stop-700">
            {se?.colours?.message ?? se?.colours?.root?.message}
          </p>
        )}
        <ol className="grid gap-3 md:grid-cols-2">
          {colours.fields.map((f, i) => (
            <li key={f.id} className="grid items-start gap-3 rounded-lg border border-harbour-100 p-3 grid-cols-[1fr_1fr_auto]">
              <TextField label={t('form.colourName', { n: i + 1 })} {...register(`spec.colours.${i}.name`)} error={se?.colours?.[i]?.name?.message} />
              <TextField
                label={t('form.colourRef', { n: i + 1 })}
                {...register(`spec.colours.${i}.ref`, { setValueAs: emptyToUndefined })}
                error={se?.colours?.[i]?.ref?.message}
              />
              <Button variant="ghost" className="mt-6" aria-label={t('form.removeColour', { n: i + 1 })} onClick={() => colours.remove(i)}>
                <Trash2 className="h-5 w-5" aria-hidden />
              </Button>
            </li>
          ))}
        </ol>
        <div>
          <Button variant="secondary" disabled={colours.fields.length >= MAX_COLOURS} onClick={() => colours.append({ name: '' })}>
            <Plus className="h-5 w-5" aria-hidden /> {t('form.addColour')}
          </Button>
        </div>
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-6">
        <legend className="mb-2 text-lg font-bold text-harbour-900">{t('form.breaksHeading')}</legend>
        {Array.from({ length: MAX_QUANTITY_BREAKS }, (_, i) => (
          <TextField key={i} label={t('form.quantity', { n: i + 1 })} type="number" inputMode="numeric" {...register(`breaks.${i}`)} />
        ))}
        <p className={`md:col-span-6 text-sm ${breakProblem ? 'font-bold text-stop-700' : 'text-harbour-700'}`} role={breakProblem ? 'alert' : undefined}>
          {breakProblem ?? t('form.quantitiesHint')}
        </p>
        <div className="md:col-span-2">
          <TextField label={t('form.validUntil')} type="date" {...register('validUntil')} error={e.validUntil?.message} />
        </div>
        <div className="md:col-span-6">
          <TextAreaField label={t('form.notes')} rows={3} {...register('notes')} error={e.notes?.message} />
        </div>
      </fieldset>

      {error && <ErrorPanel title={t('form.notSaved')} message={error} />}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" size="lg" disabled={pending}>
          {pending ? t('form.saving') : submitLabel}
        </Button>
        <Button variant="secondary" size="lg" onClick={onCancel}>
          {t('form.cancel')}
        </Button>
      </div>
    </form>
  );
}
