import { uuidv7 } from '@shared/domain/event-id';

/**
 * A new event id: a time-ordered UUIDv7 (see shared/domain/event-id.ts). It needs only
 * crypto.getRandomValues, which a tablet on plain http on the factory network still has
 * (crypto.randomUUID exists only on secure pages).
 */
export function newId(): string {
  return uuidv7();
}
