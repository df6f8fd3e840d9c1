import { and, asc, desc, eq, lte } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { mailQueue } from '../db/schema/shipping';

export type MailRow = typeof mailQueue.$inferSelect;
export type NewMailRow = typeof mailQueue.$inferInsert;

export const mailRepository = {
  /** queues a message; one with a dedupe key already queued is left alone (returns false) */
  insert: (db: Db, row: NewMailRow) => db.insert(mailQueue).values(row).onConflictDoNothing({ target: mailQueue.dedupeKey }).run().changes > 0,
  due: (db: Db, now: number, limit: number) =>
    db
      .select()
      .from(mailQueue)
      .where(and(eq(mailQueue.status, 'queued'), lte(mailQueue.nextAttemptAt, now)))
      .orderBy(asc(mailQueue.nextAttemptAt), asc(mailQueue.createdAt))
      .limit(limit)
      .all(),
  markSent: (db: Db, id: string, at: number, attempts: number) =>
    db.update(mailQueue).set({ status: 'sent', sentAt: at, attempts, lastError: null }).where(eq(mailQueue.id, id)).run(),
  markRetry: (db: Db, id: string, attempts: number, nextAttemptAt: number, error: string) =>
    db.update(mailQueue).set({ attempts, nextAttemptAt, lastError: error }).where(eq(mailQueue.id, id)).run(),
  markFailed: (db: Db, id: string, attempts: number, error: string) =>
    db.update(mailQueue).set({ status: 'failed', attempts, lastError: error }).where(eq(mailQueue.id, id)).run(),
  requeue: (db: Db, id: string, at: number) =>
    db
      .update(mailQueue)
      .set({ status: 'queued', nextAttemptAt: at })
      .where(and(eq(mailQueue.id, id), eq(mailQueue.status, 'failed')))
      .run().changes > 0,
  hasKey: (db: Db, dedupeKey: string) => !!db.select({ id: mailQueue.id }).from(mailQueue).where(eq(mailQueue.dedupeKey, dedupeKey)).get(),
  recent: (db: Db, limit: number) => db.select().from(mailQueue).orderBy(desc(mailQueue.createdAt)).limit(limit).all(),
  forOrder: (db: Db, orderId: string) => db.select().from(mailQueue).where(eq(mailQueue.orderId, orderId)).orderBy(asc(mailQueue.createdAt)).all(),
};
