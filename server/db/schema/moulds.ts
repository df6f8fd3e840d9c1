import { sqliteTable, text, integer, index, primaryKey } from 'drizzle-orm/sqlite-core';
import { id, ms, createdAt, updatedAt } from './columns';
import { orders } from './orders';

export const moulds = sqliteTable(
  'moulds',
  {
    id: id(),
    number: text('number').notNull().unique(),
    designKey: text('design_key').notNull(),
    side: text('side', { enum: ['front', 'back'] }).notNull(),
    firstOrderId: text('first_order_id').references(() => orders.id),
    status: text('status', { enum: ['engraving', 'checking', 'ready', 'retired'] })
      .notNull()
      .default('engraving'),
    storageLocation: text('storage_location'),
    useCount: integer('use_count').notNull().default(0),
    readyAt: ms('ready_at'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('moulds_design_idx').on(t.designKey, t.side)],
);

/** Which moulds an order's trays need before striking or casting. */
export const orderMoulds = sqliteTable(
  'order_moulds',
  {
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    mouldId: text('mould_id')
      .notNull()
      .references(() => moulds.id),
  },
  (t) => [primaryKey({ columns: [t.orderId, t.mouldId] })],
);
