import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api-client';
import type { DeviceView } from '@shared/schemas/stations';
import type { StationKind } from '@shared/domain/vocabulary';
import { stationDb } from '../lib/station-db';
import { stationKeys } from './station-keys';
import { setFactoryTimeZone } from '@/lib/datetime';

export interface CurrentDevice extends DeviceView {
  station: { id: string; code: string; name: string; kind: StationKind } | null;
  /** the factory's zone: the tablet shows its times in it */
  timeZone?: string;
}

export type DeviceAnswer = { state: 'paired'; device: CurrentDevice; offline: boolean } | { state: 'unpaired' };

/**
 * The tablet itself: which station it belongs to. Kept on the tablet so the station screen opens
 * offline too; a 401 means the device token is gone and the tablet must be paired again.
 */
export async function getCurrentDevice(): Promise<DeviceAnswer> {
  const db = stationDb();
  try {
    const device = await api.get<CurrentDevice | null>('/devices/current');
    if (!device) {
      await db.setMeta('device', null);
      return { state: 'unpaired' };
    }
    await db.setMeta('device', device);
    setFactoryTimeZone(device.timeZone);
    return { state: 'paired', device, offline: false };
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) {
      await db.setMeta('device', null);
      return { state: 'unpaired' };
    }
    const cached = await db.getMeta<CurrentDevice | null>('device');
    if (cached) {
      setFactoryTimeZone(cached.timeZone);
      return { state: 'paired', device: cached, offline: true };
    }
    throw error;
  }
}

export const currentDeviceQueryOptions = () =>
  queryOptions({ queryKey: stationKeys.device(), queryFn: getCurrentDevice, staleTime: 5 * 60_000, retry: false, networkMode: 'always' });
export const useCurrentDevice = () => useQuery(currentDeviceQueryOptions());
