import { sqliteTable, text, integer } from 'drizzle-orm/sqlite-core';
import { id, ms, flag, createdAt, updatedAt } from './columns';
import { stations } from './stations';

/** A registered tablet (bound to a station) or a read-only wall display (no station). */
export const devices = sqliteTable('devices', {
  id: id(),
  name: text('name').notNull(),
  kind: text('kind', { enum: ['tablet', 'wall'] }).notNull(),
  stationId: text('station_id').references(() => stations.id),
  /** sha-256 of the device token; the token itself is shown once */
  tokenHash: text('token_hash').notNull().unique(),
  /** short code typed on the tablet to pair it; cleared once paired */
  pairingCode: text('pairing_code').unique(),
  pairingExpiresAt: ms('pairing_expires_at'),
  locale: text('locale').notNull().default('en'),
  idleMinutes: integer('idle_minutes').notNull().default(10),
  clockOffsetMs: integer('clock_offset_ms'),
  lastSeenAt: ms('last_seen_at'),
  active: flag('active').notNull().default(true),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});
