import { sqliteTable, text, integer } from 'drizzle-orm/sqlite-core';
import { id, ms, flag } from './columns';
import { stations } from './stations';

export const reasonCodes = sqliteTable('reason_codes', {
  code: text('code').primaryKey(),
  name: text('name').notNull(),
  nameZh: text('name_zh').notNull(),
  kind: text('kind', { enum: ['scrap', 'rework', 'hold'] }).notNull(),
  stationKind: text('station_kind'),
  active: flag('active').notNull().default(true),
});

/** Admin-editable routing template per process; steps as JSON in the shape the domain expands. */
export const routingTemplates = sqliteTable('routing_templates', {
  process: text('process').primaryKey(),
  name: text('name').notNull(),
  template: text('template', { mode: 'json' }).notNull(),
  updatedAt: ms('updated_at').notNull(),
  updatedBy: text('updated_by'),
});

/** Working hours: one row per shift per weekday (0 = Sunday); station_id null = the factory. */
export const calendarShifts = sqliteTable('calendar_shifts', {
  id: id(),
  stationId: text('station_id').references(() => stations.id),
  weekday: integer('weekday').notNull(),
  startMinute: integer('start_minute').notNull(),
  endMinute: integer('end_minute').notNull(),
});

export const calendarDaysOff = sqliteTable('calendar_days_off', {
  id: id(),
  date: text('date').notNull(),
  stationId: text('station_id').references(() => stations.id),
  name: text('name').notNull(),
});

/** Small admin settings (factory name, time zone, tablet idle minutes...) as JSON values. */
export const settings = sqliteTable('settings', {
  key: text('key').primaryKey(),
  value: text('value', { mode: 'json' }).notNull(),
});

export const auditLog = sqliteTable('audit_log', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  at: ms('at').notNull(),
  userId: text('user_id'),
  action: text('action').notNull(),
  entity: text('entity').notNull(),
  entityId: text('entity_id'),
  detail: text('detail', { mode: 'json' }),
});
