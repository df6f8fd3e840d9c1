import { and, desc, eq, isNotNull, isNull } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { shareLinks } from '../db/schema/shipping';
import { users } from '../db/schema/users';
import { settings } from '../db/schema/reference-data';
import type { CarrierLink } from '@shared/domain/carrier-tracking';

export type ShareLinkRow = typeof shareLinks.$inferSelect;
export type OrderLinkRow = ShareLinkRow & { orderId: string };
export type QuoteLinkRow = ShareLinkRow & { quoteId: string };

export const shareLinksRepository = {
  /** the factory's carriers and their tracking pages (settings key `carriers`; none when unset) */
  carriers(db: Db): CarrierLink[] {
    const value = db.select().from(settings).where(eq(settings.key, 'carriers')).get()?.value;
    return Array.isArray(value) ? (value as CarrierLink[]) : [];
  },
  insert: (db: Db, row: typeof shareLinks.$inferInsert) => db.insert(shareLinks).values(row).run(),
  /** the live order link with this token hash (it may have expired: the caller checks `expiresAt`) */
  activeByHash: (db: Db, tokenHash: string) =>
    db
      .select()
      .from(shareLinks)
      .where(and(eq(shareLinks.tokenHash, tokenHash), isNull(shareLinks.revokedAt), isNotNull(shareLinks.orderId)))
      .get() as OrderLinkRow | undefined,
  /** the live quote link with this token hash */
  activeQuoteLinkByHash: (db: Db, tokenHash: string) =>
    db
      .select()
      .from(shareLinks)
      .where(and(eq(shareLinks.tokenHash, tokenHash), isNull(shareLinks.revokedAt), isNotNull(shareLinks.quoteId)))
      .get() as QuoteLinkRow | undefined,
  forOrder: (db: Db, orderId: string) =>
    db
      .select({ link: shareLinks, by: users.name })
      .from(shareLinks)
      .leftJoin(users, eq(users.id, shareLinks.createdBy))
      .where(eq(shareLinks.orderId, orderId))
      .orderBy(desc(shareLinks.createdAt))
      .all(),
  forQuote: (db: Db, quoteId: string) => db.select().from(shareLinks).where(eq(shareLinks.quoteId, quoteId)).orderBy(desc(shareLinks.createdAt)).all(),
  revokeAll: (db: Db, orderId: string, at: number, by: string) =>
    db
      .update(shareLinks)
      .set({ revokedAt: at, revokedBy: by })
      .where(and(eq(shareLinks.orderId, orderId), isNull(shareLinks.revokedAt)))
      .run().changes,
  revokeAllForQuote: (db: Db, quoteId: string, at: number, by: string) =>
    db
      .update(shareLinks)
      .set({ revokedAt: at, revokedBy: by })
      .where(and(eq(shareLinks.quoteId, quoteId), isNull(shareLinks.revokedAt)))
      .run().changes,
  touchOpened: (db: Db, id: string, at: number) => db.update(shareLinks).set({ lastOpenedAt: at }).where(eq(shareLinks.id, id)).run(),
};
