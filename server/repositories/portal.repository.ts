import { and, eq, inArray, sql } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { attachments, scanEvents } from '../db/schema/scans';
import { trays } from '../db/schema/trays';

export const portalRepository = {
  /** per station kind, the first start and last finish scan of the order's travellers */
  stepTimes: (db: Db, orderId: string) =>
    db
      .select({
        stationKind: scanEvents.stationKind,
        firstStart: sql<number | null>`min(case when ${scanEvents.type} = 'start' then ${scanEvents.occurredAt} end)`,
        lastFinish: sql<number | null>`max(case when ${scanEvents.type} = 'finish' then ${scanEvents.occurredAt} end)`,
      })
      .from(scanEvents)
      .innerJoin(trays, eq(trays.id, scanEvents.trayId))
      .where(and(eq(trays.orderId, orderId), inArray(scanEvents.type, ['start', 'finish'])))
      .groupBy(scanEvents.stationKind)
      .all(),

  /** the order's photos a supervisor marked shareable, with the station kind of their scan */
  sharedPhotos: (db: Db, orderId: string) =>
    db
      .select({ id: attachments.id, createdAt: attachments.createdAt, stationKind: scanEvents.stationKind })
      .from(attachments)
      .innerJoin(trays, eq(trays.id, attachments.trayId))
      .leftJoin(scanEvents, eq(scanEvents.id, attachments.eventId))
      .where(and(eq(trays.orderId, orderId), eq(attachments.shareable, true)))
      .all(),

  /** one photo, if it belongs to the order and is shareable */
  sharedPhoto: (db: Db, orderId: string, photoId: string) =>
    db
      .select({ fileHash: attachments.fileHash, mime: attachments.mime })
      .from(attachments)
      .innerJoin(trays, eq(trays.id, attachments.trayId))
      .where(and(eq(attachments.id, photoId), eq(trays.orderId, orderId), eq(attachments.shareable, true)))
      .get(),

  // --- the supervisor's photo view
  photosOfTray: (db: Db, trayId: string) =>
    db
      .select({ photo: attachments, stationKind: scanEvents.stationKind })
      .from(attachments)
      .leftJoin(scanEvents, eq(scanEvents.id, attachments.eventId))
      .where(eq(attachments.trayId, trayId))
      .orderBy(attachments.createdAt)
      .all(),
  photo: (db: Db, id: string) => db.select().from(attachments).where(eq(attachments.id, id)).get(),
  setShareable: (db: Db, id: string, shareable: boolean, by: string, at: number) =>
    db
      .update(attachments)
      .set({ shareable, sharedBy: shareable ? by : null, sharedAt: shareable ? at : null })
      .where(eq(attachments.id, id))
      .run(),
};
