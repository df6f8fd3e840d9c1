import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PublicStatus } from '@shared/schemas/shipping';

export const publicStatusQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['public-status', token] as const, queryFn: () => api.get<PublicStatus>(`/public/status/${token}`), refetchInterval: 300_000, refetchOnWindowFocus: false });
export const usePublicStatus = (token: string) => useQuery(publicStatusQueryOptions(token));
