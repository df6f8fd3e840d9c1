import { sqliteTable, text, integer, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { ms } from './columns';
import { orders } from './orders';

/**
 * How an open order's projected dates moved: one row per order per factory day (the first
 * projection of that day) and one at its release. Written by the server when it projects the
 * floor; read by the order page's small chart.
 */
export const projectionHistory = sqliteTable(
  'projection_history',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    /** the factory's local date of the projection (YYYY-MM-DD) */
    day: text('day').notNull(),
    reason: text('reason', { enum: ['daily', 'release'] }).notNull(),
    at: ms('at').notNull(),
    expectedAt: ms('expected_at'),
    p85At: ms('p85_at'),
    /** the station kind whose queue added the most waiting to the order's runs */
    drivingKind: text('driving_kind'),
  },
  (t) => [uniqueIndex('projection_history_order_day_uq').on(t.orderId, t.reason, t.day)],
);
