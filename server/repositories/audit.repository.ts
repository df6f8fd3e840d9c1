import type { DbLike as Db } from '../db/client';
import { auditLog } from '../db/schema/reference-data';

export interface AuditEntry {
  userId: string | null;
  action: string;
  entity: string;
  entityId?: string | null;
  detail?: unknown;
}

export const auditRepository = {
  record: (db: Db, at: number, entry: AuditEntry) =>
    db
      .insert(auditLog)
      .values({ at, userId: entry.userId, action: entry.action, entity: entry.entity, entityId: entry.entityId ?? null, detail: entry.detail ?? null })
      .run(),
};
