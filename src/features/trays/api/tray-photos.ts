import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TrayPhotoView } from '@shared/schemas/payments';
import { traysKeys } from './trays-keys';

export const trayPhotosQueryOptions = (trayId: string) =>
  queryOptions({
    queryKey: [...traysKeys.detail(trayId), 'photos'] as const,
    queryFn: () => api.get<TrayPhotoView[]>(`/trays/${encodeURIComponent(trayId)}/photos`),
  });
export const useTrayPhotos = (trayId: string, enabled = true) => useQuery({ ...trayPhotosQueryOptions(trayId), enabled });

/** Shows a QC photo to the customer on her order page, or stops showing it. */
export function useSharePhoto(trayId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, shareable }: { id: string; shareable: boolean }) => api.patch<TrayPhotoView>(`/photos/${encodeURIComponent(id)}`, { shareable }),
    onSuccess: () => qc.invalidateQueries({ queryKey: trayPhotosQueryOptions(trayId).queryKey }),
  });
}
