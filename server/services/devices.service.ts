import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { devicesRepository, type DeviceRow } from '../repositories/devices.repository';
import { stationsRepository } from '../repositories/stations.repository';
import { usersRepository } from '../repositories/users.repository';
import { auditRepository } from '../repositories/audit.repository';
import { AppError, badInput, notFound } from '../errors';
import { randomToken, sha256Hex } from '../lib/keys';
import type { CreateDeviceBody, DeviceView } from '@shared/schemas/stations';
import { z } from 'zod';
import type { updateDeviceBody } from '@shared/schemas/stations';
import { calendarService } from './calendar.service';

/** Pairing codes avoid letters and digits that look alike (0/O, 1/I). */
const PAIRING_ALPHABET = 'ABCDEFGHJKLMNPQRSTUVWXYZ23456789';
const PAIRING_MINUTES = 30;

function pairingCode(): string {
  const bytes = crypto.randomBytes(6);
  return Array.from(bytes, (b) => PAIRING_ALPHABET[b % PAIRING_ALPHABET.length]).join('');
}

export function toDeviceView(d: DeviceRow): DeviceView {
  return {
    id: d.id,
    name: d.name,
    kind: d.kind,
    stationId: d.stationId,
    locale: d.locale === 'zh-CN' ? 'zh-CN' : 'en',
    idleMinutes: d.idleMinutes,
    active: d.active,
    paired: !d.pairingCode,
    pairingCode: d.pairingCode,
    lastSeenAt: d.lastSeenAt ? new Date(d.lastSeenAt).toISOString() : null,
  };
}

export const devicesService = {
  list: (deps: AppDeps) => devicesRepository.list(deps.db).map(toDeviceView),

  /** Registers a tablet (bound to a station) or a wall display (no station); the token is shown once. */
  create(deps: AppDeps, input: CreateDeviceBody, actorId: string | null) {
    if (input.stationId && !stationsRepository.byId(deps.db, input.stationId))
      throw badInput('That station does not exist.', [{ path: ['stationId'], message: 'Unknown station' }]);
    const now = deps.now();
    const id = crypto.randomUUID();
    const token = randomToken(24);
    const code = pairingCode();
    devicesRepository.insert(deps.db, {
      id,
      name: input.name,
      kind: input.stationId ? 'tablet' : 'wall',
      stationId: input.stationId,
      tokenHash: sha256Hex(token),
      pairingCode: code,
      pairingExpiresAt: now + PAIRING_MINUTES * 60_000,
      locale: input.locale,
      idleMinutes: input.idleMinutes,
      createdAt: now,
      updatedAt: now,
    });
    auditRepository.record(deps.db, now, {
      userId: actorId,
      action: 'device.create',
      entity: 'device',
      entityId: id,
      detail: { name: input.name, stationId: input.stationId },
    });
    return { id, token, pairingCode: code, pairingExpiresAt: new Date(now + PAIRING_MINUTES * 60_000).toISOString() };
  },

  update(deps: AppDeps, id: string, patch: z.infer<typeof updateDeviceBody>, actorId: string) {
    const current = devicesRepository.byId(deps.db, id);
    if (!current) throw notFound('That device');
    if (patch.stationId && !stationsRepository.byId(deps.db, patch.stationId)) throw badInput('That station does not exist.');
    const now = deps.now();
    devicesRepository.update(deps.db, id, { ...patch, updatedAt: now });
    // Switched off or moved to another station: the badge sign-ins on it end.
    if (patch.active === false || (patch.stationId !== undefined && patch.stationId !== current.stationId))
      usersRepository.revokeDeviceSessions(deps.db, id, now);
    auditRepository.record(deps.db, now, { userId: actorId, action: 'device.update', entity: 'device', entityId: id, detail: patch });
    return toDeviceView(devicesRepository.byId(deps.db, id)!);
  },

  /** A new pairing code (and a new token: the old pairing stops working). */
  repair(deps: AppDeps, id: string, actorId: string) {
    const current = devicesRepository.byId(deps.db, id);
    if (!current) throw notFound('That device');
    const now = deps.now();
    const token = randomToken(24);
    const code = pairingCode();
    devicesRepository.update(deps.db, id, { tokenHash: sha256Hex(token), pairingCode: code, pairingExpiresAt: now + PAIRING_MINUTES * 60_000, updatedAt: now });
    usersRepository.revokeDeviceSessions(deps.db, id, now);
    auditRepository.record(deps.db, now, { userId: actorId, action: 'device.repair', entity: 'device', entityId: id });
    return { id, token, pairingCode: code };
  },

  /**
   * The tablet types the code shown on the admin screen; it receives a fresh device token that
   * only it knows (kept in an HttpOnly cookie), and the code is used up.
   */
  pair(deps: AppDeps, code: string) {
    const now = deps.now();
    const row = devicesRepository.byPairingCode(deps.db, code);
    if (!row || !row.active || !row.pairingExpiresAt || row.pairingExpiresAt < now) {
      throw new AppError(404, 'unknown_pairing_code', 'That pairing code is not valid or has expired. Ask an administrator for a new one.');
    }
    const token = randomToken(24);
    devicesRepository.update(deps.db, row.id, { tokenHash: sha256Hex(token), pairingCode: null, pairingExpiresAt: null, lastSeenAt: now, updatedAt: now });
    auditRepository.record(deps.db, now, { userId: null, action: 'device.pair', entity: 'device', entityId: row.id });
    return { token, device: toDeviceView(devicesRepository.byId(deps.db, row.id)!) };
  },

  current(deps: AppDeps, id: string) {
    const row = devicesRepository.byId(deps.db, id);
    if (!row) throw notFound('That device');
    const now = deps.now();
    if (!row.lastSeenAt || now - row.lastSeenAt > 60_000) devicesRepository.update(deps.db, id, { lastSeenAt: now });
    const station = row.stationId ? stationsRepository.byId(deps.db, row.stationId) : undefined;
    return {
      ...toDeviceView(row),
      station: station ? { id: station.id, code: station.code, name: station.name, nameZh: station.nameZh, kind: station.kind } : null,
      // the tablet shows every time in the factory's zone, also offline (it keeps this answer)
      timeZone: calendarService.timeZone(deps),
    };
  },
};
