import { eq, and, isNull, ne, sql } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { users, sessions } from '../db/schema/users';

export type UserRow = typeof users.$inferSelect;
export type SessionRow = typeof sessions.$inferSelect;

export const usersRepository = {
  byId: (db: Db, id: string) => db.select().from(users).where(eq(users.id, id)).get(),
  byEmail: (db: Db, email: string) =>
    db
      .select()
      .from(users)
      .where(eq(sql`lower(${users.email})`, email.toLowerCase()))
      .get(),
  byBadge: (db: Db, badge: string) => db.select().from(users).where(eq(users.badge, badge)).get(),
  list: (db: Db) => db.select().from(users).orderBy(users.name).all(),
  count: (db: Db) =>
    db
      .select({ n: sql<number>`count(*)` })
      .from(users)
      .get()?.n ?? 0,
  insert: (db: Db, row: typeof users.$inferInsert) => db.insert(users).values(row).run(),
  update: (db: Db, id: string, patch: Partial<typeof users.$inferInsert>) => db.update(users).set(patch).where(eq(users.id, id)).run(),

  insertSession: (db: Db, row: typeof sessions.$inferInsert) => db.insert(sessions).values(row).run(),
  sessionById: (db: Db, id: string) => db.select().from(sessions).where(eq(sessions.id, id)).get(),
  touchSession: (db: Db, id: string, at: number) => db.update(sessions).set({ lastSeenAt: at }).where(eq(sessions.id, id)).run(),
  revokeSession: (db: Db, id: string, at: number) => db.update(sessions).set({ revokedAt: at }).where(eq(sessions.id, id)).run(),
  revokeDeviceSessions: (db: Db, deviceId: string, at: number) =>
    db
      .update(sessions)
      .set({ revokedAt: at })
      .where(and(eq(sessions.deviceId, deviceId), isNull(sessions.revokedAt)))
      .run(),
  revokeUserSessions: (db: Db, userId: string, at: number) =>
    db
      .update(sessions)
      .set({ revokedAt: at })
      .where(and(eq(sessions.userId, userId), isNull(sessions.revokedAt)))
      .run(),
  revokeOtherSessions: (db: Db, userId: string, keepSessionId: string, at: number) =>
    db
      .update(sessions)
      .set({ revokedAt: at })
      .where(and(eq(sessions.userId, userId), isNull(sessions.revokedAt), ne(sessions.id, keepSessionId)))
      .run(),
};
