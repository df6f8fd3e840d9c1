import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { loadsRepository, type LoadRow, type LoadTrayRow } from '../repositories/loads.repository';
import { auditRepository } from '../repositories/audit.repository';
import { wipService, type Placement } from './wip.service';
import { badInput, conflict, notFound } from '../errors';
import { LOAD_KINDS, LOAD_KIND_TRAITS, cures, loadStationKind, type LoadKind } from '@shared/domain/traveller';
import type { CreateLoadBody, LoadGroup, LoadTrayView, LoadView, LoadsOverview } from '@shared/schemas/loads';

const MIN = 60_000;

function trayView(p: Placement, now: number): LoadTrayView {
  return {
    trayId: p.row.trayId,
    number: p.row.number,
    orderId: p.row.orderId,
    orderNumber: p.row.orderNumber,
    customer: p.row.customer,
    quantity: p.row.quantity,
    waitingMinutes: p.waitingSince != null ? Math.max(0, Math.round((now - p.waitingSince) / MIN)) : null,
    onHold: !!p.row.onHold,
    stepName: p.row.stepName,
  };
}

/** The cure profile a tray waits for: the cure minutes of its cure step. */
function cureKey(p: Placement): string | null {
  const fromCurrent = p.row.phase === 'waiting' && cures(p.row.stationKind);
  const minutes = fromCurrent ? p.row.cureMinutes : p.row.nextCureMinutes;
  return minutes != null ? String(minutes) : null;
}

/** What the trays of one load share: the cure profile for an oven, the finish for a bath. */
function groupKey(kind: LoadKind, p: Placement): string | null {
  if (p.phase !== 'waiting' || p.kind !== loadStationKind(kind) || p.row.kind !== 'tray') return null;
  return LOAD_KIND_TRAITS[kind].groupedBy === 'cure profile' ? cureKey(p) : p.row.plating;
}

function groups(kind: LoadKind, placements: Placement[], taken: Set<string>, now: number): LoadGroup[] {
  const by = new Map<string, Placement[]>();
  for (const p of placements) {
    const key = groupKey(kind, p);
    // a held tray is not ready for a load: it is never offered, and create() refuses it
    if (key === null || taken.has(p.row.trayId) || p.row.onHold) continue;
    by.set(key, [...(by.get(key) ?? []), p]);
  }
  return [...by.entries()]
    .map(([key, ps]) => {
      const trays = ps.map((p) => trayView(p, now)).sort((a, b) => (b.waitingMinutes ?? 0) - (a.waitingMinutes ?? 0));
      return {
        key,
        label: LOAD_KIND_TRAITS[kind].label(key),
        trays,
        pieces: trays.reduce((s, t) => s + t.quantity, 0),
        oldestMinutes: trays.length ? Math.max(...trays.map((t) => t.waitingMinutes ?? 0)) : null,
      };
    })
    .sort((a, b) => (b.oldestMinutes ?? 0) - (a.oldestMinutes ?? 0));
}

function loadView(load: LoadRow, trays: LoadTrayRow[]): LoadView {
  const orders = new Map<string, { orderId: string; orderNumber: string; pieces: number }>();
  for (const t of trays) {
    const o = orders.get(t.orderId) ?? { orderId: t.orderId, orderNumber: t.orderNumber, pieces: 0 };
    o.pieces += t.quantity;
    orders.set(t.orderId, o);
  }
  return {
    id: load.id,
    number: load.number,
    kind: load.kind,
    groupKey: load.groupKey,
    status: load.status,
    createdAt: new Date(load.createdAt).toISOString(),
    splitAt: load.splitAt ? new Date(load.splitAt).toISOString() : null,
    trays: trays.map((t) => ({
      trayId: t.trayId,
      number: t.number,
      orderId: t.orderId,
      orderNumber: t.orderNumber,
      customer: t.customer,
      quantity: t.quantity,
      waitingMinutes: null,
      onHold: false,
      stepName: null,
    })),
    orders: [...orders.values()],
    pieces: trays.reduce((s, t) => s + t.quantity, 0),
  };
}

export const loadsService = {
  overview(deps: AppDeps): LoadsOverview {
    const now = deps.now();
    const { placements } = wipService.snapshot(deps);
    const taken = loadsRepository.traysInOpenLoads(deps.db);
    const open = loadsRepository.open(deps.db);
    const trays = loadsRepository.traysOf(
      deps.db,
      open.map((l) => l.id),
    );
    return {
      oven: groups(LOAD_KINDS[0], placements, taken, now),
      plating: groups(LOAD_KINDS[1], placements, taken, now),
      open: open.map((l) =>
        loadView(
          l,
          trays.filter((t) => t.loadId === l.id),
        ),
      ),
    };
  },

  /** Groups waiting trays of one cure profile or one finish (from any orders) into a load. */
  create(deps: AppDeps, body: CreateLoadBody, actorId: string | null): LoadView {
    const ids = [...new Set(body.trayIds)];
    const traits = LOAD_KIND_TRAITS[body.kind];
    const now = deps.now();
    const { placements } = wipService.snapshot(deps);
    const byId = new Map(placements.map((p) => [p.row.trayId, p]));
    const taken = loadsRepository.traysInOpenLoads(deps.db);
    const keys = new Set<string>();
    const chosen: Placement[] = [];
    for (const [i, id] of ids.entries()) {
      const p = byId.get(id);
      const key = p ? groupKey(body.kind, p) : null;
      if (!p || key === null) {
        throw badInput(`Only trays waiting for ${traits.waitingFor} can go into ${traits.loadName}.`, [
          { path: ['trayIds', i], message: 'Not waiting for this station kind' },
        ]);
      }
      if (taken.has(id)) throw conflict('already_in_load', `Tray ${p.row.number} is already in an open load.`);
      if (p.row.onHold) throw conflict('on_hold', `Tray ${p.row.number} is on hold.`);
      keys.add(key);
      chosen.push(p);
    }
    if (keys.size !== 1) {
      throw conflict('mixed_load', `${traits.loadName.charAt(0).toUpperCase()}${traits.loadName.slice(1)} takes trays of one ${traits.groupedBy} only.`);
    }
    const id = crypto.randomUUID();
    const number = `${traits.numberPrefix}-${String(loadsRepository.count(deps.db) + 1).padStart(5, '0')}`;
    const load: LoadRow = { id, number, kind: body.kind, groupKey: [...keys][0], status: 'open', createdAt: now, splitAt: null };
    deps.db.transaction((tx) => {
      loadsRepository.insert(
        tx,
        { ...load, createdBy: actorId },
        chosen.map((p) => ({ trayId: p.row.trayId, orderId: p.row.orderId, quantity: p.row.quantity })),
      );
      auditRepository.record(tx, now, { userId: actorId, action: 'load.create', entity: 'load', entityId: id, detail: { number, trays: ids.length } });
    });
    return loadView(load, loadsRepository.traysOf(deps.db, [id]));
  },

  /**
   * Splits a load back into its trays. Each tray kept its own record and quantity all along,
   * so every order gets back exactly the pieces it put in.
   */
  split(deps: AppDeps, id: string, actorId: string | null): LoadView {
    const load = loadsRepository.byId(deps.db, id);
    if (!load) throw notFound('That load');
    if (load.status !== 'open') throw conflict('already_split', `Load ${load.number} was already split.`);
    const now = deps.now();
    deps.db.transaction((tx) => {
      loadsRepository.markSplit(tx, id, now, actorId);
      auditRepository.record(tx, now, { userId: actorId, action: 'load.split', entity: 'load', entityId: id, detail: { number: load.number } });
    });
    return loadView({ ...load, status: 'split', splitAt: now }, loadsRepository.traysOf(deps.db, [id]));
  },
};
