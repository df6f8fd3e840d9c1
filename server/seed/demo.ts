import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { users } from '../db/schema/users';
import { settings } from '../db/schema/reference-data';
import { hashSecret } from '../services/auth.service';
import { DEMO_FACTORY, DEMO_PASSWORD, DEMO_PEOPLE } from './demo-people';

/** The invented demo factory: its people first; orders and weeks of floor history follow. */
export async function seedDemo(deps: AppDeps): Promise<void> {
  const { db } = deps;
  const now = deps.now();
  const passwordHash = hashSecret(DEMO_PASSWORD);
  db.transaction((tx) => {
    tx.insert(settings)
      .values({ key: 'factory', value: { name: DEMO_FACTORY.name, timeZone: DEMO_FACTORY.timeZone } })
      .onConflictDoUpdate({ target: settings.key, set: { value: { name: DEMO_FACTORY.name, timeZone: DEMO_FACTORY.timeZone } } })
      .run();
    for (const p of DEMO_PEOPLE) {
      tx.insert(users)
        .values({
          id: crypto.randomUUID(),
          name: p.name,
          email: p.email,
          role: p.role,
          passwordHash,
          badge: p.badge ?? null,
          pinHash: p.pin ? hashSecret(p.pin) : null,
          createdAt: now,
          updatedAt: now,
        })
        .onConflictDoNothing()
        .run();
    }
  });
}
