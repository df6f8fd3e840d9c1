import { sqliteTable, text, integer, real, index } from 'drizzle-orm/sqlite-core';
import { id, ms } from './columns';
import { orders } from './orders';

export const shipments = sqliteTable(
  'shipments',
  {
    id: id(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    carrier: text('carrier').notNull(),
    trackingNumber: text('tracking_number').notNull(),
    pieces: integer('pieces').notNull(),
    shippedAt: ms('shipped_at').notNull(),
    createdBy: text('created_by'),
    createdAt: ms('created_at').notNull(),
  },
  (t) => [index('shipments_order_idx').on(t.orderId), index('shipments_tracking_idx').on(t.trackingNumber)],
);

export const cartons = sqliteTable(
  'cartons',
  {
    id: id(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    shipmentId: text('shipment_id').references(() => shipments.id),
    count: integer('count').notNull(),
    piecesPerCarton: integer('pieces_per_carton').notNull(),
    weightKg: real('weight_kg'),
    createdBy: text('created_by'),
    createdAt: ms('created_at').notNull(),
  },
  (t) => [index('cartons_order_idx').on(t.orderId)],
);

/** Read-only customer status links; only the token's hash is stored. */
export const shareLinks = sqliteTable('share_links', {
  id: id(),
  orderId: text('order_id')
    .notNull()
    .references(() => orders.id),
  tokenHash: text('token_hash').notNull().unique(),
  createdBy: text('created_by'),
  createdAt: ms('created_at').notNull(),
  revokedAt: ms('revoked_at'),
});

/** Outgoing mail, queued so a send never blocks a scan or a release. */
export const mailQueue = sqliteTable('mail_queue', {
  id: id(),
  kind: text('kind').notNull(),
  to: text('to').notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  html: text('html'),
  attachments: text('attachments', { mode: 'json' }),
  status: text('status', { enum: ['queued', 'sent', 'failed'] }).notNull().default('queued'),
  attempts: integer('attempts').notNull().default(0),
  nextAttemptAt: ms('next_attempt_at').notNull(),
  lastError: text('last_error'),
  createdAt: ms('created_at').notNull(),
  sentAt: ms('sent_at'),
});
