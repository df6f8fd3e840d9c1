import bcrypt from 'bcryptjs';
import crypto from 'node:crypto';
import { SignJWT, jwtVerify } from 'jose';
import type { Db } from '../db/client';
import type { AppDeps } from '../app-deps';
import { usersRepository, type UserRow } from '../repositories/users.repository';
import { devicesRepository } from '../repositories/devices.repository';
import { AppError, badInput, throttled } from '../errors';
import { sha256Hex } from '../lib/keys';
import { PASSWORD_MAX_BYTES } from '@shared/schemas/auth';
import { signInDelaySeconds, SESSION_ABSOLUTE_HOURS, OFFICE_IDLE_MINUTES } from '@shared/domain/sign-in-throttle';
import type { DeviceAuth, SessionUser } from '../http/api';
import type { Locale, Role } from '@shared/domain/vocabulary';

/** OWASP Password Storage Cheat Sheet: bcrypt work factor of at least 10. */
export const BCRYPT_COST = 10;
export const SESSION_COOKIE = 'trayce_session';
export const DEVICE_COOKIE = 'trayce_device';

// A fixed hash to compare against when the account does not exist, so timing says nothing.
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', BCRYPT_COST);

export function hashSecret(secret: string): string {
  if (new TextEncoder().encode(secret).length > PASSWORD_MAX_BYTES) {
    throw badInput(`Passwords are limited to ${PASSWORD_MAX_BYTES} bytes.`, undefined, 'password_too_long');
  }
  return bcrypt.hashSync(secret, BCRYPT_COST);
}

const invalid = () => new AppError(401, 'invalid_credentials', 'That sign-in is not right. Check it and try again.');

function checkThrottle(user: UserRow, now: number) {
  if (user.throttledUntil && user.throttledUntil > now) {
    const wait = Math.ceil((user.throttledUntil - now) / 1000);
    throw throttled(`Too many failed attempts. Wait ${wait} s and try again.`, wait);
  }
}

function recordFailure(db: Db, user: UserRow, now: number) {
  const failures = user.failedLogins + 1;
  const delay = signInDelaySeconds(failures);
  usersRepository.update(db, user.id, { failedLogins: failures, throttledUntil: delay ? now + delay * 1000 : null });
}

/** Badge and PIN, with the same throttle and the same answer for an unknown badge as a wrong PIN. */
function checkBadge(deps: AppDeps, badge: string, pin: string, inactiveMessage: string): UserRow {
  const now = deps.now();
  const user = usersRepository.byBadge(deps.db, badge);
  if (!user || !user.pinHash) {
    bcrypt.compareSync(pin, DUMMY_HASH);
    throw invalid();
  }
  checkThrottle(user, now);
  if (!bcrypt.compareSync(pin, user.pinHash)) {
    recordFailure(deps.db, user, now);
    throw invalid();
  }
  if (!user.active) throw new AppError(403, 'account_inactive', inactiveMessage);
  return user;
}

async function startSession(deps: AppDeps, user: UserRow, idleMinutes: number, deviceId: string | null) {
  const now = deps.now();
  const sessionId = crypto.randomUUID();
  const expiresAt = now + SESSION_ABSOLUTE_HOURS * 3600_000;
  usersRepository.insertSession(deps.db, {
    id: sessionId,
    userId: user.id,
    deviceId,
    createdAt: now,
    lastSeenAt: now,
    expiresAt,
    idleMinutes,
  });
  usersRepository.update(deps.db, user.id, { failedLogins: 0, throttledUntil: null, lastLoginAt: now });
  const token = await new SignJWT({ sid: sessionId, role: user.role })
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(user.id)
    .setIssuedAt(Math.floor(now / 1000))
    .setExpirationTime(Math.floor(expiresAt / 1000))
    .sign(deps.keys.session);
  return { token, expiresAt, user: { id: user.id, name: user.name, role: user.role as Role, locale: user.locale } };
}

export const authService = {
  async login(deps: AppDeps, email: string, password: string) {
    const now = deps.now();
    const user = usersRepository.byEmail(deps.db, email);
    if (!user) {
      bcrypt.compareSync(password, DUMMY_HASH);
      throw invalid();
    }
    checkThrottle(user, now);
    const ok = new TextEncoder().encode(password).length <= PASSWORD_MAX_BYTES && bcrypt.compareSync(password, user.passwordHash);
    if (!ok) {
      recordFailure(deps.db, user, now);
      throw invalid();
    }
    if (!user.active) throw new AppError(403, 'account_inactive', 'This account is switched off. Ask an administrator.');
    return startSession(deps, user, OFFICE_IDLE_MINUTES, null);
  },

  /** Operators (and supervisors) on a registered tablet: badge plus PIN. */
  async badgeLogin(deps: AppDeps, device: DeviceAuth, badge: string, pin: string) {
    const user = checkBadge(deps, badge, pin, 'This badge is switched off. Ask a supervisor.');
    const row = devicesRepository.byId(deps.db, device.id);
    return startSession(deps, user, row?.idleMinutes ?? 10, device.id);
  },

  /** Checks a badge and PIN without starting a session (a supervisor approving an override). */
  verifyBadge(deps: AppDeps, badge: string, pin: string): UserRow {
    const user = checkBadge(deps, badge, pin, 'This badge is switched off.');
    usersRepository.update(deps.db, user.id, { failedLogins: 0, throttledUntil: null });
    return user;
  },

  /** Resolves a session cookie; null when absent, expired, idle too long, revoked or tampered. */
  async resolveSession(deps: AppDeps, token: string): Promise<SessionUser | null> {
    let sid: string;
    let sub: string;
    try {
      const { payload } = await jwtVerify(token, deps.keys.session, { algorithms: ['HS256'], currentDate: new Date(deps.now()) });
      if (typeof payload.sid !== 'string' || typeof payload.sub !== 'string') return null;
      sid = payload.sid;
      sub = payload.sub;
    } catch {
      return null;
    }
    const now = deps.now();
    const session = usersRepository.sessionById(deps.db, sid);
    if (!session || session.userId !== sub || session.revokedAt) return null;
    if (session.expiresAt <= now) return null;
    if (session.lastSeenAt + session.idleMinutes * 60_000 <= now) return null;
    const user = usersRepository.byId(deps.db, session.userId);
    if (!user || !user.active) return null;
    // Write the idle clock at most every 30 s: reads stay cheap.
    if (now - session.lastSeenAt > 30_000) usersRepository.touchSession(deps.db, sid, now);
    return { id: user.id, name: user.name, role: user.role as Role, locale: user.locale, sessionId: sid };
  },

  /** A person's own language; it follows them to every screen and tablet they sign in on. */
  setLocale(deps: AppDeps, userId: string, locale: Locale) {
    usersRepository.update(deps.db, userId, { locale, updatedAt: deps.now() });
    return { locale };
  },

  logout(deps: AppDeps, sessionId: string) {
    usersRepository.revokeSession(deps.db, sessionId, deps.now());
  },

  resolveDevice(deps: AppDeps, token: string): DeviceAuth | null {
    const row = devicesRepository.byTokenHash(deps.db, sha256Hex(token));
    if (!row || !row.active) return null;
    return { id: row.id, name: row.name, kind: row.kind, stationId: row.stationId };
  },
};
