import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ProjectionCoverage } from '@shared/schemas/projections';

export const coverageQueryOptions = queryOptions({
  queryKey: ['projections', 'coverage'],
  queryFn: () => api.get<{ coverage: ProjectionCoverage | null }>('/projections/coverage'),
  // measured by the backtest, kept with the release: it does not change while the app runs
  staleTime: Infinity,
});
export const useCoverage = () => useQuery(coverageQueryOptions);
