import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Locale } from '@shared/domain/vocabulary';
import { liveKeys } from './live-keys';

export interface CurrentDevice {
  id: string;
  name: string;
  kind: 'tablet' | 'wall';
  /** the language the admin set for this display */
  locale?: Locale;
}

/** The paired display this screen is (null when a person opened the wall in a browser of their own). */
export const wallDeviceQueryOptions = () =>
  queryOptions({
    queryKey: liveKeys.device(),
    queryFn: () => api.get<CurrentDevice | null>('/devices/current'),
    staleTime: 5 * 60_000,
    retry: false,
  });

export const useWallDevice = () => useQuery(wallDeviceQueryOptions());

export function usePairWall() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (code: string) => api.post<{ device: CurrentDevice }>('/devices/pair', { code }),
    onSuccess: () => qc.invalidateQueries({ queryKey: liveKeys.all }),
  });
}
