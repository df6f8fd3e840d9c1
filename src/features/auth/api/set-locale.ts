import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { LocaleBody, MeResponse } from '@shared/schemas/auth';
import { authKeys } from './auth-keys';

export const setLocale = (body: LocaleBody) => api.put<LocaleBody>('/auth/me/locale', body);

/** Saves the signed-in person's language; the cached session follows at once. */
export function useSetLocale() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: setLocale,
    onSuccess: ({ locale }) => {
      qc.setQueryData<MeResponse | null>(authKeys.me(), (me) => (me ? { ...me, user: { ...me.user, locale } } : me));
    },
  });
}
