import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { stationsRepository, type StationRow } from '../repositories/stations.repository';
import { auditRepository } from '../repositories/audit.repository';
import { calendarService } from './calendar.service';
import { conflict, notFound } from '../errors';
import type { StationBody, StationView } from '@shared/schemas/stations';
import type { StationKind } from '@shared/domain/vocabulary';

export function toStationView(s: StationRow): StationView {
  return {
    id: s.id,
    code: s.code,
    name: s.name,
    nameZh: s.nameZh,
    kind: s.kind as StationKind,
    capacityTrays: s.capacityTrays,
    continuous: s.continuous,
    instructions: s.instructions,
    safetyNotes: s.safetyNotes,
    instructionsZh: s.instructionsZh,
    safetyNotesZh: s.safetyNotesZh,
    active: s.active,
  };
}

export const stationsService = {
  list: (deps: AppDeps) => stationsRepository.list(deps.db).map(toStationView),

  get(deps: AppDeps, id: string) {
    const s = stationsRepository.byId(deps.db, id);
    if (!s) throw notFound('That station');
    return toStationView(s);
  },

  create(deps: AppDeps, input: StationBody, actorId: string) {
    if (stationsRepository.byCode(deps.db, input.code)) throw conflict('code_taken', `A station with code ${input.code} exists already.`);
    const now = deps.now();
    const id = crypto.randomUUID();
    stationsRepository.insert(deps.db, { id, ...input, createdAt: now, updatedAt: now });
    auditRepository.record(deps.db, now, { userId: actorId, action: 'station.create', entity: 'station', entityId: id, detail: input });
    // the working calendar keys exceptions by station and kind (an oven runs around the clock)
    calendarService.forget(deps);
    return stationsService.get(deps, id);
  },

  update(deps: AppDeps, id: string, patch: Partial<StationBody>, actorId: string) {
    const current = stationsRepository.byId(deps.db, id);
    if (!current) throw notFound('That station');
    if (patch.code && patch.code !== current.code && stationsRepository.byCode(deps.db, patch.code)) {
      throw conflict('code_taken', `A station with code ${patch.code} exists already.`);
    }
    const now = deps.now();
    stationsRepository.update(deps.db, id, { ...patch, updatedAt: now });
    auditRepository.record(deps.db, now, { userId: actorId, action: 'station.update', entity: 'station', entityId: id, detail: patch });
    calendarService.forget(deps);
    return stationsService.get(deps, id);
  },

  reasonCodes: (deps: AppDeps) =>
    stationsRepository.reasonCodes(deps.db).map((r) => ({ code: r.code, name: r.name, nameZh: r.nameZh, kind: r.kind, stationKind: r.stationKind })),
};
