import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StationQueue } from '@shared/schemas/scans';
import { stationDb } from '../lib/station-db';
import { stationKeys } from './station-keys';

/** The station's travellers; each card is also kept on the tablet for its offline guards. */
export async function getStationQueue(stationId: string): Promise<StationQueue> {
  const queue = await api.get<StationQueue>(`/stations/${stationId}/queue`);
  const db = stationDb();
  await db.cards.bulkPut(queue.trays.map((card) => ({ number: card.tray.number, card, asOf: queue.asOf })));
  await db.setMeta('stationInfo', queue.station);
  return queue;
}

export const stationQueueQueryOptions = (stationId: string) =>
  queryOptions({ queryKey: stationKeys.queue(stationId), queryFn: () => getStationQueue(stationId), refetchInterval: 60_000, retry: false });
export const useStationQueue = (stationId: string) => useQuery({ ...stationQueueQueryOptions(stationId), enabled: !!stationId });
