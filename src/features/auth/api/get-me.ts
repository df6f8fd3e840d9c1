import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api-client';
import type { MeResponse } from '@shared/schemas/auth';
import { authKeys } from './auth-keys';

/** The signed-in person, or null when nobody is signed in. */
export async function getMe(): Promise<MeResponse | null> {
  try {
    return await api.get<MeResponse>('/auth/me');
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: 60_000 });
export const useMe = () => useQuery(meQueryOptions());
