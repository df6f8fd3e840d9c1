import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { redirect, useNavigate, useSearchParams } from 'react-router';
import { loginBody, type LoginBody } from '@shared/schemas/auth';
import { useSignIn } from '@/features/auth/api/sign-in';
import { TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { queryClient } from '@/lib/query-client';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { paths, roleHome } from '@/config/paths';
import { authKeys } from '@/features/auth/api/auth-keys';

export async function loader() {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (me) throw redirect(roleHome[me.user.role]);
  return null;
}

/** Only same-site paths are followed after sign-in. */
function safeNext(next: string | null): string | null {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : null;
}

export function Component() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const signIn = useSignIn();
  const form = useForm<LoginBody>({ resolver: zodResolver(loginBody), defaultValues: { email: '', password: '' } });

  const onSubmit = form.handleSubmit((values) =>
    signIn.mutate(values, {
      onSuccess: async ({ user }) => {
        // refetch the (inactive) session query too, or the signed-in area's loader would read the stale "nobody"
        await queryClient.invalidateQueries({ queryKey: authKeys.all, refetchType: 'all' });
        navigate(safeNext(params.get('next')) ?? roleHome[user.role], { replace: true });
      },
    }),
  );

  return (
    <main className="flex min-h-full items-center justify-center bg-harbour-800 p-4">
      <div className="w-full max-w-md rounded-2xl bg-paper p-8 shadow-xl">
        <div className="mb-6 flex items-center gap-3">
          <img src="/favicon.svg" alt="" className="h-12 w-12" />
          <div>
            <h1 className="text-3xl font-bold text-harbour-900">Trayce</h1>
            <p className="text-harbour-700">Every tray, from the mould to the mail bag.</p>
          </div>
        </div>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          <TextField label="E-mail" type="email" autoComplete="username" {...form.register('email')} error={form.formState.errors.email?.message} />
          <TextField label="Password" type="password" autoComplete="current-password" {...form.register('password')} error={form.formState.errors.password?.message} />
          {signIn.error && <ErrorPanel title="Not signed in" message={signIn.error.message} />}
          <Button type="submit" size="lg" disabled={signIn.isPending}>
            {signIn.isPending ? 'Signing in…' : 'Sign in'}
          </Button>
        </form>
        <p className="mt-6 text-sm text-harbour-700">
          On a station tablet? Operators sign in there with their badge and PIN.{' '}
          <a className="font-bold underline" href={paths.station}>
            Open the station screen
          </a>
        </p>
      </div>
    </main>
  );
}
