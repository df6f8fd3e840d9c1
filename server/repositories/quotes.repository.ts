import { desc, eq, sql, and } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { quotes, quoteVersions } from '../db/schema/quotes';
import { customers } from '../db/schema/customers';
import { orders } from '../db/schema/orders';
import { settings } from '../db/schema/reference-data';
import { users } from '../db/schema/users';

export type QuoteRow = typeof quotes.$inferSelect;
export type QuoteVersionRow = typeof quoteVersions.$inferSelect;

export const quotesRepository = {
  byId: (db: Db, id: string) => db.select().from(quotes).where(eq(quotes.id, id)).get(),
  byOrderId: (db: Db, orderId: string) => db.select().from(quotes).where(eq(quotes.orderId, orderId)).get(),
  /** the highest number so far (numbers are Q- and digits) */
  maxNumber: (db: Db) =>
    db
      .select({ n: sql<number | null>`max(cast(substr(${quotes.number}, 3) as integer))` })
      .from(quotes)
      .get()?.n ?? null,
  insert: (db: Db, row: typeof quotes.$inferInsert) => db.insert(quotes).values(row).run(),
  update: (db: Db, id: string, patch: Partial<typeof quotes.$inferInsert>) => db.update(quotes).set(patch).where(eq(quotes.id, id)).run(),
  /** marks the quote accepted only if it was not already: false when someone else got there first */
  markAccepted: (
    db: Db,
    id: string,
    patch: Pick<typeof quotes.$inferInsert, 'orderId' | 'acceptedVersion' | 'acceptedQuantity' | 'acceptedName' | 'acceptedAt' | 'updatedAt'>,
  ) =>
    db
      .update(quotes)
      .set(patch)
      .where(and(eq(quotes.id, id), sql`${quotes.orderId} is null`))
      .run().changes > 0,
  insertVersion: (db: Db, row: typeof quoteVersions.$inferInsert) => db.insert(quoteVersions).values(row).run(),
  version: (db: Db, quoteId: string, version: number) =>
    db
      .select()
      .from(quoteVersions)
      .where(and(eq(quoteVersions.quoteId, quoteId), eq(quoteVersions.version, version)))
      .get(),
  versions: (db: Db, quoteId: string) =>
    db
      .select({ v: quoteVersions, by: users.name })
      .from(quoteVersions)
      .leftJoin(users, eq(users.id, quoteVersions.createdBy))
      .where(eq(quoteVersions.quoteId, quoteId))
      .orderBy(desc(quoteVersions.version))
      .all(),
  list: (db: Db) =>
    db
      .select({ quote: quotes, version: quoteVersions, customer: customers.name, orderNumber: orders.number })
      .from(quotes)
      .innerJoin(quoteVersions, and(eq(quoteVersions.quoteId, quotes.id), eq(quoteVersions.version, quotes.currentVersion)))
      .innerJoin(customers, eq(customers.id, quotes.customerId))
      .leftJoin(orders, eq(orders.id, quotes.orderId))
      .orderBy(desc(quotes.updatedAt))
      .all(),
  /** accepted quotes with their orders (quoted against actual) */
  accepted: (db: Db) =>
    db
      .select({ quote: quotes, version: quoteVersions, order: orders })
      .from(quotes)
      .innerJoin(quoteVersions, and(eq(quoteVersions.quoteId, quotes.id), eq(quoteVersions.version, quotes.acceptedVersion)))
      .innerJoin(orders, eq(orders.id, quotes.orderId))
      .all(),

  // --- the costing rates (settings key `costing`)
  costingSettings: (db: Db) => db.select().from(settings).where(eq(settings.key, 'costing')).get()?.value ?? null,
  saveCostingSettings: (db: Db, value: unknown) =>
    db.insert(settings).values({ key: 'costing', value }).onConflictDoUpdate({ target: settings.key, set: { value } }).run(),
};
