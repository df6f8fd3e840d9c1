import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MouldLibraryItem, MouldPatch } from '@shared/schemas/trays';
import { mouldsKeys } from './moulds-keys';

export const mouldsQueryOptions = () => queryOptions({ queryKey: mouldsKeys.list(), queryFn: () => api.get<MouldLibraryItem[]>('/moulds') });
export const useMoulds = () => useQuery(mouldsQueryOptions());

export function useUpdateMould() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, patch }: { id: string; patch: MouldPatch }) => api.patch<MouldLibraryItem>(`/moulds/${id}`, patch),
    onSuccess: () => qc.invalidateQueries({ queryKey: mouldsKeys.all }),
  });
}
