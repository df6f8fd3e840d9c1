import { sqliteTable, text, integer, index } from 'drizzle-orm/sqlite-core';
import { id, ms, flag } from './columns';
import { trays } from './trays';
import { users } from './users';

/** Accepted scan events: append-only. The id is made on the device, so a resend is a duplicate. */
export const scanEvents = sqliteTable(
  'scan_events',
  {
    id: id(),
    trayId: text('tray_id')
      .notNull()
      .references(() => trays.id),
    type: text('type', { enum: ['start', 'finish', 'hold', 'release', 'split', 'merge', 'note', 'write_off'] }).notNull(),
    stepSeq: integer('step_seq'),
    stationId: text('station_id'),
    stationKind: text('station_kind'),
    deviceId: text('device_id'),
    userId: text('user_id').references(() => users.id),
    occurredAt: ms('occurred_at').notNull(),
    receivedAt: ms('received_at').notNull(),
    qtyIn: integer('qty_in'),
    goodQty: integer('good_qty'),
    scrapQty: integer('scrap_qty'),
    reworkQty: integer('rework_qty'),
    scrapReason: text('scrap_reason'),
    overrideId: text('override_id'),
    note: text('note'),
    photoHash: text('photo_hash'),
  },
  (t) => [
    index('scan_events_tray_idx').on(t.trayId, t.occurredAt),
    index('scan_events_time_idx').on(t.occurredAt),
    index('scan_events_kind_time_idx').on(t.stationKind, t.type, t.occurredAt),
  ],
);

/** Refused scans, kept for the operator and for supervisors to resolve; none is dropped. */
export const scanRejections = sqliteTable(
  'scan_rejections',
  {
    id: id(),
    eventId: text('event_id').notNull(),
    trayId: text('tray_id'),
    stationId: text('station_id'),
    deviceId: text('device_id'),
    userId: text('user_id'),
    code: text('code').notNull(),
    message: text('message').notNull(),
    payload: text('payload', { mode: 'json' }).notNull(),
    occurredAt: ms('occurred_at'),
    receivedAt: ms('received_at').notNull(),
    resolvedAt: ms('resolved_at'),
    resolvedBy: text('resolved_by'),
    resolution: text('resolution'),
  },
  (t) => [index('scan_rejections_event_idx').on(t.eventId), index('scan_rejections_open_idx').on(t.resolvedAt)],
);

/** A supervisor's permission, given on the tablet with badge and PIN, to let one scan through. */
export const overrides = sqliteTable('overrides', {
  id: id(),
  trayId: text('tray_id')
    .notNull()
    .references(() => trays.id),
  stationId: text('station_id'),
  kind: text('kind', { enum: ['wrong_station', 'curing', 'release'] }).notNull(),
  supervisorId: text('supervisor_id')
    .notNull()
    .references(() => users.id),
  reason: text('reason').notNull(),
  createdAt: ms('created_at').notNull(),
  expiresAt: ms('expires_at').notNull(),
  usedEventId: text('used_event_id'),
});

/** QC photos and other pictures attached to a tray, stored under the data folder by hash. */
export const attachments = sqliteTable('attachments', {
  id: id(),
  trayId: text('tray_id')
    .notNull()
    .references(() => trays.id),
  eventId: text('event_id'),
  fileHash: text('file_hash').notNull(),
  mime: text('mime').notNull(),
  sizeBytes: integer('size_bytes').notNull(),
  createdBy: text('created_by'),
  createdAt: ms('created_at').notNull(),
  /** a supervisor chose to show this photo to the customer on her order page */
  shareable: flag('shareable').notNull().default(false),
  sharedBy: text('shared_by'),
  sharedAt: ms('shared_at'),
});
