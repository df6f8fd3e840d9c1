import { sqliteTable, text, integer, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { id, ms, createdAt, updatedAt } from './columns';
import { customers } from './customers';
import { orders } from './orders';
import { users } from './users';

/** A quote to a customer; what it offers is in its versions (a change makes a new one). */
export const quotes = sqliteTable(
  'quotes',
  {
    id: id(),
    number: text('number').notNull().unique(),
    customerId: text('customer_id')
      .notNull()
      .references(() => customers.id),
    contactName: text('contact_name'),
    contactEmail: text('contact_email').notNull(),
    /** the version the customer sees and may accept */
    currentVersion: integer('current_version').notNull(),
    sentAt: ms('sent_at'),
    /** the order made when the customer accepted */
    orderId: text('order_id').references(() => orders.id),
    acceptedVersion: integer('accepted_version'),
    acceptedQuantity: integer('accepted_quantity'),
    acceptedName: text('accepted_name'),
    acceptedAt: ms('accepted_at'),
    createdBy: text('created_by').references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('quotes_customer_idx').on(t.customerId), uniqueIndex('quotes_order_uq').on(t.orderId)],
);

/** One version of a quote, kept as it was priced: spec, breaks, the rates used and the lines. */
export const quoteVersions = sqliteTable(
  'quote_versions',
  {
    id: id(),
    quoteId: text('quote_id')
      .notNull()
      .references(() => quotes.id),
    version: integer('version').notNull(),
    spec: text('spec', { mode: 'json' }).notNull(),
    quantities: text('quantities', { mode: 'json' }).$type<number[]>().notNull(),
    validUntil: text('valid_until').notNull(),
    notes: text('notes').notNull().default(''),
    currency: text('currency').notNull(),
    /** the costing settings the lines were priced with */
    settings: text('settings', { mode: 'json' }).notNull(),
    /** the priced quote (moulds, lines with breakdowns and step costs) */
    pricing: text('pricing', { mode: 'json' }).notNull(),
    createdBy: text('created_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('quote_versions_uq').on(t.quoteId, t.version)],
);
