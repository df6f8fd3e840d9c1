import { sqliteTable, text, integer, real, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { id, ms, flag } from './columns';
import { orders } from './orders';
import { quotes } from './quotes';

export const shipments = sqliteTable(
  'shipments',
  {
    id: id(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    /** 1, 2, 3… per order (partial shipments) */
    number: integer('number').notNull(),
    carrier: text('carrier').notNull(),
    trackingNumber: text('tracking_number').notNull(),
    pieces: integer('pieces').notNull(),
    shippedAt: ms('shipped_at').notNull(),
    /** shipped fewer pieces than ordered on a recorded decision */
    shortAccepted: flag('short_accepted').notNull().default(false),
    note: text('note'),
    createdBy: text('created_by'),
    createdAt: ms('created_at').notNull(),
  },
  (t) => [
    index('shipments_order_idx').on(t.orderId),
    index('shipments_tracking_idx').on(t.trackingNumber),
    uniqueIndex('shipments_order_number_uq').on(t.orderId, t.number),
  ],
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

/**
 * Customer links (no sign-in); only the token's hash is stored. A link opens one order's status
 * page, or one quote (quote_id set, order_id empty).
 */
export const shareLinks = sqliteTable(
  'share_links',
  {
    id: id(),
    orderId: text('order_id').references(() => orders.id),
    quoteId: text('quote_id').references(() => quotes.id),
    tokenHash: text('token_hash').notNull().unique(),
    /** why it was made: by a person, for the shipped mail, sent with a quote, or made when a quote was accepted */
    purpose: text('purpose', { enum: ['manual', 'shipped_mail', 'quote', 'quote_accepted'] })
      .notNull()
      .default('manual'),
    createdBy: text('created_by'),
    createdAt: ms('created_at').notNull(),
    revokedAt: ms('revoked_at'),
    revokedBy: text('revoked_by'),
    /** after this instant the link stops working; null: until revoked */
    expiresAt: ms('expires_at'),
    lastOpenedAt: ms('last_opened_at'),
  },
  (t) => [index('share_links_order_idx').on(t.orderId), index('share_links_quote_idx').on(t.quoteId)],
);

/** Outgoing mail, queued so a send never blocks a scan or a release. */
export const mailQueue = sqliteTable('mail_queue', {
  id: id(),
  kind: text('kind').notNull(),
  /** a message that must go once only (the daily digest per day and person) */
  dedupeKey: text('dedupe_key').unique(),
  orderId: text('order_id'),
  to: text('to').notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  html: text('html'),
  attachments: text('attachments', { mode: 'json' }),
  status: text('status', { enum: ['queued', 'sent', 'failed'] })
    .notNull()
    .default('queued'),
  attempts: integer('attempts').notNull().default(0),
  nextAttemptAt: ms('next_attempt_at').notNull(),
  lastError: text('last_error'),
  createdAt: ms('created_at').notNull(),
  sentAt: ms('sent_at'),
});
