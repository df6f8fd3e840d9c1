import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { createUserBody, type CreateUserBody } from '@shared/schemas/users';
import { useTranslation } from 'react-i18next';
import { ROLES } from '@shared/domain/vocabulary';
import { TextField, SelectField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { errorText } from '@/lib/error-text';
import { useCreateUser } from '../api/save-user';

export function UserForm({ onDone }: { onDone: () => void }) {
  const { t } = useTranslation(['users', 'common']);
  const create = useCreateUser();
  const form = useForm<CreateUserBody>({ resolver: zodResolver(createUserBody), defaultValues: { role: 'operator' } });
  const e = form.formState.errors;
  const submit = form.handleSubmit((v) => {
    const body = { ...v, badge: v.badge || undefined, pin: v.pin || undefined };
    create.mutate(body, { onSuccess: () => (form.reset(), onDone()) });
  });
  return (
    <form onSubmit={submit} noValidate className="grid gap-4 md:grid-cols-3">
      <TextField label={t('form.name')} {...form.register('name')} error={e.name?.message} />
      <TextField label={t('form.email')} type="email" {...form.register('email')} error={e.email?.message} />
      <SelectField label={t('form.role')} {...form.register('role')} error={e.role?.message}>
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {t(`common:role.${r}`)}
          </option>
        ))}
      </SelectField>
      <TextField
        label={t('form.password')}
        type="password"
        autoComplete="new-password"
        {...form.register('password')}
        error={e.password?.message}
        hint={t('form.passwordHint')}
      />
      <TextField label={t('form.badge')} {...form.register('badge', { setValueAs: (v) => v || undefined })} error={e.badge?.message} />
      <TextField
        label={t('form.pin')}
        inputMode="numeric"
        type="password"
        autoComplete="off"
        {...form.register('pin', { setValueAs: (v) => v || undefined })}
        error={e.pin?.message}
        hint={t('form.pinHint')}
      />
      {create.error && (
        <div className="md:col-span-3">
          <ErrorPanel title={t('form.notSaved')} message={errorText(create.error)} />
        </div>
      )}
      <div className="md:col-span-3">
        <Button type="submit" disabled={create.isPending}>
          {t('form.submit')}
        </Button>
      </div>
    </form>
  );
}
