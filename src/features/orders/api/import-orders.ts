import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ImportPreview } from '@shared/domain/order-import';
import { ordersKeys } from './orders-keys';

export function usePreviewImport() {
  return useMutation({
    mutationFn: (input: { file: File } | { csv: string }) => {
      if ('file' in input) {
        const form = new FormData();
        form.append('file', input.file);
        return api.upload<ImportPreview>('/orders/import/preview', form);
      }
      return api.post<ImportPreview>('/orders/import/preview', { csv: input.csv });
    },
  });
}

export function useImportOrders() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (csv: string) => api.post<{ created: { line: number; id: string; number: string }[]; skipped: number[] }>('/orders/import', { csv }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ordersKeys.all }),
  });
}
