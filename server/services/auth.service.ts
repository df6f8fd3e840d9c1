import bcrypt from 'bcryptjs';
import crypto from 'node:crypto';
import { SignJWT } from 'jose';
import { makeSessionTokenVerifier } from '../lib/session-tokens';
import type { AppDeps } from '../app-deps';
import { usersRepository, type UserRow } from '../repositories/users.repository';
import { devicesRepository } from '../repositories/devices.repository';
import { AppError, badInput, throttled } from '../errors';
import { sha256Hex } from '../lib/keys';
import { PASSWORD_MAX_BYTES } from '@shared/schemas/auth';
import { DEFAULT_ADMIN_PASSWORD } from '../env';
import {
  BADGE_PER_BADGE,
  BADGE_PER_DEVICE,
  OFFICE_IDLE_MINUTES,
  PASSWORD_PER_ACCOUNT_UNKNOWN_CLIENTS,
  PASSWORD_PER_CLIENT,
  SESSION_ABSOLUTE_HOURS,
  worthReporting,
} from '@shared/domain/sign-in-throttle';
import { RELEASE_ROLES } from '@shared/domain/guards';
import { refusalText } from '@shared/domain/scan-messages';
import { failureStore, type ThrottleKey } from '../lib/failure-store';
import { scansRepository } from '../repositories/scans.repository';
import { notifyFloorChanged } from './live-bus';
import type { DeviceAuth, SessionUser } from '../http/api';
import type { Locale, Role } from '@shared/domain/vocabulary';

/** OWASP Password Storage Cheat Sheet: bcrypt work factor of at least 10. */
export const BCRYPT_COST = 10;
export const SESSION_COOKIE = 'trayce_session';
export const DEVICE_COOKIE = 'trayce_device';

// A fixed hash (of a throw-away word, at BCRYPT_COST) to compare against when the account does
// not exist, so timing says nothing. Written out: no hashing at start-up.
const DUMMY_HASH = '$2b$10$0PrPrw9dDpj8qdHW920jveeyHdF.gVMqrOKToO74kKnJSPtCyLLda';

const verifiers = new WeakMap<object, ReturnType<typeof makeSessionTokenVerifier>>();
/** The claims of a session cookie whose signature is right and which has not expired; null otherwise. */
function sessionClaims(deps: AppDeps, token: string) {
  let verify = verifiers.get(deps.keys.session);
  if (!verify) verifiers.set(deps.keys.session, (verify = makeSessionTokenVerifier(deps.keys.session)));
  return verify(token, deps.now());
}

function checkSecretLength(secret: string) {
  if (new TextEncoder().encode(secret).length > PASSWORD_MAX_BYTES) {
    throw badInput(`Passwords are limited to ${PASSWORD_MAX_BYTES} bytes.`, undefined, 'password_too_long');
  }
}

/**
 * bcrypt off the event loop, on every path (sign-in, user admin, seeding): bcryptjs's async hash
 * and compare work in slices between other callbacks, so a sign-in or a new user (about 120 ms
 * of hashing) does not hold up the scan batches meanwhile.
 */
export async function hashSecret(secret: string): Promise<string> {
  checkSecretLength(secret);
  return bcrypt.hash(secret, BCRYPT_COST);
}

/** Compares a secret with a stored hash off the event loop; with no hash, compares with a dummy so timing says nothing. */
export async function secretMatches(secret: string, hash: string | null | undefined): Promise<boolean> {
  if (!hash) {
    await bcrypt.compare(secret, DUMMY_HASH);
    return false;
  }
  return bcrypt.compare(secret, hash);
}

const invalid = () => new AppError(401, 'invalid_credentials', 'That sign-in is not right. Check it and try again.');
/** The one answer to a wrong badge, a wrong PIN and a badge that may not approve: nothing tells them apart. */
const badgeInvalid = () => new AppError(401, 'invalid_credentials', 'That badge and PIN are not right for this. Check them and try again.');

function throttledFor(waitMs: number) {
  const wait = Math.max(1, Math.ceil(waitMs / 1000));
  return throttled(`Too many failed attempts. Wait ${wait} s and try again.`, wait);
}

/** The cookie a browser gets when it signs in: it marks the browser as known to that account. */
export const KNOWN_CLIENT_COOKIE = 'trayce_known';

function knownSignature(deps: AppDeps, userId: string, nonce: string): string {
  return crypto.createHmac('sha256', deps.keys.session).update(`known-client:${userId}:${nonce}`).digest('base64url');
}

/** A new known-client token for this account (`user.nonce.signature`). */
function knownClientToken(deps: AppDeps, userId: string): string {
  const nonce = crypto.randomBytes(16).toString('base64url');
  return `${userId}.${nonce}.${knownSignature(deps, userId, nonce)}`;
}

/** The nonce of a known-client token, when it is genuine and for this account. */
function knownClientNonce(deps: AppDeps, token: string | undefined, userId: string | undefined): string | null {
  if (!token || !userId) return null;
  const [id, nonce, sig] = token.split('.');
  if (id !== userId || !nonce || !sig) return null;
  const expected = Buffer.from(knownSignature(deps, userId, nonce));
  const given = Buffer.from(sig);
  return expected.length === given.length && crypto.timingSafeEqual(expected, given) ? nonce : null;
}

/** Who is making a sign-in attempt, as far as the server can tell. */
export interface SignInClient {
  /** the address the request came from */
  address: string;
  /** the browser's known-client cookie, if any */
  knownToken?: string;
}

/** Who is checking a badge and PIN: the tablet, or the signed-in person on a computer without one. */
export interface BadgeClient {
  device: DeviceAuth | null;
  userId: string | null;
  purpose: 'sign_in' | 'override';
}

/**
 * Badge and PIN, throttled per badge typed (on this tablet) and per tablet, whether the badge
 * exists or not, so throttling tells nothing about which badges are real. `accept` decides
 * whether the right PIN is enough (an override needs a supervisor too); every refusal gets the
 * same answer and counts the same.
 */
async function checkBadge(deps: AppDeps, badge: string, pin: string, client: BadgeClient, accept: (user: UserRow) => boolean): Promise<UserRow> {
  const now = deps.now();
  const clientKey = client.device ? `device:${client.device.id}` : `user:${client.userId ?? 'none'}`;
  const badgeKey = `badge:${badge}:${clientKey}`;
  const keys: ThrottleKey[] = [
    { key: badgeKey, rule: BADGE_PER_BADGE },
    { key: `badge-client:${clientKey}`, rule: BADGE_PER_DEVICE },
  ];
  const wait = failureStore.wait(deps.db, keys, now);
  if (wait > 0) throw throttledFor(wait);
  const user = usersRepository.byBadge(deps.db, badge);
  const pinRight = await secretMatches(pin, user?.pinHash);
  if (!user || !pinRight || !accept(user)) {
    const after = failureStore.fail(deps.db, keys, now);
    const report = after.find((k) => worthReporting(k.record, k.rule));
    if (report) recordBadgeFailures(deps, badge, client, report.key === badgeKey ? 'badge' : 'tablet', report.record.failures, now);
    throw badgeInvalid();
  }
  failureStore.clear(deps.db, [badgeKey]);
  return user;
}

/** A run of wrong badge + PIN checks, listed for supervisors with the refused scans. */
function recordBadgeFailures(deps: AppDeps, badge: string, client: BadgeClient, scope: 'badge' | 'tablet', failures: number, now: number) {
  const params = { badge, failures, scope, purpose: client.purpose, device: client.device?.name ?? null };
  try {
    scansRepository.insertRejections(deps.db, [
      {
        id: crypto.randomUUID(),
        eventId: crypto.randomUUID(),
        trayId: null,
        stationId: client.device?.stationId ?? null,
        deviceId: client.device?.id ?? null,
        userId: client.device ? null : client.userId,
        code: 'badge_failures',
        message: refusalText('badge_failures', params),
        payload: { params },
        occurredAt: now,
        receivedAt: now,
      },
    ]);
    notifyFloorChanged(deps);
  } catch (error) {
    deps.log.error({ err: error }, 'could not record failed badge checks');
  }
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
  usersRepository.update(deps.db, user.id, { lastLoginAt: now });
  const token = await new SignJWT({ sid: sessionId, role: user.role })
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(user.id)
    .setIssuedAt(Math.floor(now / 1000))
    .setExpirationTime(Math.floor(expiresAt / 1000))
    .sign(deps.keys.session);
  return {
    token,
    expiresAt,
    user: { id: user.id, name: user.name, role: user.role as Role, locale: user.locale, mustChangePassword: user.mustChangePassword },
  };
}

export const authService = {
  /**
   * E-mail and password. Failures are counted for the account together with the client (a
   * browser that signed in to the account before, else the address): one guesser's failures
   * delay only that guesser, so the owner with the right password gets in. Clients that never
   * signed in to the account also share one budget per account. An unknown e-mail is counted
   * the same way as a real one.
   */
  async login(deps: AppDeps, email: string, password: string, client: SignInClient) {
    const now = deps.now();
    const user = usersRepository.byEmail(deps.db, email);
    const account = user?.id ?? `unknown:${email.toLowerCase()}`;
    const nonce = knownClientNonce(deps, client.knownToken, user?.id);
    const clientKey = `pw:${account}:${nonce ? `known:${nonce}` : `address:${client.address}`}`;
    const keys: ThrottleKey[] = [{ key: clientKey, rule: PASSWORD_PER_CLIENT }];
    if (!nonce) keys.push({ key: `pw-account:${account}`, rule: PASSWORD_PER_ACCOUNT_UNKNOWN_CLIENTS });
    const wait = failureStore.wait(deps.db, keys, now);
    if (wait > 0) throw throttledFor(wait);
    const fits = new TextEncoder().encode(password).length <= PASSWORD_MAX_BYTES;
    const ok = (await secretMatches(password, user?.passwordHash)) && !!user && fits;
    if (!user || !ok) {
      failureStore.fail(deps.db, keys, now);
      throw invalid();
    }
    if (!user.active) throw new AppError(403, 'account_inactive', 'This account is switched off. Ask an administrator.');
    failureStore.clear(deps.db, [clientKey]);
    const session = await startSession(deps, user, OFFICE_IDLE_MINUTES, null);
    return { ...session, knownToken: knownClientToken(deps, user.id) };
  },

  /** Operators (and supervisors) on a registered tablet: badge plus PIN. */
  async badgeLogin(deps: AppDeps, device: DeviceAuth, badge: string, pin: string) {
    const user = await checkBadge(deps, badge, pin, { device, userId: null, purpose: 'sign_in' }, () => true);
    if (!user.active) throw new AppError(403, 'account_inactive', 'This badge is switched off. Ask a supervisor.');
    const row = devicesRepository.byId(deps.db, device.id);
    return startSession(deps, user, row?.idleMinutes ?? 10, device.id);
  },

  /**
   * Checks a supervisor's badge and PIN without starting a session (approving an override). A
   * wrong badge, a wrong PIN, a switched-off badge and a person who is not a supervisor all get
   * the same 401 and count the same.
   */
  verifySupervisorBadge(deps: AppDeps, badge: string, pin: string, client: Omit<BadgeClient, 'purpose'>): Promise<UserRow> {
    return checkBadge(deps, badge, pin, { ...client, purpose: 'override' }, (u) => u.active && RELEASE_ROLES.includes(u.role as Role));
  },

  /** Forgets an account's failed sign-ins (its password was just set). */
  forgetFailures(deps: AppDeps, userId: string) {
    failureStore.clearPrefix(deps.db, `pw:${userId}:`);
    failureStore.clear(deps.db, [`pw-account:${userId}`]);
  },

  /** Resolves a session cookie; null when absent, expired, idle too long, revoked or tampered. */
  async resolveSession(deps: AppDeps, token: string): Promise<SessionUser | null> {
    const claims = await sessionClaims(deps, token);
    if (!claims) return null;
    const { sid, sub } = claims;
    const now = deps.now();
    const session = usersRepository.sessionLookup(deps.db, sid);
    if (!session || session.userId !== sub || session.revokedAt) return null;
    if (session.expiresAt <= now) return null;
    if (session.lastSeenAt + session.idleMinutes * 60_000 <= now) return null;
    if (!session.active) return null;
    // A badge sign-in lives only as long as its tablet is switched on.
    if (session.deviceActive === false) return null;
    // Write the idle clock at most every 30 s: reads stay cheap.
    if (now - session.lastSeenAt > 30_000) usersRepository.touchSession(deps.db, sid, now);
    return {
      id: session.userId,
      name: session.name,
      role: session.role as Role,
      locale: session.locale,
      sessionId: sid,
      mustChangePassword: session.mustChangePassword,
    };
  },

  /**
   * A person changes their own password, giving the current one. The new one may be neither the
   * current one nor the documented default; the person's other sessions end, this one goes on.
   */
  async changePassword(deps: AppDeps, session: SessionUser, currentPassword: string, newPassword: string) {
    const user = usersRepository.byId(deps.db, session.id);
    if (!user) throw invalid();
    const fits = new TextEncoder().encode(currentPassword).length <= PASSWORD_MAX_BYTES;
    if (!fits || !(await secretMatches(currentPassword, user.passwordHash))) {
      throw badInput('The current password is not right.', [{ path: ['currentPassword'], message: 'Not right', code: 'wrong_password' }], 'wrong_password');
    }
    if (newPassword === currentPassword || newPassword === DEFAULT_ADMIN_PASSWORD) {
      throw badInput(
        'Choose a password other than the current one and the default.',
        [{ path: ['newPassword'], message: 'Same as before', code: 'password_reused' }],
        'password_reused',
      );
    }
    const passwordHash = await hashSecret(newPassword);
    const now = deps.now();
    deps.db.transaction((tx) => {
      usersRepository.update(tx, user.id, { passwordHash, mustChangePassword: false, updatedAt: now });
      usersRepository.revokeOtherSessions(tx, user.id, session.sessionId, now);
    });
    this.forgetFailures(deps, user.id);
    return { ok: true };
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
