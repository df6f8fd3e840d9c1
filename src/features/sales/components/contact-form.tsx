import { useForm } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import { errorText } from '@/lib/error-text';
import { zodResolver } from '@hookform/resolvers/zod';
import { orderContactSchema, type OrderContactInput, type SalesOrderDetail } from '@shared/schemas/shipping';
import { SelectField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { useSetContact } from '../api/set-contact';
import { useOwners } from '../api/get-sales-order';

/** Who hears about the order: the customer's contact (shipped mail, proofs) and the sales owner. */
export function ContactForm({ order }: { order: SalesOrderDetail }) {
  const { t } = useTranslation('sales');
  const save = useSetContact(order.id);
  const owners = useOwners();
  const form = useForm<OrderContactInput>({
    resolver: zodResolver(orderContactSchema),
    values: { contactName: order.contact.contactName ?? '', contactEmail: order.contact.contactEmail ?? '', salesOwnerId: order.salesOwner?.id ?? null },
  });
  const e = form.formState.errors;
  return (
    <form noValidate className="flex flex-col gap-3" onSubmit={form.handleSubmit((v) => save.mutate({ ...v, salesOwnerId: v.salesOwnerId || null }))}>
      <TextField label={t('contact.name')} autoComplete="off" {...form.register('contactName')} error={e.contactName?.message} />
      <TextField
        label={t('contact.email')}
        type="email"
        inputMode="email"
        autoComplete="off"
        {...form.register('contactEmail')}
        error={e.contactEmail?.message}
        hint={t('contact.emailHint', { customer: order.customer })}
      />
      <SelectField label={t('contact.owner')} {...form.register('salesOwnerId', { setValueAs: (v) => v || null })} error={e.salesOwnerId?.message}>
        <option value="">{t('contact.nobody')}</option>
        {owners.data?.map((o) => (
          <option key={o.id} value={o.id}>
            {o.name}
          </option>
        ))}
      </SelectField>
      {save.error && <ErrorPanel message={errorText(save.error)} />}
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={save.isPending}>
          {t('contact.save')}
        </Button>
        {save.isSuccess && !form.formState.isDirty && (
          <span role="status" className="font-bold text-ok-700">
            {t('contact.saved')}
          </span>
        )}
      </div>
    </form>
  );
}
