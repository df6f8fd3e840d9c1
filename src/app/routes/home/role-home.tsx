import { redirect } from 'react-router';
import { queryClient } from '@/lib/query-client';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { paths, roleHome } from '@/config/paths';

/** "/" sends each person to the first thing their role needs. */
export async function loader() {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  throw redirect(me ? roleHome[me.user.role] : paths.signIn);
}

export function Component() {
  return null;
}
