import { sqliteTable, text, real, index } from 'drizzle-orm/sqlite-core';
import { ms } from './columns';
import { orders } from './orders';

/** Hosted checkout sessions opened from a customer's order page; the id is the payment service's. */
export const checkoutSessions = sqliteTable(
  'checkout_sessions',
  {
    id: text('id').primaryKey(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    /** major units (2 decimals for most currencies), as asked for */
    amount: real('amount').notNull(),
    currency: text('currency').notNull(),
    url: text('url').notNull(),
    status: text('status', { enum: ['open', 'complete', 'expired'] })
      .notNull()
      .default('open'),
    createdAt: ms('created_at').notNull(),
    expiresAt: ms('expires_at').notNull(),
    completedAt: ms('completed_at'),
  },
  (t) => [index('checkout_sessions_order_idx').on(t.orderId)],
);
