import { sqliteTable, text, integer, index } from 'drizzle-orm/sqlite-core';
import { id, ms, flag, createdAt, updatedAt } from './columns';

export const users = sqliteTable(
  'users',
  {
    id: id(),
    name: text('name').notNull(),
    email: text('email').notNull().unique(),
    role: text('role', { enum: ['operator', 'supervisor', 'planner', 'manager', 'sales', 'admin'] }).notNull(),
    passwordHash: text('password_hash').notNull(),
    badge: text('badge').unique(),
    pinHash: text('pin_hash'),
    locale: text('locale', { enum: ['en', 'zh-CN'] })
      .notNull()
      .default('en'),
    active: flag('active').notNull().default(true),
    /** set on a first admin made with the documented default password: nothing else works until it is changed */
    mustChangePassword: flag('must_change_password').notNull().default(false),
    failedLogins: integer('failed_logins').notNull().default(0),
    throttledUntil: ms('throttled_until'),
    lastLoginAt: ms('last_login_at'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('users_role_idx').on(t.role)],
);

export const sessions = sqliteTable(
  'sessions',
  {
    id: id(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id),
    deviceId: text('device_id'),
    createdAt: createdAt(),
    lastSeenAt: ms('last_seen_at').notNull(),
    expiresAt: ms('expires_at').notNull(),
    idleMinutes: integer('idle_minutes').notNull(),
    revokedAt: ms('revoked_at'),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);
