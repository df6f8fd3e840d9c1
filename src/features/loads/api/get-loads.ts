import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateLoadBody, LoadView, LoadsOverview } from '@shared/schemas/loads';
import { loadsKeys } from './loads-keys';

export const loadsQueryOptions = () =>
  queryOptions({ queryKey: loadsKeys.overview(), queryFn: () => api.get<LoadsOverview>('/loads'), refetchInterval: 30_000 });
export const useLoads = () => useQuery(loadsQueryOptions());

export function useCreateLoad() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateLoadBody) => api.post<LoadView>('/loads', body),
    onSuccess: () => qc.invalidateQueries({ queryKey: loadsKeys.all }),
  });
}

export function useSplitLoad() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post<LoadView>(`/loads/${id}/split`),
    onSuccess: () => qc.invalidateQueries({ queryKey: loadsKeys.all }),
  });
}
