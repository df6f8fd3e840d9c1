import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OrderProjection } from '@shared/schemas/reports';

/** Every open order's projected dates (the server keeps them for a minute). */
export const projectionsQueryOptions = queryOptions({
  queryKey: ['projections', 'all'],
  queryFn: () => api.get<OrderProjection[]>('/projections'),
  staleTime: 60_000,
});
export const useProjections = () => useQuery(projectionsQueryOptions);
