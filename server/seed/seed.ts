import type { AppDeps } from '../app-deps';
import { usersRepository } from '../repositories/users.repository';
import { seedBase } from './base';

/** Seeds an empty database: the base data always, the demo factory when TRAYCE_SEED=demo. */
export async function seedIfEmpty(deps: AppDeps): Promise<'seeded' | 'kept'> {
  if (usersRepository.count(deps.db) > 0) return 'kept';
  seedBase(deps);
  if (deps.env.seed === 'demo') {
    const { seedDemo } = await import('./demo');
    await seedDemo(deps);
  }
  return 'seeded';
}
