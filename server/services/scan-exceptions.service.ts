// Refused scans for supervisors: the list, closing one with what was done, and trying one again.
import type { AppDeps } from '../app-deps';
import { scansRepository } from '../repositories/scans.repository';
import { auditRepository } from '../repositories/audit.repository';
import { conflict, notFound } from '../errors';
import { refusalText } from '@shared/domain/scan-messages';
import { parseTravellerCode } from '@shared/domain/traveller-code';
import type { RejectionCode } from '@shared/domain/vocabulary';
import type { ScanEvent, ScanResult } from '@shared/schemas/scans';
import { notifyFloorChanged } from './live-bus';
import { BatchData, evaluateAgain, refusalResult, storedEvent, traySummary } from './scan-ingest.service';
import { rowFromState, trayStatesRepository } from '../repositories/tray-states.repository';
import { iso } from '@shared/domain/time-zone';

export const scanExceptionsService = {
  /** Refused scans for supervisors (open first-class; `open=false` for the resolved history). */
  exceptions(deps: AppDeps, filter: { open?: boolean; deviceId?: string; sinceHours?: number; limit?: number }) {
    const since = filter.sinceHours ? deps.now() - filter.sinceHours * 3600_000 : undefined;
    return scansRepository
      .rejections(deps.db, { open: filter.open, deviceId: filter.deviceId, since, limit: filter.limit ?? 200 })
      .map(({ r, trayNumber, stationName, stationKind, userName }) => {
        const payload = (r.payload ?? {}) as { event?: Partial<ScanEvent>; params?: Record<string, string | number | null> };
        return {
          id: r.id,
          eventId: r.eventId,
          code: r.code as RejectionCode,
          message: r.message,
          params: payload.params ?? {},
          type: payload.event?.type ?? null,
          scannedCode: typeof payload.event?.code === 'string' ? payload.event.code : null,
          trayId: r.trayId,
          trayNumber,
          stationId: r.stationId,
          stationName,
          stationKind,
          operatorId: r.userId,
          operatorName: userName,
          deviceId: r.deviceId,
          occurredAt: iso(r.occurredAt),
          receivedAt: iso(r.receivedAt)!,
          resolvedAt: iso(r.resolvedAt),
          resolution: r.resolution,
        };
      });
  },

  /** A supervisor closes a refused scan with what was done about it. */
  resolve(deps: AppDeps, id: string, input: { resolution: string }, actorId: string) {
    const row = scansRepository.rejectionById(deps.db, id);
    if (!row) throw notFound('That refused scan');
    if (row.resolvedAt) throw conflict('already_resolved', 'This refused scan was already resolved.');
    const now = deps.now();
    deps.db.transaction((tx) => {
      scansRepository.resolveRejection(tx, id, { resolvedAt: now, resolvedBy: actorId, resolution: input.resolution });
      auditRepository.record(tx, now, { userId: actorId, action: 'scan.resolve', entity: 'scan_rejection', entityId: id, detail: input });
    });
    notifyFloorChanged(deps);
    return { id, resolvedAt: new Date(now).toISOString() };
  },

  /** Tries a refused scan again now (after the missing scans arrived, a hold was lifted...). */
  retry(deps: AppDeps, id: string, actorId: string): ScanResult {
    const now = deps.now();
    const result = deps.db.transaction(
      (tx): ScanResult => {
        const row = scansRepository.rejectionById(tx, id);
        if (!row) throw notFound('That refused scan');
        if (row.resolvedAt) throw conflict('already_resolved', 'This refused scan was already resolved.');
        const event = storedEvent(row);
        if (!event) throw conflict('not_retryable', 'This scan was unreadable; it cannot be tried again.');
        const data = new BatchData(tx, deps.keys.traveller);
        const number = parseTravellerCode(event.code)?.number;
        data.loadTrays(number ? [number] : []);
        if (event.overrideId) data.loadOverrides([event.overrideId]);
        const e = evaluateAgain(tx, data, event, row, now);
        if (!e.result.ok) {
          const r = e.result;
          scansRepository.updateRejection(tx, id, { code: r.code, message: refusalText(r.code, data.named(r.params)), payload: { event, params: r.params } });
          return refusalResult(event.id, e, data);
        }
        const ok = e.result;
        trayStatesRepository.put(tx, rowFromState(ok.next, data.routing(e.tray!), now));
        scansRepository.resolveRejection(tx, id, { resolvedAt: now, resolvedBy: actorId, resolution: 'accepted_on_retry' });
        auditRepository.record(tx, now, { userId: actorId, action: 'scan.retry', entity: 'scan_rejection', entityId: id, detail: { eventId: event.id } });
        return { id: event.id, status: 'accepted' as const, tray: traySummary(e.tray!, ok.next, data.routing(e.tray!)) };
      },
      { behavior: 'immediate' },
    );
    notifyFloorChanged(deps);
    return result;
  },
};
