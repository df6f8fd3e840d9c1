import { sqliteTable, text, integer, index, type AnySQLiteColumn } from 'drizzle-orm/sqlite-core';
import { id, ms, flag, createdAt } from './columns';
import { orders } from './orders';
import { moulds } from './moulds';
import { stations } from './stations';

/** A traveller: a tray of pieces, or a mould on its way through engraving and check. */
export const trays = sqliteTable(
  'trays',
  {
    id: id(),
    number: text('number').notNull().unique(),
    kind: text('kind', { enum: ['tray', 'mould'] }).notNull(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    /** for a mould traveller: the mould it makes */
    mouldId: text('mould_id').references(() => moulds.id),
    /** the tray this one was split from */
    parentTrayId: text('parent_tray_id').references((): AnySQLiteColumn => trays.id),
    /** trays merged into this one point here */
    mergedIntoId: text('merged_into_id').references((): AnySQLiteColumn => trays.id),
    /** traveller revision; a reprint raises it and voids older printed codes */
    revision: integer('revision').notNull().default(1),
    quantity: integer('quantity').notNull(),
    releasedAt: ms('released_at').notNull(),
    writtenOffAt: ms('written_off_at'),
    writeOffReason: text('write_off_reason'),
    createdAt: createdAt(),
  },
  (t) => [index('trays_order_idx').on(t.orderId), index('trays_parent_idx').on(t.parentTrayId)],
);

/** The current state of each traveller, written in the same transaction as its scan events. */
export const trayStates = sqliteTable(
  'tray_states',
  {
    trayId: text('tray_id')
      .primaryKey()
      .references(() => trays.id),
    kind: text('kind', { enum: ['tray', 'mould'] }).notNull(),
    phase: text('phase', { enum: ['waiting', 'in_process', 'curing', 'done', 'scrapped', 'merged'] }).notNull(),
    stepSeq: integer('step_seq'),
    /** station kind of the step it waits for or is in (null when done) */
    stationKind: text('station_kind'),
    quantity: integer('quantity').notNull(),
    stationId: text('station_id').references(() => stations.id),
    startedAt: ms('started_at'),
    waitingSince: ms('waiting_since'),
    cureReadyAt: ms('cure_ready_at'),
    onHold: flag('on_hold').notNull().default(false),
    holdReason: text('hold_reason'),
    releasedAt: ms('released_at').notNull(),
    lastEventAt: ms('last_event_at'),
    updatedAt: ms('updated_at').notNull(),
  },
  (t) => [index('tray_states_phase_kind_idx').on(t.phase, t.stationKind)],
);
