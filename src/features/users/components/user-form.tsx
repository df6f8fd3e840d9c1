import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { createUserBody, type CreateUserBody } from '@shared/schemas/users';
import { ROLES } from '@shared/domain/vocabulary';
import { TextField, SelectField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { useCreateUser } from '../api/save-user';

export function UserForm({ onDone }: { onDone: () => void }) {
  const create = useCreateUser();
  const form = useForm<CreateUserBody>({ resolver: zodResolver(createUserBody), defaultValues: { role: 'operator' } });
  const e = form.formState.errors;
  const submit = form.handleSubmit((v) => {
    const body = { ...v, badge: v.badge || undefined, pin: v.pin || undefined };
    create.mutate(body, { onSuccess: () => (form.reset(), onDone()) });
  });
  return (
    <form onSubmit={submit} noValidate className="grid gap-4 md:grid-cols-3">
      <TextField label="Name" {...form.register('name')} error={e.name?.message} />
      <TextField label="E-mail" type="email" {...form.register('email')} error={e.email?.message} />
      <SelectField label="Role" {...form.register('role')} error={e.role?.message}>
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {r}
          </option>
        ))}
      </SelectField>
      <TextField label="Password" type="password" autoComplete="new-password" {...form.register('password')} error={e.password?.message} hint="8 or more characters." />
      <TextField label="Badge (operators, supervisors)" {...form.register('badge', { setValueAs: (v) => v || undefined })} error={e.badge?.message} />
      <TextField label="PIN" inputMode="numeric" type="password" autoComplete="off" {...form.register('pin', { setValueAs: (v) => v || undefined })} error={e.pin?.message} hint="4 to 8 digits." />
      {create.error && (
        <div className="md:col-span-3">
          <ErrorPanel title="Not saved" message={create.error.message} />
        </div>
      )}
      <div className="md:col-span-3">
        <Button type="submit" disabled={create.isPending}>
          Add person
        </Button>
      </div>
    </form>
  );
}
