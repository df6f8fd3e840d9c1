import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MergeBody, SplitBody } from '@shared/schemas/trays';
import { traysKeys } from './trays-keys';

interface Printed {
  id: string;
  number: string;
  quantity?: number;
  revision: number;
  code: string;
}

/** Mutations here also call `onChanged` so the page that shows the tray's order can refresh it. */
export function useReprint(onChanged?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (trayId: string) => api.post<Printed>(`/trays/${encodeURIComponent(trayId)}/reprint`),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: traysKeys.all });
      onChanged?.();
    },
  });
}

export function useSplitTray(trayId: string, onChanged?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SplitBody) => api.post<{ tray: Printed; children: Printed[] }>(`/trays/${encodeURIComponent(trayId)}/split`, body),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: traysKeys.all });
      onChanged?.();
    },
  });
}

export function useMergeTrays(onChanged?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: MergeBody) => api.post<{ tray: Printed; merged: string[] }>('/trays/merge', body),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: traysKeys.all });
      onChanged?.();
    },
  });
}
