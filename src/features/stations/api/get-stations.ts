import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StationBody, StationView } from '@shared/schemas/stations';
import { stationsKeys } from './stations-keys';

export const stationsQueryOptions = () =>
  queryOptions({ queryKey: stationsKeys.list(), queryFn: () => api.get<StationView[]>('/stations'), staleTime: 5 * 60_000 });
export const useStations = () => useQuery(stationsQueryOptions());

export function useSaveStation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id?: string; body: Partial<StationBody> }) =>
      id ? api.patch<StationView>(`/stations/${id}`, body) : api.post<StationView>('/stations', body),
    onSuccess: () => qc.invalidateQueries({ queryKey: stationsKeys.all }),
  });
}
