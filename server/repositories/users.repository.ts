import { eq, and, isNull, ne, sql } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import type Database from 'better-sqlite3';
import { users, sessions } from '../db/schema/users';
import { sqlClient } from './sql-client';

export type UserRow = typeof users.$inferSelect;
export type SessionRow = typeof sessions.$inferSelect;

/** A session with what every request checks of its person and tablet, read in one statement. */
export interface SessionLookup {
  sessionId: string;
  userId: string;
  deviceId: string | null;
  lastSeenAt: number;
  expiresAt: number;
  idleMinutes: number;
  revokedAt: number | null;
  name: string;
  role: UserRow['role'];
  locale: UserRow['locale'];
  active: boolean;
  mustChangePassword: boolean;
  /** null when the session has no tablet; false when its tablet is switched off or gone */
  deviceActive: boolean | null;
}

// Every API request resolves its session: one statement, prepared once per connection.
const sessionStatements = new WeakMap<Database.Database, Database.Statement>();
function sessionStatement(db: Db): Database.Statement {
  const c = sqlClient(db);
  let stmt = sessionStatements.get(c);
  if (!stmt) {
    stmt = c.prepare(`select s.id as sessionId, s.user_id as userId, s.device_id as deviceId, s.last_seen_at as lastSeenAt,
        s.expires_at as expiresAt, s.idle_minutes as idleMinutes, s.revoked_at as revokedAt,
        u.name as name, u.role as role, u.locale as locale, u.active as active, u.must_change_password as mustChangePassword,
        case when s.device_id is null then null else coalesce(d.active, 0) end as deviceActive
      from sessions s join users u on u.id = s.user_id left join devices d on d.id = s.device_id
      where s.id = ?`);
    sessionStatements.set(c, stmt);
  }
  return stmt;
}

export const usersRepository = {
  /** The session, its person and its tablet's state, for resolving a request's cookie. */
  sessionLookup(db: Db, sessionId: string): SessionLookup | undefined {
    const r = sessionStatement(db).get(sessionId) as
      | (Omit<SessionLookup, 'active' | 'mustChangePassword' | 'deviceActive'> & { active: number; mustChangePassword: number; deviceActive: number | null })
      | undefined;
    if (!r) return undefined;
    return { ...r, active: !!r.active, mustChangePassword: !!r.mustChangePassword, deviceActive: r.deviceActive == null ? null : !!r.deviceActive };
  },

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
