import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ScanResult } from '@shared/schemas/scans';
import { scanExceptionKeys } from './scan-exceptions-keys';

export const retryScanException = (id: string) => api.post<ScanResult>(`/scans/exceptions/${id}/retry`);
export const resolveScanException = (id: string, resolution: string) =>
  api.post<{ id: string; resolvedAt: string }>(`/scans/exceptions/${id}/resolve`, { resolution });

export function useRetryScanException() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: retryScanException, onSettled: () => qc.invalidateQueries({ queryKey: scanExceptionKeys.all }) });
}

export function useResolveScanException() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, resolution }: { id: string; resolution: string }) => resolveScanException(id, resolution),
    onSettled: () => qc.invalidateQueries({ queryKey: scanExceptionKeys.all }),
  });
}
