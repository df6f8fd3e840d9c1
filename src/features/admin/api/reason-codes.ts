import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ReasonCodeAdminView, ReasonCodeBody } from '@shared/schemas/admin';
import { adminKeys } from './admin-keys';

export const reasonCodesAdminQueryOptions = () =>
  queryOptions({ queryKey: adminKeys.reasonCodes(), queryFn: () => api.get<ReasonCodeAdminView[]>('/admin/reason-codes') });
export const useReasonCodesAdmin = () => useQuery(reasonCodesAdminQueryOptions());

export function useSaveReasonCode() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ existing, body }: { existing?: string; body: Partial<ReasonCodeBody> }) =>
      existing ? api.patch<ReasonCodeAdminView>(`/admin/reason-codes/${existing}`, body) : api.post<ReasonCodeAdminView>('/admin/reason-codes', body),
    onSuccess: () => qc.invalidateQueries({ queryKey: adminKeys.reasonCodes() }),
  });
}
