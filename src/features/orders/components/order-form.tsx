import type { ReactNode } from 'react';
import { factoryDateInDays } from '@/lib/datetime';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Plus, Trash2, AlertTriangle } from 'lucide-react';
import { MAX_COLOURS, OVERRUN_DEFAULT_PCT, PRODUCT_TYPES, orderSpecSchema, specWarnings, type OrderSpec, type OrderSpecInput } from '@shared/schemas/orders';
import { BACKING_TYPES, MATERIALS, PACKAGINGS, PLATINGS, PROCESSES } from '@shared/domain/vocabulary';
import { releasedQuantity } from '@shared/domain/trays';
import { CheckboxField, SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { useTranslation } from 'react-i18next';
import { useCustomers } from '../api/get-customers';

const blank: OrderSpecInput = {
  customer: '',
  title: '',
  productType: 'pin',
  process: 'hard_enamel',
  material: 'iron',
  sizeMm: 25,
  quantity: 500,
  overrunPct: OVERRUN_DEFAULT_PCT,
  colours: [{ name: '', hex: '#1b2a4a' }],
  plating: 'gold',
  secondPlating: null,
  backing: { type: 'butterfly_clutch', count: 1 },
  backLogo: false,
  printing: false,
  epoxy: false,
  sandblast: false,
  packaging: 'individual_bag',
  dueDate: factoryDateInDays(28),
  notes: '',
};

const emptyToUndefined = (v: unknown) => (v === '' || v == null ? undefined : v);

/**
 * The order spec form (new order, repeat order, or a change before release). `extra` is shown
 * above the buttons and may ask for the checked spec without saving it (the route puts the
 * "When would it ship?" panel there); without `onSubmit` the form saves nothing.
 */
export function OrderForm({
  initial,
  submitLabel,
  pending,
  error,
  onSubmit,
  onCancel,
  extra,
}: {
  initial?: Partial<OrderSpecInput>;
  submitLabel?: string;
  pending?: boolean;
  error?: string | null;
  onSubmit?: (spec: OrderSpec) => void;
  onCancel?: () => void;
  /** `withSpec(then)` checks the form and, when it is valid, hands the spec to `then` */
  extra?: (withSpec: (then: (spec: OrderSpec) => void) => void) => ReactNode;
}) {
  const { t } = useTranslation(['orders', 'common']);
  const customers = useCustomers();
  const form = useForm<OrderSpecInput, unknown, OrderSpec>({
    resolver: zodResolver(orderSpecSchema),
    defaultValues: { ...blank, ...initial },
  });
  const { register, control, handleSubmit, formState, setValue } = form;
  const withSpec = (then: (spec: OrderSpec) => void) => void handleSubmit(then)();
  const e = formState.errors;
  const colours = useFieldArray({ control, name: 'colours' });
  const watched = useWatch({ control });
  const warnings = specWarnings({
    productType: watched.productType,
    sizeMm: Number(watched.sizeMm),
    quantity: Number(watched.quantity),
    process: watched.process,
    material: watched.material,
    epoxy: watched.epoxy,
  });
  const warningFor = (field: string) => {
    const w = warnings.find((x) => x.field === field);
    return w && t(`form.warn.${w.code}`, w.params ?? {});
  };
  const qty = Number(watched.quantity);
  const overrun = Number(watched.overrunPct);
  const released = Number.isInteger(qty) && qty > 0 && overrun >= 0 ? releasedQuantity(qty, overrun) : null;

  return (
    <form noValidate onSubmit={onSubmit ? handleSubmit(onSubmit) : (ev) => ev.preventDefault()} className="flex flex-col gap-6">
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold text-harbour-900">{t('form.customerDesign')}</legend>
        <TextField
          label={t('form.customer')}
          list="customer-names"
          autoComplete="off"
          {...register('customer', { setValueAs: emptyToUndefined })}
          error={e.customer?.message}
          hint={t('form.customerHint')}
        />
        <datalist id="customer-names">
          {customers.data?.map((c) => (
            <option key={c.id} value={c.name} />
          ))}
        </datalist>
        <div className="md:col-span-2">
          <TextField label={t('form.title')} {...register('title')} error={e.title?.message} />
        </div>
        <SelectField label={t('form.product')} {...register('productType')} error={e.productType?.message}>
          {PRODUCT_TYPES.map((p) => (
            <option key={p} value={p}>
              {t(`product.${p}`)}
            </option>
          ))}
        </SelectField>
        <SelectField label={t('form.process')} {...register('process')} error={e.process?.message}>
          {PROCESSES.map((p) => (
            <option key={p} value={p}>
              {t(`common:process.${p}`)}
            </option>
          ))}
        </SelectField>
        <SelectField
          label={t('form.material')}
          {...register('material')}
          error={e.material?.message}
          hint={warningFor('material') && <Warn>{warningFor('material')}</Warn>}
        >
          {MATERIALS.map((m) => (
            <option key={m} value={m}>
              {t(`common:material.${m}`)}
            </option>
          ))}
        </SelectField>
        <TextField
          label={t('form.size')}
          type="number"
          step="0.1"
          inputMode="decimal"
          {...register('sizeMm', { valueAsNumber: true })}
          error={e.sizeMm?.message}
          hint={warningFor('sizeMm') ? <Warn>{warningFor('sizeMm')}</Warn> : t('form.sizeHint')}
        />
        <TextField
          label={t('form.quantity')}
          type="number"
          inputMode="numeric"
          {...register('quantity', { valueAsNumber: true })}
          error={e.quantity?.message}
          hint={warningFor('quantity') ? <Warn>{warningFor('quantity')}</Warn> : undefined}
        />
        <TextField
          label={t('form.overrun')}
          type="number"
          step="0.5"
          inputMode="decimal"
          {...register('overrunPct', { valueAsNumber: true })}
          error={e.overrunPct?.message}
          hint={released ? t('form.overrunReleased', { count: released }) : t('form.overrunHint')}
        />
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-lg font-bold text-harbour-900">{t('form.colours')}</legend>
        {e.colours?.message && (
          <p role="alert" className="text-sm font-bold text-stop-700">
            {e.colours.message}
          </p>
        )}
        {e.colours?.root?.message && (
          <p role="alert" className="text-sm font-bold text-stop-700">
            {e.colours.root.message}
          </p>
        )}
        <ol className="flex flex-col gap-3">
          {colours.fields.map((f, i) => {
            const hex = watched.colours?.[i]?.hex;
            return (
              <li key={f.id} className="grid items-start gap-3 rounded-lg border border-harbour-100 p-3 md:grid-cols-[3rem_1fr_1fr_1fr_auto]">
                <span className="text-lg font-bold text-harbour-700 md:mt-8">{i + 1}</span>
                <TextField label={t('form.colourName', { n: i + 1 })} {...register(`colours.${i}.name`)} error={e.colours?.[i]?.name?.message} />
                <TextField
                  label={t('form.colourRef', { n: i + 1 })}
                  {...register(`colours.${i}.ref`, { setValueAs: emptyToUndefined })}
                  error={e.colours?.[i]?.ref?.message}
                  hint={t('form.colourRefHint')}
                />
                <div className="flex items-start gap-2">
                  <TextField
                    label={t('form.colourSwatch', { n: i + 1 })}
                    placeholder="#1b2a4a"
                    {...register(`colours.${i}.hex`, { setValueAs: emptyToUndefined })}
                    error={e.colours?.[i]?.hex?.message}
                  />
                  <input
                    type="color"
                    aria-label={t('form.pickColour', { n: i + 1 })}
                    value={hex && /^#[0-9a-fA-F]{6}$/.test(hex) ? hex : '#ffffff'}
                    onChange={(ev) => setValue(`colours.${i}.hex`, ev.target.value, { shouldValidate: true })}
                    className="mt-6 h-11 w-14 shrink-0 cursor-pointer rounded-lg border-2 border-harbour-100"
                  />
                </div>
                <Button variant="ghost" className="md:mt-6" aria-label={t('form.removeColour', { n: i + 1 })} onClick={() => colours.remove(i)}>
                  <Trash2 className="h-5 w-5" aria-hidden />
                </Button>
              </li>
            );
          })}
        </ol>
        <div>
          <Button variant="secondary" disabled={colours.fields.length >= MAX_COLOURS} onClick={() => colours.append({ name: '' })}>
            <Plus className="h-5 w-5" aria-hidden /> {t('form.addColour')}
          </Button>
        </div>
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold text-harbour-900">{t('form.finish')}</legend>
        <SelectField label={t('form.plating')} {...register('plating')} error={e.plating?.message}>
          {PLATINGS.map((p) => (
            <option key={p} value={p}>
              {t(`common:plating.${p}`)}
            </option>
          ))}
        </SelectField>
        <SelectField
          label={t('form.secondPlating')}
          {...register('secondPlating', { setValueAs: (v: unknown) => (v === '' || v == null ? null : v) })}
          error={e.secondPlating?.message}
        >
          <option value="">{t('form.secondPlatingNone')}</option>
          {PLATINGS.map((p) => (
            <option key={p} value={p}>
              {t(`common:plating.${p}`)}
            </option>
          ))}
        </SelectField>
        <SelectField label={t('form.backing')} {...register('backing.type')} error={e.backing?.type?.message}>
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
          {...register('backing.count', { valueAsNumber: true })}
          error={e.backing?.count?.message}
        />
        <SelectField label={t('form.packaging')} {...register('packaging')} error={e.packaging?.message}>
          {PACKAGINGS.map((p) => (
            <option key={p} value={p}>
              {t(`common:packaging.${p}`)}
            </option>
          ))}
        </SelectField>
        <TextField label={t('form.dueDate')} type="date" {...register('dueDate')} error={e.dueDate?.message} />
        <div className="flex flex-col justify-end gap-1">
          <CheckboxField label={t('form.backLogo')} {...register('backLogo')} />
          {e.backLogo?.message && <FieldProblem>{e.backLogo.message}</FieldProblem>}
          <CheckboxField label={t('form.printing')} {...register('printing')} />
          <CheckboxField label={t('form.epoxy')} {...register('epoxy')} />
          {warningFor('epoxy') && <Warn>{warningFor('epoxy')}</Warn>}
          <CheckboxField label={t('form.sandblast')} {...register('sandblast')} />
          {e.sandblast?.message && <FieldProblem>{e.sandblast.message}</FieldProblem>}
        </div>
        <div className="md:col-span-3">
          <TextAreaField label={t('form.notes')} rows={3} {...register('notes')} error={e.notes?.message} />
        </div>
      </fieldset>

      {extra?.(withSpec)}
      {error && <ErrorPanel title={t('form.notSaved')} message={error} />}
      <div className="flex flex-wrap gap-3">
        {onSubmit && (
          <Button type="submit" size="lg" disabled={pending}>
            {submitLabel}
          </Button>
        )}
        {onCancel && (
          <Button variant="secondary" size="lg" onClick={onCancel}>
            {t('form.cancel')}
          </Button>
        )}
      </div>
    </form>
  );
}

function Warn({ children }: { children: ReactNode }) {
  return (
    <span className="inline-flex items-start gap-1 font-bold text-warn-700">
      <AlertTriangle className="mt-0.5 h-4 w-4 shrink-0" aria-hidden />
      {children}
    </span>
  );
}

function FieldProblem({ children }: { children: ReactNode }) {
  return (
    <p role="alert" className="text-sm font-bold text-stop-700">
      {children}
    </p>
  );
}
