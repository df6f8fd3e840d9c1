import type { AppDeps } from '../app-deps';
import { floorRepository } from '../repositories/floor.repository';
import { wipService } from './wip.service';
import { projectionService } from './projection.service';
import { calendarService } from './calendar.service';
import { stationsRepository } from '../repositories/stations.repository';
import type { WallView } from '@shared/schemas/live';
import { iso } from '@shared/domain/time-zone';

const MIN = 60_000;

export const wallService = {
  view(deps: AppDeps): WallView {
    const now = deps.now();
    const snap = wipService.snapshot(deps);
    const stationName = new Map(snap.stations.map((s) => [s.id, s.name]));
    const curing = snap.placements
      .filter((p) => p.phase === 'curing' && p.row.cureReadyAt != null)
      .map((p) => ({
        trayId: p.row.trayId,
        number: p.row.number,
        orderNumber: p.row.orderNumber,
        stationName: p.row.stationId ? (stationName.get(p.row.stationId) ?? null) : null,
        readyAt: iso(p.row.cureReadyAt as number),
        pieces: p.row.quantity,
        stepName: p.row.stepName,
      }))
      .sort((a, b) => a.readyAt.localeCompare(b.readyAt));
    // hold reasons by their names, never their codes
    const codes = stationsRepository.reasonCodes(deps.db);
    const reasonName = new Map(codes.map((r) => [r.code, r.name]));
    const reasonNameZh = new Map(codes.map((r) => [r.code, r.nameZh]));
    const holds = snap.placements
      .filter((p) => p.row.onHold)
      .map((p) => ({
        trayId: p.row.trayId,
        number: p.row.number,
        orderNumber: p.row.orderNumber,
        stationKind: p.kind,
        reason: p.row.holdReason ? (reasonName.get(p.row.holdReason) ?? p.row.holdReason) : null,
        reasonZh: p.row.holdReason ? reasonNameZh.get(p.row.holdReason) || null : null,
        pieces: p.row.quantity,
      }));
    const oldestByKind = new Map<string, { stationKind: string; trayNumber: string; orderNumber: string; minutes: number }>();
    for (const p of snap.placements) {
      if (p.phase !== 'waiting' || p.waitingSince == null) continue;
      const minutes = Math.max(0, Math.round((now - p.waitingSince) / MIN));
      const cur = oldestByKind.get(p.kind);
      if (!cur || minutes > cur.minutes) oldestByKind.set(p.kind, { stationKind: p.kind, trayNumber: p.row.number, orderNumber: p.row.orderNumber, minutes });
    }
    // the longest queue relative to what the kind's stations can take at once
    let bottleneck: WallView['bottleneck'] = null;
    for (const k of snap.wip.kinds) {
      const capacity = snap.stations.filter((s) => s.kind === k.stationKind && s.active).reduce((s, x) => s + x.capacityTrays, 0);
      if (capacity <= 0 || k.waiting.trays === 0) continue;
      const ratio = k.waiting.trays / capacity;
      if (!bottleneck || ratio > bottleneck.ratio)
        bottleneck = { stationKind: k.stationKind, waitingTrays: k.waiting.trays, capacityTrays: capacity, ratio: Math.round(ratio * 100) / 100 };
    }
    const since = now - 24 * 60 * MIN;
    const refusals = floorRepository.openRejections(deps.db, since, 12).map((r) => ({
      id: r.id,
      code: r.code,
      message: r.message,
      at: iso(r.occurredAt ?? r.receivedAt),
      trayNumber: r.trayNumber,
      stationName: r.stationName,
      userName: r.userName,
    }));
    const overrides = floorRepository.recentOverrides(deps.db, now - 12 * 60 * MIN, 8).map((o) => ({
      id: o.id,
      kind: o.kind,
      reason: o.reason,
      at: iso(o.createdAt),
      trayNumber: o.trayNumber,
      stationName: o.stationName,
      supervisorName: o.supervisorName,
      used: !!o.usedEventId,
    }));
    const atRisk = projectionService
      .lateRisk(deps)
      .slice(0, 8)
      .map((o) => ({
        orderId: o.orderId,
        number: o.number,
        customer: o.customer,
        title: o.title,
        dueDate: o.dueDate,
        expectedAt: o.expectedAt,
        p85At: o.p85At,
        risk: o.risk,
      }));
    return {
      asOf: iso(now),
      timeZone: calendarService.timeZone(deps),
      wip: snap.wip,
      curing,
      holds,
      oldest: [...oldestByKind.values()],
      refusals,
      overrides,
      atRisk,
      bottleneck,
    };
  },
};
