import { api } from '@/lib/api-client';
import type { ScanBatchResponse, ScanEvent } from '@shared/schemas/scans';
import type { SyncTransport } from '../lib/sync-engine';
import type { PendingPhoto } from '../lib/station-db';

/** How the outbox reaches the server: the app's one fetch wrapper (errors carry the status; 0 = unreachable). */
export const httpTransport: SyncTransport = {
  postScans: (events: ScanEvent[]) => api.post<ScanBatchResponse>('/scans', { events }),
  clock: () => api.get<{ serverTime: string }>('/scans/clock'),
  uploadPhoto: async (photo: PendingPhoto) => {
    const form = new FormData();
    form.append('code', photo.code);
    if (photo.eventId) form.append('eventId', photo.eventId);
    if (photo.operatorId) form.append('operatorId', photo.operatorId);
    form.append('file', photo.blob, `${photo.trayNumber}.jpg`);
    await api.upload('/scans/photos', form);
  },
};
