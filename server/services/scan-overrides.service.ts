// A supervisor's override on a tablet: badge, PIN and a reason let one scan of one tray through
// at one station, once, for a short while (the guard checks it names the rule it passes).
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import type { DeviceAuth } from '../http/api';
import { scansRepository } from '../repositories/scans.repository';
import { auditRepository } from '../repositories/audit.repository';
import { conflict, notFound } from '../errors';
import type { OverrideKind } from '@shared/domain/guards';
import { parseTravellerCode } from '@shared/domain/traveller-code';
import { authService } from './auth.service';

/** A supervisor override is good for this long after it was given. */
export const OVERRIDE_MINUTES = 15;

export const scanOverridesService = {
  /** A supervisor's badge and PIN on the tablet, and a reason: lets one scan of one tray through. */
  async createOverride(
    deps: AppDeps,
    input: { badge: string; pin: string; reason: string; code: string; stationId: string; kind: OverrideKind },
    caller: { device: DeviceAuth | null; userId: string | null },
  ) {
    const supervisor = await authService.verifySupervisorBadge(deps, input.badge, input.pin, caller);
    if (caller.device && caller.device.stationId !== input.stationId) {
      throw conflict('station_not_allowed', 'This tablet can approve scans only at its own station. Approve it on the tablet at that station.');
    }
    const parsed = parseTravellerCode(input.code);
    const tray = parsed ? scansRepository.traysByNumbers(deps.db, [parsed.number])[0] : undefined;
    if (!tray) throw notFound('That tray');
    const now = deps.now();
    const id = crypto.randomUUID();
    deps.db.transaction((tx) => {
      scansRepository.insertOverride(tx, {
        id,
        trayId: tray.id,
        stationId: input.stationId,
        kind: input.kind,
        supervisorId: supervisor.id,
        reason: input.reason,
        createdAt: now,
        expiresAt: now + OVERRIDE_MINUTES * 60_000,
      });
      auditRepository.record(tx, now, {
        userId: supervisor.id,
        action: 'override.create',
        entity: 'tray',
        entityId: tray.id,
        detail: { kind: input.kind, reason: input.reason, stationId: input.stationId },
      });
    });
    return {
      id,
      kind: input.kind,
      stationId: input.stationId,
      supervisor: { id: supervisor.id, name: supervisor.name },
      expiresAt: new Date(now + OVERRIDE_MINUTES * 60_000).toISOString(),
    };
  },
};
