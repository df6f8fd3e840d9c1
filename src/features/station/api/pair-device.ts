import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DeviceView } from '@shared/schemas/stations';
import { stationKeys } from './station-keys';

export const pairDevice = (code: string) => api.post<{ device: DeviceView }>('/devices/pair', { code });

export function usePairDevice() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: pairDevice, onSuccess: () => qc.invalidateQueries({ queryKey: stationKeys.all }) });
}
