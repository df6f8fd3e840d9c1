import { sqliteTable, text, integer, index, primaryKey } from 'drizzle-orm/sqlite-core';
import { LOAD_KINDS } from '../../../shared/domain/traveller/station-kinds';
import { id, ms } from './columns';
import { trays } from './trays';
import { orders } from './orders';
import { users } from './users';

/**
 * An oven load or a plating bath load: trays of one cure profile or one finish, possibly from
 * several orders, that go in together. The trays keep their own identity and quantities; the
 * load only groups them, so splitting it afterwards gives every order back exactly its pieces.
 */
export const loads = sqliteTable(
  'loads',
  {
    id: id(),
    number: text('number').notNull().unique(),
    kind: text('kind', { enum: LOAD_KINDS }).notNull(),
    /** the cure minutes of an oven load, or the finish of a plating load */
    groupKey: text('group_key').notNull(),
    status: text('status', { enum: ['open', 'split'] }).notNull(),
    createdBy: text('created_by').references(() => users.id),
    createdAt: ms('created_at').notNull(),
    splitAt: ms('split_at'),
    splitBy: text('split_by').references(() => users.id),
  },
  (t) => [index('loads_status_idx').on(t.status)],
);

export const loadTrays = sqliteTable(
  'load_trays',
  {
    loadId: text('load_id')
      .notNull()
      .references(() => loads.id),
    trayId: text('tray_id')
      .notNull()
      .references(() => trays.id),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    /** pieces of the tray when it joined the load */
    quantity: integer('quantity').notNull(),
  },
  (t) => [primaryKey({ columns: [t.loadId, t.trayId] }), index('load_trays_tray_idx').on(t.trayId)],
);
