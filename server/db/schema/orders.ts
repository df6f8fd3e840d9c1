import { sqliteTable, text, integer, real, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { id, ms, flag, createdAt, updatedAt } from './columns';
import { customers } from './customers';
import { users } from './users';

export interface ColourSpec {
  name: string;
  ref?: string;
  hex?: string;
}

export const orders = sqliteTable(
  'orders',
  {
    id: id(),
    number: text('number').notNull().unique(),
    customerId: text('customer_id')
      .notNull()
      .references(() => customers.id),
    title: text('title').notNull(),
    /** pin, coin, medal or key ring: decides which size bounds the form warns about */
    productType: text('product_type').notNull().default('pin'),
    process: text('process').notNull(),
    material: text('material').notNull(),
    sizeMm: real('size_mm').notNull(),
    quantity: integer('quantity').notNull(),
    overrunPct: real('overrun_pct').notNull().default(5),
    colours: text('colours', { mode: 'json' }).$type<ColourSpec[]>().notNull(),
    plating: text('plating').notNull(),
    /** a two-tone badge's second finish; null for one finish */
    secondPlating: text('second_plating'),
    backingType: text('backing_type').notNull(),
    backingCount: integer('backing_count').notNull().default(1),
    backLogo: flag('back_logo').notNull().default(false),
    printing: flag('printing').notNull().default(false),
    epoxy: flag('epoxy').notNull().default(false),
    sandblast: flag('sandblast').notNull().default(false),
    packaging: text('packaging').notNull(),
    dueDate: text('due_date').notNull(),
    notes: text('notes').notNull().default(''),
    status: text('status').notNull().default('draft'),
    /** the same artwork reordered shares this key, and so its stored moulds */
    designKey: text('design_key').notNull(),
    traySize: integer('tray_size'),
    salesOwnerId: text('sales_owner_id').references(() => users.id),
    createdBy: text('created_by').references(() => users.id),
    releasedAt: ms('released_at'),
    packedAt: ms('packed_at'),
    shippedAt: ms('shipped_at'),
    cancelledAt: ms('cancelled_at'),
    holdReason: text('hold_reason'),
    /** the agreed price of the whole order (the accepted quote line's total), in `currency`; null when none was agreed here */
    priceTotal: real('price_total'),
    /** ISO 4217 code, upper case */
    currency: text('currency'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index('orders_status_idx').on(t.status),
    index('orders_customer_idx').on(t.customerId),
    index('orders_due_idx').on(t.dueDate),
    index('orders_released_idx').on(t.releasedAt),
    index('orders_shipped_idx').on(t.shippedAt),
    index('orders_design_idx').on(t.designKey),
  ],
);

/** An order's routing. Steps for mould travellers are kept apart by traveller_kind. */
export const orderSteps = sqliteTable(
  'order_steps',
  {
    id: id(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id, { onDelete: 'cascade' }),
    travellerKind: text('traveller_kind', { enum: ['tray', 'mould'] })
      .notNull()
      .default('tray'),
    seq: integer('seq').notNull(),
    name: text('name').notNull(),
    stationKind: text('station_kind').notNull(),
    trayMinutes: real('tray_minutes').notNull(),
    pieceMinutes: real('piece_minutes').notNull(),
    cureMinutes: integer('cure_minutes'),
    colour: integer('colour'),
  },
  (t) => [uniqueIndex('order_steps_seq_uq').on(t.orderId, t.travellerKind, t.seq)],
);

export const payments = sqliteTable(
  'payments',
  {
    id: id(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    amount: real('amount'),
    /** ISO 4217 code, upper case; null on an exception */
    currency: text('currency'),
    reference: text('reference').notNull(),
    /** typed in by staff (a bank transfer) or paid through the hosted checkout */
    source: text('source', { enum: ['manual', 'checkout'] })
      .notNull()
      .default('manual'),
    /** the payment service's event id: the same event delivered twice records one payment */
    eventId: text('event_id').unique(),
    /** a manager's recorded exception: released without payment */
    isException: flag('is_exception').notNull().default(false),
    note: text('note').notNull().default(''),
    /** the person who typed it in; null when the payment service reported it */
    recordedBy: text('recorded_by').references(() => users.id),
    recordedAt: ms('recorded_at').notNull(),
  },
  (t) => [index('payments_order_idx').on(t.orderId)],
);

export const proofs = sqliteTable(
  'proofs',
  {
    id: id(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    revision: integer('revision').notNull(),
    /** sha-256 of the file; the file lives under the data folder by this hash */
    fileHash: text('file_hash').notNull(),
    mime: text('mime').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    originalName: text('original_name').notNull(),
    uploadedBy: text('uploaded_by')
      .notNull()
      .references(() => users.id),
    uploadedAt: ms('uploaded_at').notNull(),
    approvedAt: ms('approved_at'),
    approvedBy: text('approved_by').references(() => users.id),
    /** the name the customer typed when she approved it herself on her page */
    approvedByName: text('approved_by_name'),
    approvalNote: text('approval_note'),
    /** the customer asked for changes instead of approving */
    changesRequestedAt: ms('changes_requested_at'),
    changesComment: text('changes_comment'),
  },
  (t) => [uniqueIndex('proofs_revision_uq').on(t.orderId, t.revision)],
);
