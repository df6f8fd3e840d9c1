import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TrayView } from '@shared/schemas/trays';
import { traysKeys } from './trays-keys';

export const trayQueryOptions = (id: string) =>
  queryOptions({ queryKey: traysKeys.detail(id), queryFn: () => api.get<TrayView>(`/trays/${encodeURIComponent(id)}`) });
export const useTray = (id: string) => useQuery(trayQueryOptions(id));

export const trayPdfUrl = (id: string, layout = 'a6') => `/api/trays/${encodeURIComponent(id)}/traveller.pdf?layout=${layout}`;
