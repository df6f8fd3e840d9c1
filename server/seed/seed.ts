import type { AppDeps } from '../app-deps';
import { usersRepository } from '../repositories/users.repository';
import { DEFAULT_ADMIN_PASSWORD } from '../env';
import { seedBase } from './base';
import { secretMatches } from '../services/auth.service';

/**
 * Seeds an empty database: the base data always, the demo factory when TRAYCE_SEED=demo. The demo
 * factory has its own admin, so there the first admin is made only when TRAYCE_ADMIN_PASSWORD was
 * set to something other than the documented default: a demo never leaves an account that opens
 * with a published password. On every start, a first admin that still has the default password
 * is held to change it at its next sign-in (databases made before that rule included).
 */
export async function seedIfEmpty(deps: AppDeps): Promise<'seeded' | 'kept'> {
  if (usersRepository.count(deps.db) > 0) {
    await holdDefaultPassword(deps);
    return 'kept';
  }
  const demo = deps.env.seed === 'demo';
  await seedBase(deps, { firstAdmin: !(demo && deps.env.adminPassword === DEFAULT_ADMIN_PASSWORD) });
  if (demo) {
    const { seedDemo } = await import('./demo');
    await seedDemo(deps);
  }
  return 'seeded';
}

/** The first admin still signing in with the documented default password must change it first. */
export async function holdDefaultPassword(deps: AppDeps): Promise<void> {
  const admin = usersRepository.byEmail(deps.db, deps.env.adminEmail);
  if (!admin || !admin.active || admin.mustChangePassword) return;
  if (await secretMatches(DEFAULT_ADMIN_PASSWORD, admin.passwordHash)) {
    usersRepository.update(deps.db, admin.id, { mustChangePassword: true, updatedAt: deps.now() });
  }
}
