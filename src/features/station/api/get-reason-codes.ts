import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ReasonCodeView } from '@shared/schemas/stations';
import { stationDb } from '../lib/station-db';
import { stationKeys } from './station-keys';

/** Scrap, rework and hold reasons; kept on the tablet for offline use. */
export async function getReasonCodes(): Promise<ReasonCodeView[]> {
  const db = stationDb();
  try {
    const list = await api.get<ReasonCodeView[]>('/reason-codes');
    await db.setMeta('reasonCodes', list);
    return list;
  } catch (error) {
    const cached = await db.getMeta<ReasonCodeView[]>('reasonCodes');
    if (cached) return cached;
    throw error;
  }
}

export const reasonCodesQueryOptions = () =>
  queryOptions({ queryKey: stationKeys.reasonCodes(), queryFn: getReasonCodes, staleTime: 10 * 60_000, networkMode: 'always', retry: false });
export const useReasonCodes = () => useQuery(reasonCodesQueryOptions());
