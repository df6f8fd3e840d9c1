import type { ReactNode } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Plus, Trash2, AlertTriangle } from 'lucide-react';
import {
  MAX_COLOURS,
  OVERRUN_DEFAULT_PCT,
  PRODUCT_TYPES,
  orderSpecSchema,
  specWarnings,
  type OrderSpec,
  type OrderSpecInput,
} from '@shared/schemas/orders';
import { BACKING_TYPES, MATERIALS, PACKAGINGS, PLATINGS, PROCESSES } from '@shared/domain/vocabulary';
import { releasedQuantity } from '@shared/domain/trays';
import { CheckboxField, SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { humanise } from '@/lib/labels';
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
  dueDate: new Date(Date.now() + 28 * 86_400_000).toISOString().slice(0, 10),
  notes: '',
};

const emptyToUndefined = (v: unknown) => (v === '' || v == null ? undefined : v);

/** The order spec form (new order, repeat order, or a change before release). */
export function OrderForm({
  initial,
  submitLabel,
  pending,
  error,
  onSubmit,
  onCancel,
}: {
  initial?: Partial<OrderSpecInput>;
  submitLabel: string;
  pending: boolean;
  error?: string | null;
  onSubmit: (spec: OrderSpec) => void;
  onCancel?: () => void;
}) {
  const customers = useCustomers();
  const form = useForm<OrderSpecInput, unknown, OrderSpec>({
    resolver: zodResolver(orderSpecSchema),
    defaultValues: { ...blank, ...initial },
  });
  const { register, control, handleSubmit, formState, setValue } = form;
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
  const warningFor = (field: string) => warnings.find((w) => w.field === field)?.message;
  const qty = Number(watched.quantity);
  const overrun = Number(watched.overrunPct);
  const released = Number.isInteger(qty) && qty > 0 && overrun >= 0 ? releasedQuantity(qty, overrun) : null;

  return (
    <form noValidate onSubmit={handleSubmit(onSubmit)} className="flex flex-col gap-6">
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold text-harbour-900">Customer and design</legend>
        <TextField
          label="Customer"
          list="customer-names"
          autoComplete="off"
          {...register('customer', { setValueAs: emptyToUndefined })}
          error={e.customer?.message}
          hint="Pick an existing customer or type a new name."
        />
        <datalist id="customer-names">
          {customers.data?.map((c) => (
            <option key={c.id} value={c.name} />
          ))}
        </datalist>
        <div className="md:col-span-2">
          <TextField label="Title" {...register('title')} error={e.title?.message} />
        </div>
        <SelectField label="Product" {...register('productType')} error={e.productType?.message}>
          {PRODUCT_TYPES.map((p) => (
            <option key={p} value={p}>
              {humanise(p)}
            </option>
          ))}
        </SelectField>
        <SelectField label="Process" {...register('process')} error={e.process?.message}>
          {PROCESSES.map((p) => (
            <option key={p} value={p}>
              {humanise(p)}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Material"
          {...register('material')}
          error={e.material?.message}
          hint={warningFor('material') && <Warn>{warningFor('material')}</Warn>}
        >
          {MATERIALS.map((m) => (
            <option key={m} value={m}>
              {humanise(m)}
            </option>
          ))}
        </SelectField>
        <TextField
          label="Size, longest side (mm)"
          type="number"
          step="0.1"
          inputMode="decimal"
          {...register('sizeMm', { valueAsNumber: true })}
          error={e.sizeMm?.message}
          hint={warningFor('sizeMm') ? <Warn>{warningFor('sizeMm')}</Warn> : 'Pins are usually 10–100 mm, coins 25–90 mm.'}
        />
        <TextField
          label="Quantity ordered"
          type="number"
          inputMode="numeric"
          {...register('quantity', { valueAsNumber: true })}
          error={e.quantity?.message}
          hint={warningFor('quantity') ? <Warn>{warningFor('quantity')}</Warn> : undefined}
        />
        <TextField
          label="Overrun allowance (%)"
          type="number"
          step="0.5"
          inputMode="decimal"
          {...register('overrunPct', { valueAsNumber: true })}
          error={e.overrunPct?.message}
          hint={released ? `0–10 %. ${released} pieces will be released.` : '0–10 %, usually 5 %.'}
        />
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-lg font-bold text-harbour-900">Colours</legend>
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
              <li key={f.id} className="grid items-end gap-3 rounded-lg border border-harbour-100 p-3 md:grid-cols-[3rem_1fr_1fr_1fr_auto]">
                <span className="self-center text-lg font-bold text-harbour-700">{i + 1}</span>
                <TextField label={`Colour ${i + 1} name`} {...register(`colours.${i}.name`)} error={e.colours?.[i]?.name?.message} />
                <TextField
                  label={`Colour ${i + 1} reference code`}
                  {...register(`colours.${i}.ref`, { setValueAs: emptyToUndefined })}
                  error={e.colours?.[i]?.ref?.message}
                  hint="The customer's code, if any."
                />
                <div className="flex items-end gap-2">
                  <TextField
                    label={`Colour ${i + 1} swatch`}
                    placeholder="#RRGGBB"
                    {...register(`colours.${i}.hex`, { setValueAs: emptyToUndefined })}
                    error={e.colours?.[i]?.hex?.message}
                  />
                  <input
                    type="color"
                    aria-label={`Pick colour ${i + 1}`}
                    value={hex && /^#[0-9a-fA-F]{6}$/.test(hex) ? hex : '#ffffff'}
                    onChange={(ev) => setValue(`colours.${i}.hex`, ev.target.value, { shouldValidate: true })}
                    className="h-11 w-14 shrink-0 cursor-pointer rounded-lg border-2 border-harbour-100"
                  />
                </div>
                <Button variant="ghost" aria-label={`Remove colour ${i + 1}`} onClick={() => colours.remove(i)}>
                  <Trash2 className="h-5 w-5" aria-hidden />
                </Button>
              </li>
            );
          })}
        </ol>
        <div>
          <Button variant="secondary" disabled={colours.fields.length >= MAX_COLOURS} onClick={() => colours.append({ name: '' })}>
            <Plus className="h-5 w-5" aria-hidden /> Add a colour
          </Button>
        </div>
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold text-harbour-900">Finish, fittings and packing</legend>
        <SelectField label="Plating" {...register('plating')} error={e.plating?.message}>
          {PLATINGS.map((p) => (
            <option key={p} value={p}>
              {humanise(p)}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Second finish (two-tone)"
          {...register('secondPlating', { setValueAs: (v: unknown) => (v === '' || v == null ? null : v) })}
          error={e.secondPlating?.message}
        >
          <option value="">None: one finish</option>
          {PLATINGS.map((p) => (
            <option key={p} value={p}>
              {humanise(p)}
            </option>
          ))}
        </SelectField>
        <SelectField label="Back fitting" {...register('backing.type')} error={e.backing?.type?.message}>
          {BACKING_TYPES.map((b) => (
            <option key={b} value={b}>
              {humanise(b)}
            </option>
          ))}
        </SelectField>
        <TextField label="Fittings per piece" type="number" inputMode="numeric" {...register('backing.count', { valueAsNumber: true })} error={e.backing?.count?.message} />
        <SelectField label="Packaging" {...register('packaging')} error={e.packaging?.message}>
          {PACKAGINGS.map((p) => (
            <option key={p} value={p}>
              {humanise(p)}
            </option>
          ))}
        </SelectField>
        <TextField label="Due date" type="date" {...register('dueDate')} error={e.dueDate?.message} />
        <div className="flex flex-col justify-end gap-1">
          <CheckboxField label="Back logo (needs a back mould)" {...register('backLogo')} />
          {e.backLogo?.message && <FieldProblem>{e.backLogo.message}</FieldProblem>}
          <CheckboxField label="Printed areas" {...register('printing')} />
          <CheckboxField label="Epoxy dome" {...register('epoxy')} />
          {warningFor('epoxy') && <Warn>{warningFor('epoxy')}</Warn>}
          <CheckboxField label="Sandblasted texture" {...register('sandblast')} />
          {e.sandblast?.message && <FieldProblem>{e.sandblast.message}</FieldProblem>}
        </div>
        <div className="md:col-span-3">
          <TextAreaField label="Notes" rows={3} {...register('notes')} error={e.notes?.message} />
        </div>
      </fieldset>

      {error && <ErrorPanel title="Not saved" message={error} />}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" size="lg" disabled={pending}>
          {submitLabel}
        </Button>
        {onCancel && (
          <Button variant="secondary" size="lg" onClick={onCancel}>
            Cancel
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
