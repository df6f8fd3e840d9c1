// QC photos on the supervisor's tray view, and the one choice made there: whether the customer
// may see a photo on her order page (none is shown unless a supervisor says so).
import type { AppDeps } from '../app-deps';
import { portalRepository } from '../repositories/portal.repository';
import { auditRepository } from '../repositories/audit.repository';
import { traysRepository } from '../repositories/trays.repository';
import { notFound } from '../errors';
import { readFile } from '../lib/file-store';
import type { TrayPhotoView } from '@shared/schemas/payments';

export const photosService = {
  ofTray(deps: AppDeps, trayId: string): TrayPhotoView[] {
    if (!traysRepository.byId(deps.db, trayId)) throw notFound('That tray');
    return portalRepository.photosOfTray(deps.db, trayId).map(({ photo, stationKind }) => ({
      id: photo.id,
      url: `/api/photos/${photo.id}/file`,
      mime: photo.mime,
      stationKind,
      takenAt: new Date(photo.createdAt).toISOString(),
      shareable: photo.shareable,
      sharedAt: photo.sharedAt == null ? null : new Date(photo.sharedAt).toISOString(),
    }));
  },

  file(deps: AppDeps, id: string) {
    const photo = portalRepository.photo(deps.db, id);
    if (!photo) throw notFound('That photo');
    const content = readFile(deps.env.dataDir, photo.fileHash);
    if (!content) throw notFound('The stored photo');
    return { content, mime: photo.mime };
  },

  setShareable(deps: AppDeps, id: string, shareable: boolean, actorId: string): TrayPhotoView {
    const photo = portalRepository.photo(deps.db, id);
    if (!photo) throw notFound('That photo');
    const now = deps.now();
    deps.db.transaction((tx) => {
      portalRepository.setShareable(tx, id, shareable, actorId, now);
      auditRepository.record(tx, now, {
        userId: actorId,
        action: shareable ? 'photo.share' : 'photo.unshare',
        entity: 'tray',
        entityId: photo.trayId,
        detail: { text: shareable ? 'QC photo shown to the customer' : 'QC photo no longer shown to the customer', photoId: id, params: {} },
      });
    });
    return photosService.ofTray(deps, photo.trayId).find((p) => p.id === id)!;
  },
};
