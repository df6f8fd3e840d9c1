import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { usersRepository, type UserRow } from '../repositories/users.repository';
import { auditRepository } from '../repositories/audit.repository';
import { authService, hashSecret } from './auth.service';
import { conflict, notFound } from '../errors';
import type { CreateUserBody, UpdateUserBody, UserView } from '@shared/schemas/users';
import type { Role } from '@shared/domain/vocabulary';

export function toUserView(u: UserRow): UserView {
  return {
    id: u.id,
    name: u.name,
    email: u.email,
    role: u.role as Role,
    locale: u.locale,
    badge: u.badge,
    hasPin: !!u.pinHash,
    active: u.active,
    lastLoginAt: u.lastLoginAt ? new Date(u.lastLoginAt).toISOString() : null,
  };
}

/** An e-mail address or badge someone else already has is refused. */
function refuseTaken(db: AppDeps['db'], input: { email?: string; badge?: string | null }, self?: UserRow) {
  if (input.email && usersRepository.byEmail(db, input.email)) throw conflict('email_taken', 'Someone already uses that e-mail address.');
  if (input.badge && input.badge !== self?.badge && usersRepository.byBadge(db, input.badge))
    throw conflict('badge_taken', 'That badge is already given to someone.');
}

export const usersService = {
  list: (deps: AppDeps) => usersRepository.list(deps.db).map(toUserView),

  async create(deps: AppDeps, input: CreateUserBody, actorId: string | null) {
    const { db } = deps;
    refuseTaken(db, input);
    const [passwordHash, pinHash] = await Promise.all([hashSecret(input.password), input.pin ? hashSecret(input.pin) : null]);
    // again after the hashing (off the event loop): another request may have taken them meanwhile
    refuseTaken(db, input);
    const now = deps.now();
    const id = crypto.randomUUID();
    db.transaction((tx) => {
      usersRepository.insert(tx, {
        id,
        name: input.name,
        email: input.email.toLowerCase(),
        role: input.role,
        locale: input.locale ?? 'en',
        passwordHash,
        badge: input.badge ?? null,
        pinHash,
        createdAt: now,
        updatedAt: now,
      });
      auditRepository.record(tx, now, { userId: actorId, action: 'user.create', entity: 'user', entityId: id, detail: { role: input.role } });
    });
    const row = usersRepository.byId(db, id)!;
    return { id, name: row.name, email: row.email, role: row.role };
  },

  async update(deps: AppDeps, id: string, patch: UpdateUserBody, actorId: string) {
    const { db } = deps;
    const user = usersRepository.byId(db, id);
    if (!user) throw notFound('That user');
    refuseTaken(db, { badge: patch.badge }, user);
    if (id === actorId && (patch.active === false || (patch.role && patch.role !== 'admin'))) {
      throw conflict('self_lockout', 'You cannot switch off or demote your own account. Ask another administrator.');
    }
    const [pinHash, passwordHash] = await Promise.all([
      patch.pin !== undefined ? hashSecret(patch.pin) : undefined,
      patch.password !== undefined ? hashSecret(patch.password) : undefined,
    ]);
    refuseTaken(db, { badge: patch.badge }, user);
    const now = deps.now();
    db.transaction((tx) => {
      usersRepository.update(tx, id, {
        ...(patch.name !== undefined && { name: patch.name }),
        ...(patch.role !== undefined && { role: patch.role }),
        ...(patch.locale !== undefined && { locale: patch.locale }),
        ...(patch.active !== undefined && { active: patch.active }),
        ...(patch.badge !== undefined && { badge: patch.badge }),
        ...(pinHash !== undefined && { pinHash }),
        ...(passwordHash !== undefined && { passwordHash }),
        updatedAt: now,
      });
      // A role change or a switch-off takes effect at once: end the person's sessions.
      // So does a new password: whoever held the old one is signed out everywhere.
      if (patch.active === false || (patch.role && patch.role !== user.role) || patch.password !== undefined) usersRepository.revokeUserSessions(tx, id, now);
      const { password: _p, pin: _q, ...visible } = patch;
      auditRepository.record(tx, now, {
        userId: actorId,
        action: 'user.update',
        entity: 'user',
        entityId: id,
        detail: { ...visible, pinReset: patch.pin !== undefined, passwordReset: patch.password !== undefined },
      });
    });
    if (patch.password !== undefined) authService.forgetFailures(deps, id);
    return toUserView(usersRepository.byId(db, id)!);
  },
};
