import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { WallView } from '@shared/schemas/live';
import { liveKeys } from './live-keys';

export const wallQueryOptions = () =>
  queryOptions({
    queryKey: liveKeys.wall(),
    queryFn: () => api.get<WallView>('/wall'),
    // the stream keeps it fresh; this is the safety net for refusals resolved elsewhere
    refetchInterval: 60_000,
    staleTime: 5_000,
  });

export const useWall = () => useQuery(wallQueryOptions());
