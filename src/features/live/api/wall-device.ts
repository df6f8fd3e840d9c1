import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { liveKeys } from './live-keys';

export interface CurrentDevice {
  id: string;
  name: string;
  kind: 'tablet' | 'wall';
}

export function usePairWall() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (code: string) => api.post<{ device: CurrentDevice }>('/devices/pair', { code }),
    onSuccess: () => qc.invalidateQueries({ queryKey: liveKeys.all }),
  });
}
