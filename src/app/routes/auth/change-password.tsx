import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { redirect, useNavigate, useSearchParams } from 'react-router';
import { useTranslation } from 'react-i18next';
import { passwordSchema } from '@shared/schemas/auth';
import { useChangePassword } from '@/features/auth/api/sign-in';
import { TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { queryClient } from '@/lib/query-client';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { paths, roleHome } from '@/config/paths';
import { applyLocale } from '@/lib/i18n';
import { errorText } from '@/lib/error-text';

export async function loader() {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (!me) throw redirect(paths.signIn);
  applyLocale(me.user.locale);
  if (!me.user.mustChangePassword) throw redirect(roleHome[me.user.role]);
  return null;
}

const form = z
  .object({ currentPassword: z.string().min(1), newPassword: passwordSchema, repeat: z.string() })
  .refine((v) => v.newPassword === v.repeat, { path: ['repeat'], message: 'mismatch' });
type FormValues = z.infer<typeof form>;

/** Only same-site paths are followed afterwards. */
function safeNext(next: string | null): string | null {
  return next && next.startsWith('/') && !next.startsWith('//') && !next.startsWith(paths.changePassword) ? next : null;
}

/** A first admin on the documented default password chooses their own before anything else opens. */
export function Component() {
  const { t } = useTranslation();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const change = useChangePassword();
  const f = useForm<FormValues>({ resolver: zodResolver(form), defaultValues: { currentPassword: '', newPassword: '', repeat: '' } });
  const errors = f.formState.errors;

  const onSubmit = f.handleSubmit(({ currentPassword, newPassword }) =>
    change.mutate(
      { currentPassword, newPassword },
      {
        onSuccess: async () => {
          const me = await queryClient.fetchQuery(meQueryOptions());
          navigate(safeNext(params.get('next')) ?? (me ? roleHome[me.user.role] : paths.signIn), { replace: true });
        },
      },
    ),
  );

  return (
    <main className="flex min-h-full items-center justify-center bg-harbour-800 p-4">
      <div className="w-full max-w-md rounded-2xl bg-paper p-8 shadow-xl">
        <h1 className="text-2xl font-bold text-harbour-900">{t('changePassword.title')}</h1>
        <p className="mt-2 mb-6 text-harbour-700">{t('changePassword.why')}</p>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          <TextField
            label={t('changePassword.current')}
            type="password"
            autoComplete="current-password"
            {...f.register('currentPassword')}
            error={errors.currentPassword && t('changePassword.enterCurrent')}
          />
          <TextField
            label={t('changePassword.next')}
            type="password"
            autoComplete="new-password"
            {...f.register('newPassword')}
            error={errors.newPassword && t('changePassword.tooShort')}
          />
          <TextField
            label={t('changePassword.repeat')}
            type="password"
            autoComplete="new-password"
            {...f.register('repeat')}
            error={errors.repeat && t('changePassword.mismatch')}
          />
          {change.error && <ErrorPanel title={t('changePassword.failed')} message={errorText(change.error)} />}
          <Button type="submit" size="lg" disabled={change.isPending}>
            {change.isPending ? t('changePassword.working') : t('changePassword.submit')}
          </Button>
        </form>
      </div>
    </main>
  );
}
