// What a station's tablet shows and caches: its travellers, each with its order, routing and state,
// and one traveller's card looked up by its code.
import type { AppDeps } from '../app-deps';
import type { DbLike } from '../db/client';
import { scansRepository, type TrayRow } from '../repositories/scans.repository';
import { stateFromRow, trayStatesRepository } from '../repositories/tray-states.repository';
import { AppError, conflict, notFound } from '../errors';
import { refusalText } from '@shared/domain/scan-messages';
import { parseTravellerCode, verifyTravellerCode } from '@shared/domain/traveller-code';
import { initialTrayState, type RoutingStep, type StationKind, type TrayState } from '@shared/domain/vocabulary';
import type { StationQueue, TrayCard } from '@shared/schemas/scans';
import { toRoutingStep } from './order-spec.service';

function cards(db: DbLike, items: { tray: TrayRow; state: TrayState }[]): TrayCard[] {
  const orderIds = [...new Set(items.map((i) => i.tray.orderId))];
  const orderRows = new Map(scansRepository.ordersByIds(db, orderIds).map((o) => [o.id, o]));
  const routings = new Map<string, RoutingStep[]>();
  for (const step of scansRepository.stepsByOrders(db, orderIds)) {
    const key = `${step.orderId}:${step.travellerKind}`;
    if (!routings.has(key)) routings.set(key, []);
    routings.get(key)!.push(toRoutingStep(step));
  }
  const notReady = new Map(scansRepository.mouldsNotReady(db, orderIds).map((m) => [m.orderId, m.notReady > 0]));
  const artwork = new Set(scansRepository.artworkProofs(db, orderIds).map((p) => p.orderId));
  return items.map(({ tray, state }) => {
    const o = orderRows.get(tray.orderId);
    return {
      tray: { id: tray.id, number: tray.number, kind: tray.kind, revision: tray.revision, releasedQuantity: tray.quantity },
      order: o
        ? {
            ...o,
            colours: (o.colours ?? []).map((c) => ({ name: c.name, ...(c.ref ? { ref: c.ref } : {}), ...(c.hex ? { hex: c.hex } : {}) })),
          }
        : null,
      state: { ...state, lastEventAt: state.lastEventAt ?? null },
      routing: routings.get(`${tray.orderId}:${tray.kind}`) ?? [],
      mouldReady: !notReady.get(tray.orderId),
      artworkUrl: artwork.has(tray.orderId) ? `/api/scans/artwork/${tray.orderId}` : null,
    };
  });
}

export const stationQueueService = {
  /** What a station's tablet shows and caches: its travellers with order, routing and state. */
  stationQueue(deps: AppDeps, stationId: string): StationQueue {
    const station = scansRepository.stationById(deps.db, stationId);
    if (!station) throw notFound('That station');
    const rows = scansRepository.stationQueue(deps.db, station.id, station.kind);
    return {
      station: {
        id: station.id,
        code: station.code,
        name: station.name,
        nameZh: station.nameZh,
        kind: station.kind as StationKind,
        continuous: station.continuous,
        instructions: station.instructions,
        safetyNotes: station.safetyNotes,
        instructionsZh: station.instructionsZh,
        safetyNotesZh: station.safetyNotesZh,
      },
      asOf: new Date(deps.now()).toISOString(),
      trays: cards(
        deps.db,
        rows.map((r) => ({ tray: r.tray, state: stateFromRow(r.state) })),
      ),
    };
  },

  /** One traveller's card by its scanned code or typed number (for a tray not in the station's list). */
  lookup(deps: AppDeps, code: string): TrayCard {
    const parsed = parseTravellerCode(code);
    const tray = parsed ? scansRepository.traysByNumbers(deps.db, [parsed.number])[0] : undefined;
    if (!tray) throw new AppError(404, 'unknown_tray', refusalText('unknown_tray'));
    const check = verifyTravellerCode(parsed!, deps.keys.traveller, tray.revision);
    if (check.status === 'bad_signature') throw conflict('bad_signature', refusalText('bad_signature'));
    if (check.status === 'void_traveller') {
      throw conflict('void_traveller', refusalText('void_traveller', { currentRevision: check.currentRevision }), { currentRevision: check.currentRevision });
    }
    const stateRow = trayStatesRepository.byTrayId(deps.db, tray.id);
    const state = stateRow
      ? stateFromRow(stateRow)
      : initialTrayState({ trayId: tray.id, kind: tray.kind, quantity: tray.quantity, releasedAt: new Date(tray.releasedAt).toISOString() });
    return cards(deps.db, [{ tray, state }])[0];
  },
};
