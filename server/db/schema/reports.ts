import { sqliteTable, text, integer, real, index } from 'drizzle-orm/sqlite-core';
import { sql } from 'drizzle-orm';
import { ms, flag } from './columns';

/**
 * One row per step a traveller went through: derived from the append-only scan events (never
 * edited by hand), so reports aggregate a few indexed rows per step instead of pairing a year of
 * raw events on every request. Rebuilt per traveller when new events for it arrive.
 */
export const stepRuns = sqliteTable(
  'step_runs',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    trayId: text('tray_id').notNull(),
    orderId: text('order_id').notNull(),
    travellerKind: text('traveller_kind', { enum: ['tray', 'mould'] }).notNull(),
    stepSeq: integer('step_seq').notNull(),
    stationKind: text('station_kind').notNull(),
    stationId: text('station_id'),
    /** when the traveller became ready for this step (previous finish, cure ready, release) */
    readyAt: ms('ready_at').notNull(),
    startedAt: ms('started_at'),
    finishedAt: ms('finished_at').notNull(),
    queueMinutes: real('queue_minutes'),
    processMinutes: real('process_minutes'),
    /** minimum cure minutes of a cure step (the oven time the routing asked for) */
    cureMinutes: real('cure_minutes'),
    qtyIn: integer('qty_in').notNull(),
    goodQty: integer('good_qty').notNull(),
    scrapQty: integer('scrap_qty').notNull(),
    reworkQty: integer('rework_qty').notNull(),
    scrapReason: text('scrap_reason'),
    /** a cure step closed on its own when the next step started */
    implicit: flag('implicit').notNull().default(false),
    /** how the run counts for yield: 'first', 'rework' (the step a split sent pieces back to) or 'repeat' (a step done again after it) */
    pass: text('pass', { enum: ['first', 'rework', 'repeat'] })
      .notNull()
      .default('first'),
    /** queue and process time in working minutes of the station's calendar */
    queueWorkingMinutes: real('queue_working_minutes'),
    processWorkingMinutes: real('process_working_minutes'),
  },
  (t) => [
    // covers every window query (cycle times, yields, scrap): one kind's steps in a period are
    // read from the index alone, in time order, without a table lookup per row
    index('step_runs_kind_finished_idx').on(
      t.stationKind,
      t.finishedAt,
      t.travellerKind,
      t.queueMinutes,
      t.processMinutes,
      t.queueWorkingMinutes,
      t.processWorkingMinutes,
      t.implicit,
      t.pass,
      t.qtyIn,
      t.goodQty,
      t.scrapQty,
      t.reworkQty,
      t.scrapReason,
      t.stationId,
      t.orderId,
    ),
    // covers the per-order step counts of the yield report
    index('step_runs_order_idx').on(t.orderId, t.stepSeq, t.travellerKind, t.qtyIn, t.goodQty, t.scrapQty, t.reworkQty, t.pass),
    index('step_runs_tray_idx').on(t.trayId),
    // the scrap Pareto reads only the steps that scrapped something
    index('step_runs_scrap_idx')
      .on(t.finishedAt, t.scrapReason, t.scrapQty, t.travellerKind, t.stationId, t.orderId)
      .where(sql`${t.scrapQty} > 0`),
  ],
);

/**
 * One row per tray with the milestones the flow report draws (derived with step_runs): released,
 * first start, inspection, packing and dispatch finishes, and its process and cure minutes.
 */
export const trayFlows = sqliteTable(
  'tray_flows',
  {
    trayId: text('tray_id').primaryKey(),
    orderId: text('order_id').notNull(),
    releasedAt: ms('released_at').notNull(),
    startedAt: ms('started_at'),
    inspectedAt: ms('inspected_at'),
    packedAt: ms('packed_at'),
    shippedAt: ms('shipped_at'),
    shippedQty: integer('shipped_qty'),
    /** finish of its last recorded step */
    lastFinishAt: ms('last_finish_at'),
    processMinutes: real('process_minutes').notNull(),
    cureMinutes: real('cure_minutes').notNull(),
    /** the same two in working minutes of the factory's calendar (the unit of its working flow time) */
    processWorkingMinutes: real('process_working_minutes').notNull().default(0),
    cureWorkingMinutes: real('cure_working_minutes').notNull().default(0),
  },
  (t) => [index('tray_flows_order_idx').on(t.orderId), index('tray_flows_released_idx').on(t.releasedAt)],
);

/** How far the derived report tables have read the event log (by rowid). */
export const reportCursors = sqliteTable('report_cursors', {
  name: text('name').primaryKey(),
  position: integer('position').notNull(),
  updatedAt: ms('updated_at').notNull(),
});
