import { eq } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { devices } from '../db/schema/devices';

export type DeviceRow = typeof devices.$inferSelect;

export const devicesRepository = {
  list: (db: Db) => db.select().from(devices).orderBy(devices.name).all(),
  byId: (db: Db, id: string) => db.select().from(devices).where(eq(devices.id, id)).get(),
  byTokenHash: (db: Db, tokenHash: string) => db.select().from(devices).where(eq(devices.tokenHash, tokenHash)).get(),
  byPairingCode: (db: Db, code: string) => db.select().from(devices).where(eq(devices.pairingCode, code)).get(),
  insert: (db: Db, row: typeof devices.$inferInsert) => db.insert(devices).values(row).run(),
  update: (db: Db, id: string, patch: Partial<typeof devices.$inferInsert>) => db.update(devices).set(patch).where(eq(devices.id, id)).run(),
};
