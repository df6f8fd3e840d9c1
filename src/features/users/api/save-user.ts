import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateUserBody, UpdateUserBody, UserView } from '@shared/schemas/users';
import { usersKeys } from './users-keys';

export function useCreateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateUserBody) => api.post<{ id: string }>('/users', body),
    onSuccess: () => qc.invalidateQueries({ queryKey: usersKeys.all }),
  });
}

export function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, patch }: { id: string; patch: UpdateUserBody }) => api.patch<UserView>(`/users/${id}`, patch),
    onSuccess: () => qc.invalidateQueries({ queryKey: usersKeys.all }),
  });
}
