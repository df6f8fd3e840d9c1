import fs from 'node:fs';
import path from 'node:path';
import type { z } from 'zod';
import type { AppDeps } from '../app-deps';
import { reasonCodesRepository } from '../repositories/reason-codes.repository';
import { auditRepository } from '../repositories/audit.repository';
import { backupDb } from '../db/backup';
import { conflict, notFound } from '../errors';
import type { BackupView, ReasonCodeAdminView, ReasonCodeBody, updateReasonCodeBody } from '@shared/schemas/admin';
import type { StationKind } from '@shared/domain/vocabulary';

const backupDir = (deps: AppDeps) => path.join(deps.env.dataDir, 'backups');

export const adminService = {
  reasonCodes: (deps: AppDeps): ReasonCodeAdminView[] =>
    reasonCodesRepository.listAll(deps.db).map((r) => ({ ...r, stationKind: (r.stationKind as StationKind | null) ?? null })),

  createReasonCode(deps: AppDeps, body: ReasonCodeBody, actorId: string) {
    if (reasonCodesRepository.byCode(deps.db, body.code)) throw conflict('code_taken', `The reason code ${body.code} exists already.`);
    reasonCodesRepository.insert(deps.db, body);
    auditRepository.record(deps.db, deps.now(), { userId: actorId, action: 'reason_code.create', entity: 'reason_code', entityId: body.code, detail: body });
    return adminService.reasonCodes(deps).find((r) => r.code === body.code)!;
  },

  /** Codes are never deleted (history points at them); they are switched off instead. */
  updateReasonCode(deps: AppDeps, code: string, patch: z.infer<typeof updateReasonCodeBody>, actorId: string) {
    if (!reasonCodesRepository.byCode(deps.db, code)) throw notFound('That reason code');
    reasonCodesRepository.update(deps.db, code, patch);
    auditRepository.record(deps.db, deps.now(), { userId: actorId, action: 'reason_code.update', entity: 'reason_code', entityId: code, detail: patch });
    return adminService.reasonCodes(deps).find((r) => r.code === code)!;
  },

  listBackups(deps: AppDeps): BackupView[] {
    const dir = backupDir(deps);
    if (!fs.existsSync(dir)) return [];
    return fs
      .readdirSync(dir)
      .filter((f) => f.endsWith('.db'))
      .map((f) => {
        const stat = fs.statSync(path.join(dir, f));
        return { file: f, sizeBytes: stat.size, createdAt: stat.mtime.toISOString() };
      })
      .sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  },

  /** An online backup while the factory keeps scanning (SQLite backup API). */
  async makeBackup(deps: AppDeps, actorId: string): Promise<BackupView> {
    const dir = backupDir(deps);
    fs.mkdirSync(dir, { recursive: true, mode: 0o700 });
    fs.chmodSync(dir, 0o700);
    const name = `trayce-${new Date(deps.now()).toISOString().replace(/[:.]/g, '-')}.db`;
    await backupDb(deps.db, path.join(dir, name));
    auditRepository.record(deps.db, deps.now(), { userId: actorId, action: 'backup.create', entity: 'backup', entityId: name });
    return adminService.listBackups(deps).find((b) => b.file === name)!;
  },
};
