import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateDeviceBody, DeviceView } from '@shared/schemas/stations';
import { devicesKeys } from './devices-keys';

export const devicesQueryOptions = () => queryOptions({ queryKey: devicesKeys.list(), queryFn: () => api.get<DeviceView[]>('/devices') });
export const useDevices = () => useQuery(devicesQueryOptions());

export interface NewDevice {
  id: string;
  token: string;
  pairingCode: string;
}

export function useCreateDevice() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateDeviceBody) => api.post<NewDevice>('/devices', body),
    onSuccess: () => qc.invalidateQueries({ queryKey: devicesKeys.all }),
  });
}

export function useUpdateDevice() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, patch }: { id: string; patch: Partial<Pick<DeviceView, 'name' | 'stationId' | 'locale' | 'idleMinutes' | 'active'>> }) =>
      api.patch<DeviceView>(`/devices/${id}`, patch),
    onSuccess: () => qc.invalidateQueries({ queryKey: devicesKeys.all }),
  });
}

export function useNewPairingCode() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post<NewDevice>(`/devices/${id}/pairing`),
    onSuccess: () => qc.invalidateQueries({ queryKey: devicesKeys.all }),
  });
}
