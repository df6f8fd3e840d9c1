import { and, desc, eq } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { payments } from '../db/schema/orders';
import { checkoutSessions } from '../db/schema/payments';
import { settings } from '../db/schema/reference-data';

export type CheckoutSessionRow = typeof checkoutSessions.$inferSelect;

const SETTINGS_KEY = 'payments';

export const paymentsRepository = {
  settings: (db: Db) => db.select().from(settings).where(eq(settings.key, SETTINGS_KEY)).get()?.value as Record<string, unknown> | undefined,
  saveSettings: (db: Db, value: Record<string, unknown>) =>
    db.insert(settings).values({ key: SETTINGS_KEY, value }).onConflictDoUpdate({ target: settings.key, set: { value } }).run(),

  byEventId: (db: Db, eventId: string) => db.select().from(payments).where(eq(payments.eventId, eventId)).get(),

  insertSession: (db: Db, row: typeof checkoutSessions.$inferInsert) => db.insert(checkoutSessions).values(row).run(),
  session: (db: Db, id: string) => db.select().from(checkoutSessions).where(eq(checkoutSessions.id, id)).get(),
  /** the newest session still open for this order and amount (a second click reuses it) */
  openSession: (db: Db, orderId: string, amount: number, currency: string, now: number) =>
    db
      .select()
      .from(checkoutSessions)
      .where(
        and(
          eq(checkoutSessions.orderId, orderId),
          eq(checkoutSessions.status, 'open'),
          eq(checkoutSessions.amount, amount),
          eq(checkoutSessions.currency, currency),
        ),
      )
      .orderBy(desc(checkoutSessions.createdAt))
      .all()
      .find((s) => s.expiresAt > now + 10 * 60_000),
  /** guarded: only an open session completes; returns whether it did */
  completeSession: (db: Db, id: string, at: number) =>
    db
      .update(checkoutSessions)
      .set({ status: 'complete', completedAt: at })
      .where(and(eq(checkoutSessions.id, id), eq(checkoutSessions.status, 'open')))
      .run().changes > 0,
};
