import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { redirect, useNavigate, useSearchParams } from 'react-router';
import { useTranslation } from 'react-i18next';
import { loginBody, type LoginBody } from '@shared/schemas/auth';
import { useSignIn } from '@/features/auth/api/sign-in';
import { TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { queryClient } from '@/lib/query-client';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { paths, roleHome } from '@/config/paths';
import { authKeys } from '@/features/auth/api/auth-keys';
import { LanguageSwitch } from '@/components/layout/language-switch';
import { applyLocale, currentLocale, rememberLocale } from '@/lib/i18n';
import { errorText } from '@/lib/error-text';
import type { Locale } from '@shared/domain/vocabulary';

export async function loader() {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (me) throw redirect(me.user.mustChangePassword ? paths.changePassword : roleHome[me.user.role]);
  return null;
}

/** Only same-site paths are followed after sign-in. */
function safeNext(next: string | null): string | null {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : null;
}

export function Component() {
  const { t } = useTranslation();
  const [locale, setLocale] = useState<Locale>(currentLocale);
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const signIn = useSignIn();
  const form = useForm<LoginBody>({ resolver: zodResolver(loginBody), defaultValues: { email: '', password: '' } });

  const onSubmit = form.handleSubmit((values) =>
    signIn.mutate(values, {
      onSuccess: async ({ user }) => {
        applyLocale(user.locale);
        // refetch the (inactive) session query too, or the signed-in area's loader would read the stale "nobody"
        await queryClient.invalidateQueries({ queryKey: authKeys.all, refetchType: 'all' });
        const next = safeNext(params.get('next')) ?? roleHome[user.role];
        navigate(user.mustChangePassword ? `${paths.changePassword}?next=${encodeURIComponent(next)}` : next, { replace: true });
      },
    }),
  );

  return (
    <main className="flex min-h-full items-center justify-center bg-harbour-800 p-4">
      <div className="w-full max-w-md rounded-2xl bg-paper p-8 shadow-xl">
        <div className="mb-4 flex justify-end">
          <LanguageSwitch
            tone="light"
            value={locale}
            onChange={(l) => {
              rememberLocale(l);
              setLocale(l);
            }}
          />
        </div>
        <div className="mb-6 flex items-center gap-3">
          <img src="/favicon.svg" alt="" className="h-12 w-12" />
          <div>
            <h1 className="text-3xl font-bold text-harbour-900">{t('app.name')}</h1>
            <p className="text-harbour-700">{t('app.tagline')}</p>
          </div>
        </div>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          <TextField
            label={t('signIn.email')}
            type="email"
            autoComplete="username"
            {...form.register('email')}
            error={form.formState.errors.email && t('signIn.enterEmail')}
          />
          <TextField
            label={t('signIn.password')}
            type="password"
            autoComplete="current-password"
            {...form.register('password')}
            error={form.formState.errors.password && t('signIn.enterPassword')}
          />
          {signIn.error && <ErrorPanel title={t('signIn.notSignedIn')} message={errorText(signIn.error)} />}
          <Button type="submit" size="lg" disabled={signIn.isPending}>
            {signIn.isPending ? t('signIn.working') : t('signIn.submit')}
          </Button>
        </form>
        <p className="mt-6 text-sm text-harbour-700">
          {t('signIn.tabletHint')}{' '}
          <a className="font-bold underline" href={paths.station}>
            {t('signIn.openStation')}
          </a>
        </p>
      </div>
    </main>
  );
}
