import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ChangePasswordBody, LoginBody, SessionUserWire } from '@shared/schemas/auth';
import { authKeys } from './auth-keys';

export const signIn = (body: LoginBody) => api.post<{ user: SessionUserWire }>('/auth/login', body);
export const signOut = () => api.post<void>('/auth/logout');
export const changePassword = (body: ChangePasswordBody) => api.post<{ ok: true }>('/auth/me/password', body);

export function useChangePassword() {
  const qc = useQueryClient();
  // refetch the (inactive) session query too, so the signed-in area's loader reads the change
  return useMutation({ mutationFn: changePassword, onSuccess: () => qc.invalidateQueries({ queryKey: authKeys.all, refetchType: 'all' }) });
}

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: signIn, onSuccess: () => qc.invalidateQueries({ queryKey: authKeys.all }) });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      qc.clear();
    },
  });
}
