import { api } from '@/lib/api-client';
import type { TrayCard } from '@shared/schemas/scans';
import { stationDb } from '../lib/station-db';

/** One traveller by its code, for a tray not in the station's list; cached like the others. */
export async function lookupTray(code: string, serverNowIso: string): Promise<TrayCard> {
  const card = await api.get<TrayCard>('/scans/lookup', { code });
  await stationDb().cards.put({ number: card.tray.number, card, asOf: serverNowIso });
  return card;
}
