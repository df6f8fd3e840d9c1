import { redirect, type LoaderFunctionArgs } from 'react-router';
import { queryClient } from '@/lib/query-client';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { paths } from '@/config/paths';
import { applyLocale } from '@/lib/i18n';
import { setFactoryTimeZone } from '@/lib/datetime';

/** Loader of the signed-in area: sends visitors without a session to the sign-in page. */
export async function requireUser({ request }: LoaderFunctionArgs) {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (!me) {
    const url = new URL(request.url);
    throw redirect(`${paths.signIn}?next=${encodeURIComponent(url.pathname + url.search)}`);
  }
  applyLocale(me.user.locale);
  setFactoryTimeZone(me.timeZone);
  if (me.user.mustChangePassword) {
    const url = new URL(request.url);
    throw redirect(`${paths.changePassword}?next=${encodeURIComponent(url.pathname + url.search)}`);
  }
  return me;
}
