import { sqliteTable, text, integer } from 'drizzle-orm/sqlite-core';
import { id, flag, createdAt, updatedAt } from './columns';

export const stations = sqliteTable('stations', {
  id: id(),
  code: text('code').notNull().unique(),
  name: text('name').notNull(),
  /** the station's name on Chinese screens ('' falls back to the name) */
  nameZh: text('name_zh').notNull().default(''),
  kind: text('kind').notNull(),
  /** trays the station can work on at once (a bench, an oven load, a bath) */
  capacityTrays: integer('capacity_trays').notNull().default(1),
  /** works outside shifts (ovens keep curing through the night) */
  continuous: flag('continuous').notNull().default(false),
  instructions: text('instructions').notNull().default(''),
  safetyNotes: text('safety_notes').notNull().default(''),
  instructionsZh: text('instructions_zh').notNull().default(''),
  safetyNotesZh: text('safety_notes_zh').notNull().default(''),
  active: flag('active').notNull().default(true),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});
