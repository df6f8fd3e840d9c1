import { eq, isNull, asc } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { calendarShifts, calendarDaysOff, settings } from '../db/schema/reference-data';
import { stations } from '../db/schema/stations';

export type ShiftRow = typeof calendarShifts.$inferSelect;
export type DayOffRow = typeof calendarDaysOff.$inferSelect;

export const calendarRepository = {
  shifts: (db: Db) => db.select().from(calendarShifts).orderBy(asc(calendarShifts.weekday), asc(calendarShifts.startMinute)).all(),
  daysOff: (db: Db) => db.select().from(calendarDaysOff).orderBy(asc(calendarDaysOff.date)).all(),
  stations: (db: Db) =>
    db
      .select({ id: stations.id, code: stations.code, name: stations.name, kind: stations.kind, continuous: stations.continuous, active: stations.active })
      .from(stations)
      .orderBy(asc(stations.code))
      .all(),
  factorySettings: (db: Db) =>
    db.select().from(settings).where(eq(settings.key, 'factory')).get()?.value as { name?: string; timeZone?: string; language?: string } | undefined,
  saveFactorySettings: (db: Db, value: Record<string, unknown>) =>
    db.insert(settings).values({ key: 'factory', value }).onConflictDoUpdate({ target: settings.key, set: { value } }).run(),
  replaceAll(db: Db, shifts: (typeof calendarShifts.$inferInsert)[], days: (typeof calendarDaysOff.$inferInsert)[]) {
    db.delete(calendarShifts).run();
    db.delete(calendarDaysOff).run();
    for (const s of shifts) db.insert(calendarShifts).values(s).run();
    for (const d of days) db.insert(calendarDaysOff).values(d).run();
  },
  factoryShiftCount: (db: Db) => db.select({ id: calendarShifts.id }).from(calendarShifts).where(isNull(calendarShifts.stationId)).all().length,
};
