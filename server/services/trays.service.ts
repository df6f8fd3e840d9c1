// Trays after release: the tray page with its genealogy, reprints that void the old code,
// splits (part to rework) and merges (same order, same next step), and the printed travellers.
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import type { DbLike } from '../db/client';
import { traysRepository, type TrayRow } from '../repositories/trays.repository';
import { stateFromRow, trayStatesRepository, type TrayStateRow } from '../repositories/tray-states.repository';
import { ordersRepository, type OrderRow } from '../repositories/orders.repository';
import { mouldsRepository } from '../repositories/moulds.repository';
import { auditRepository } from '../repositories/audit.repository';
import { conflict, notFound, badInput } from '../errors';
import { readThumbnail } from '../lib/file-store';
import { renderTravellersPdf, humanise, type TravellerCard, type TravellerLayout } from '../lib/traveller-pdf';
import { printWords, type PrintWords } from '../lib/print-words';
import { factorySettingsService } from './factory-settings.service';
import { summariseTraveller, travellerCode } from './orders.service';
import { routingOf, specOf } from './order-spec.service';
import { mouldStepsFor, mouldTool } from '@shared/domain/routing';
import { canMerge, childTrayNumber, normaliseTrayNumber, releasedQuantity, splitTray, TRAY_NUMBER_PATTERN } from '@shared/domain/trays';
import { parseTravellerCode } from '@shared/domain/traveller-code';
import type { MergeBody, MouldLibraryItem, MouldPatch, SplitBody, TrayLink, TrayView } from '@shared/schemas/trays';
import type { TravellerSummary } from '@shared/schemas/orders';
import type { Process, RoutingStep, TrayPhase } from '@shared/domain/vocabulary';
import { kindTraits } from '@shared/domain/traveller';
import { iso } from '@shared/domain/time-zone';

/** Finds a traveller by id, by its number, or by the text of its QR code. */
function findTray(db: DbLike, idOrNumber: string): TrayRow {
  const byId = traysRepository.byId(db, idOrNumber);
  if (byId) return byId;
  const parsed = parseTravellerCode(idOrNumber);
  const number = parsed?.number ?? normaliseTrayNumber(idOrNumber);
  const byNumber = traysRepository.byNumber(db, number);
  if (!byNumber) throw notFound('That tray');
  return byNumber;
}

function stateOf(db: DbLike, tray: TrayRow): TrayStateRow {
  const state = trayStatesRepository.byTrayId(db, tray.id);
  if (!state) throw conflict('no_state', `Tray ${tray.number} has no recorded state.`);
  return state;
}

function link(t: TrayRow, state?: TrayStateRow | null): TrayLink {
  return { id: t.id, number: t.number, quantity: state?.quantity ?? t.quantity };
}

function auditTray(db: DbLike, now: number, userId: string, action: string, trayId: string, text: string, params?: Record<string, unknown>) {
  auditRepository.record(db, now, { userId, action, entity: 'tray', entityId: trayId, detail: { text, ...(params ? { params } : {}) } });
}

function splitEvent(trayId: string, type: 'split' | 'merge', state: TrayStateRow, qtyIn: number, userId: string, now: number, note: string) {
  return {
    id: crypto.randomUUID(),
    trayId,
    type,
    stepSeq: state.stepSeq,
    stationKind: state.stationKind,
    stationId: null,
    deviceId: null,
    userId,
    occurredAt: now,
    receivedAt: now,
    qtyIn,
    note,
  } as const;
}

function fittingsText(words: PrintWords, type: string, count: number): string {
  if (type === 'none' || count === 0) return words.traveller.noFittings;
  return words.traveller.fittings(count, words.backing[type as keyof PrintWords['backing']] ?? humanise(type).toLowerCase());
}

export const traysService = {
  get(deps: AppDeps, idOrNumber: string): TrayView {
    const { db } = deps;
    const tray = findTray(db, idOrNumber);
    const state = trayStatesRepository.byTrayId(db, tray.id) ?? null;
    const order = ordersRepository.byId(db, tray.orderId)!;
    const customer = ordersRepository.customerById(db, order.customerId)!;
    const mould = tray.mouldId ? mouldsRepository.byId(db, tray.mouldId) : undefined;
    const stored = routingOf(db, order.id, tray.kind);
    const routing = tray.kind === 'mould' ? mouldStepsFor(stored, mouldTool(order.process as Process, mould?.side === 'back' ? 'back' : 'front')) : stored;
    const byId = new Map(routing.map((s) => [s.seq, s]));
    const related = traysRepository.related(db, tray);
    const stateOfRelated = (t: TrayRow) => trayStatesRepository.byTrayId(db, t.id);
    const next = state?.stepSeq != null && state.phase !== 'merged' ? byId.get(state.stepSeq) : undefined;
    const phase = (state?.phase ?? 'waiting') as TrayPhase;
    return {
      id: tray.id,
      number: tray.number,
      code: travellerCode(deps, tray),
      revision: tray.revision,
      kind: tray.kind,
      orderId: order.id,
      order: { id: order.id, number: order.number, title: order.title, customer: customer.name, dueDate: order.dueDate },
      quantity: state?.quantity ?? tray.quantity,
      releasedQuantity: tray.quantity,
      status: state?.onHold ? 'on_hold' : phase,
      phase,
      onHold: state?.onHold ?? false,
      holdReason: state?.holdReason ?? null,
      cureReadyAt: iso(state?.cureReadyAt),
      releasedAt: iso(tray.releasedAt)!,
      nextStep: next ? { seq: next.seq, stationKind: next.stationKind, name: next.name } : null,
      routing,
      events: trayStatesRepository.eventsNamed(db, tray.id).map(({ event: e, by, station }) => ({
        id: e.id,
        type: e.type,
        stepSeq: e.stepSeq,
        stepName: e.stepSeq != null ? (byId.get(e.stepSeq)?.name ?? null) : null,
        stationKind: e.stationKind,
        stationName: station ?? null,
        by: by ?? null,
        occurredAt: iso(e.occurredAt)!,
        qtyIn: e.qtyIn,
        goodQty: e.goodQty,
        scrapQty: e.scrapQty,
        reworkQty: e.reworkQty,
        scrapReason: e.scrapReason,
        note: e.note,
      })),
      parent: (() => {
        const p = related.find((t) => t.id === tray.parentTrayId);
        return p ? link(p, stateOfRelated(p)) : null;
      })(),
      children: related.filter((t) => t.parentTrayId === tray.id).map((t) => link(t, stateOfRelated(t))),
      mergedInto: (() => {
        const m = related.find((t) => t.id === tray.mergedIntoId);
        return m ? link(m, stateOfRelated(m)) : null;
      })(),
      // merged trays keep 0 pieces; show what each brought in (its quantity before the merge)
      mergedFrom: related
        .filter((t) => t.mergedIntoId === tray.id)
        .map((t) => {
          const ev = trayStatesRepository
            .eventsNamed(db, t.id)
            .filter((e) => e.event.type === 'merge')
            .pop();
          return { id: t.id, number: t.number, quantity: ev?.event.qtyIn ?? 0 };
        }),
      mould: mould ? { id: mould.id, number: mould.number, side: mould.side } : null,
    };
  },

  reprint(deps: AppDeps, idOrNumber: string, actorId: string) {
    const { db } = deps;
    const now = deps.now();
    return db.transaction((tx) => {
      const tray = findTray(tx, idOrNumber);
      const state = trayStatesRepository.byTrayId(tx, tray.id);
      if (state?.phase === 'merged') throw conflict('tray_merged', `Tray ${tray.number} was merged into another tray; print that one.`);
      const revision = tray.revision + 1;
      traysRepository.update(tx, tray.id, { revision });
      auditTray(tx, now, actorId, 'tray.reprint', tray.id, `Traveller ${tray.number} reprinted as revision ${revision}; revision ${tray.revision} is void`, {
        tray: tray.number,
        revision,
        old: tray.revision,
      });
      return { id: tray.id, number: tray.number, revision, code: travellerCode(deps, { number: tray.number, revision }) };
    });
  },

  split(deps: AppDeps, idOrNumber: string, body: SplitBody, actorId: string) {
    const { db } = deps;
    const now = deps.now();
    return db.transaction((tx) => {
      const tray = findTray(tx, idOrNumber);
      if (tray.kind !== 'tray') throw conflict('not_a_tray', 'A mould traveller cannot be split.');
      const state = stateOf(tx, tray);
      const result = splitTray(
        stateFromRow(state),
        body.parts.map((p) => p.quantity),
      );
      if (!result.ok) throw conflict(result.code, result.message);
      const routing = routingOf(tx, tray.orderId, 'tray');
      for (const p of body.parts) {
        if (p.stepSeq != null && (state.stepSeq == null || p.stepSeq > state.stepSeq || !routing.some((s) => s.seq === p.stepSeq))) {
          throw badInput(
            'A split-off tray can go back to an earlier step for rework, not skip ahead.',
            [{ path: ['parts'], message: `Step ${p.stepSeq} is not at or before step ${state.stepSeq}` }],
            'bad_step',
          );
        }
      }
      const existingChildren = traysRepository.related(tx, tray).filter((t) => t.parentTrayId === tray.id).length;
      const children = body.parts.map((p, i) => {
        const number = childTrayNumber(tray.number, existingChildren + i + 1);
        if (!TRAY_NUMBER_PATTERN.test(number)) throw conflict('number_too_long', `Tray ${tray.number} has been split too often to number another part.`);
        const id = crypto.randomUUID();
        const rework = p.stepSeq != null && p.stepSeq !== state.stepSeq;
        traysRepository.insert(tx, {
          id,
          number,
          kind: 'tray',
          orderId: tray.orderId,
          parentTrayId: tray.id,
          revision: 1,
          quantity: p.quantity,
          releasedAt: tray.releasedAt,
          createdAt: now,
        });
        const childState: TrayStateRow = {
          ...state,
          trayId: id,
          quantity: p.quantity,
          ...(rework ? { stepSeq: p.stepSeq!, stationKind: routing.find((s) => s.seq === p.stepSeq)!.stationKind, cureReadyAt: null, waitingSince: now } : {}),
          lastEventAt: now,
          updatedAt: now,
        };
        trayStatesRepository.insert(tx, childState);
        const stepName = routing.find((s) => s.seq === childState.stepSeq)?.name;
        trayStatesRepository.insertEvents(tx, [
          splitEvent(
            id,
            'split',
            childState,
            p.quantity,
            actorId,
            now,
            `Split from ${tray.number}${rework ? `; back to "${stepName}" for rework` : ''}${body.note ? `: ${body.note}` : ''}`,
          ),
        ]);
        return { id, number, quantity: p.quantity, revision: 1, code: travellerCode(deps, { number, revision: 1 }) };
      });
      const revision = tray.revision + 1;
      traysRepository.update(tx, tray.id, { revision });
      trayStatesRepository.patch(tx, tray.id, { quantity: result.remaining, lastEventAt: now, updatedAt: now });
      const moved = children.map((c) => `${c.quantity} to ${c.number}`).join(', ');
      trayStatesRepository.insertEvents(tx, [
        splitEvent(tray.id, 'split', state, state.quantity, actorId, now, `Split: ${moved}; ${result.remaining} stay${body.note ? `: ${body.note}` : ''}`),
      ]);
      auditTray(tx, now, actorId, 'tray.split', tray.id, `Tray ${tray.number} split: ${moved}; ${result.remaining} stay (new traveller revision ${revision})`, {
        tray: tray.number,
        parts: children.map((c) => `${c.quantity} → ${c.number}`).join(', '),
        remaining: result.remaining,
        revision,
      });
      return {
        tray: { id: tray.id, number: tray.number, quantity: result.remaining, revision, code: travellerCode(deps, { number: tray.number, revision }) },
        children,
      };
    });
  },

  merge(deps: AppDeps, body: MergeBody, actorId: string) {
    const { db } = deps;
    const now = deps.now();
    if (new Set(body.trayIds).size !== body.trayIds.length) throw badInput('A tray is listed twice.', undefined, 'duplicate_tray');
    return db.transaction((tx) => {
      const trays = body.trayIds.map((id) => findTray(tx, id));
      const states = trays.map((t) => stateOf(tx, t));
      const routings = new Map<string, RoutingStep[]>();
      const routingFor = (orderId: string) => {
        if (!routings.has(orderId)) routings.set(orderId, routingOf(tx, orderId, 'tray'));
        return routings.get(orderId)!;
      };
      const result = canMerge(trays.map((t, i) => ({ orderId: t.orderId, state: stateFromRow(states[i]), routing: routingFor(t.orderId) })));
      if (!result.ok) throw conflict(result.code, result.message);
      const [target, ...others] = trays;
      const revision = target.revision + 1;
      traysRepository.update(tx, target.id, { revision });
      trayStatesRepository.patch(tx, target.id, {
        quantity: result.quantity,
        cureReadyAt: result.cureReadyAt ? Date.parse(result.cureReadyAt) : null,
        waitingSince: result.waitingSince ? Date.parse(result.waitingSince) : null,
        lastEventAt: now,
        updatedAt: now,
      });
      others.forEach((t, i) => {
        const s = states[i + 1];
        traysRepository.update(tx, t.id, { mergedIntoId: target.id });
        trayStatesRepository.patch(tx, t.id, { phase: 'merged', quantity: 0, stepSeq: null, stationKind: null, lastEventAt: now, updatedAt: now });
        trayStatesRepository.insertEvents(tx, [
          splitEvent(t.id, 'merge', s, s.quantity, actorId, now, `Merged into ${target.number}${body.note ? `: ${body.note}` : ''}`),
        ]);
      });
      const brought = others.map((t, i) => `${t.number} (${states[i + 1].quantity})`).join(', ');
      trayStatesRepository.insertEvents(tx, [
        splitEvent(
          target.id,
          'merge',
          states[0],
          result.quantity,
          actorId,
          now,
          `Merged in ${brought}; now ${result.quantity}${body.note ? `: ${body.note}` : ''}`,
        ),
      ]);
      auditTray(
        tx,
        now,
        actorId,
        'tray.merge',
        target.id,
        `Trays ${brought} merged into ${target.number}: ${result.quantity} pieces (new traveller revision ${revision})`,
        { trays: brought, into: target.number, quantity: result.quantity, revision },
      );
      return {
        tray: { id: target.id, number: target.number, quantity: result.quantity, revision, code: travellerCode(deps, { number: target.number, revision }) },
        merged: others.map((t) => t.id),
      };
    });
  },

  // -------------------------------------------------------------------------------------
  // Printed travellers

  /** Cards for the order's travellers (all, or the chosen ids), merged trays left out. */
  cards(deps: AppDeps, orderId: string, opts: { ids?: string[]; kind?: 'all' | 'tray' | 'mould' } = {}): TravellerCard[] {
    const { db } = deps;
    const order = ordersRepository.byId(db, orderId);
    if (!order) throw notFound('That order');
    const travellers = traysRepository.forOrder(db, orderId).filter((t) => t.state?.phase !== 'merged');
    const wanted = opts.ids ? new Set(opts.ids) : null;
    if (wanted) {
      const known = new Set(travellers.map((t) => t.tray.id));
      const unknown = [...wanted].filter((id) => !known.has(id));
      if (unknown.length) throw notFound(`Traveller ${unknown[0]} of this order`);
    }
    const chosen = travellers.filter((t) => (!wanted || wanted.has(t.tray.id)) && (!opts.kind || opts.kind === 'all' || t.tray.kind === opts.kind));
    if (chosen.length === 0) throw conflict('no_travellers', `Order ${order.number} has no travellers to print yet; release it first.`);
    // moulds first: they are needed first on the floor
    chosen.sort((a, b) => (a.tray.kind === b.tray.kind ? 0 : a.tray.kind === 'mould' ? -1 : 1));
    return traysService.cardsFor(deps, order, chosen);
  },

  cardsFor(deps: AppDeps, order: OrderRow, chosen: { tray: TrayRow; state: TrayStateRow | null }[]): TravellerCard[] {
    const { db } = deps;
    const words = printWords(factorySettingsService.language(deps));
    const w = words.traveller;
    const customer = ordersRepository.customerById(db, order.customerId)!;
    const spec = specOf(order);
    const trayRouting = routingOf(db, order.id, 'tray');
    const mouldRouting = routingOf(db, order.id, 'mould');
    const proofs = ordersRepository.proofs(db, order.id).filter((p) => p.approvedAt != null);
    const approved = proofs[proofs.length - 1];
    // only the thumbnail made (and so decoded) at upload is printed, never the file as sent
    const artwork = approved ? readThumbnail(deps.env.dataDir, approved.fileHash) : null;
    const artworkNote = approved ? w.proof(approved.revision, approved.mime === 'application/pdf') : w.noProof;
    const originals = traysRepository.forOrder(db, order.id).filter((t) => t.tray.kind === 'tray' && !t.tray.parentTrayId);
    const numbers = new Map(originals.map((t, i) => [t.tray.id, i + 1]));
    const parents = new Map(traysRepository.forOrder(db, order.id).map((t) => [t.tray.id, t.tray.number]));
    return chosen.map(({ tray, state }) => {
      const mould = tray.mouldId ? mouldsRepository.byId(db, tray.mouldId) : undefined;
      let caption: string;
      const tool = tray.kind === 'mould' ? mouldTool(spec.process, mould?.side === 'back' ? 'back' : 'front') : null;
      if (tool) {
        const reused = mould && mould.firstOrderId !== order.id;
        caption = w.mouldCaption(words.tool[tool], reused ? { at: mould?.storageLocation || null } : null, tool === 'cutting_die');
      } else if (tray.parentTrayId) {
        caption = w.splitFrom(parents.get(tray.parentTrayId) ?? null);
      } else {
        caption = w.trayOf(numbers.get(tray.id) ?? null, originals.length);
      }
      return {
        kind: tray.kind,
        number: tray.number,
        code: travellerCode(deps, tray),
        revision: tray.revision,
        orderNumber: order.number,
        customer: customer.name,
        title: order.title,
        quantity: state?.quantity ?? tray.quantity,
        caption,
        process: spec.process,
        material: spec.material,
        sizeMm: spec.sizeMm,
        colours: spec.colours,
        plating: spec.plating,
        secondPlating: spec.secondPlating ?? null,
        fittings: fittingsText(words, spec.backing.type, spec.backing.count),
        packaging: spec.packaging,
        dueDate: spec.dueDate,
        routing: tool ? mouldStepsFor(mouldRouting, tool) : trayRouting,
        artwork,
        artworkNote,
      };
    });
  },

  orderPdf(deps: AppDeps, orderId: string, opts: { layout: TravellerLayout; ids?: string[]; kind?: 'all' | 'tray' | 'mould' }) {
    const order = ordersRepository.byId(deps.db, orderId);
    if (!order) throw notFound('That order');
    return renderTravellersPdf(traysService.cards(deps, orderId, opts), opts.layout, printWords(factorySettingsService.language(deps))).then((pdf) => ({
      pdf,
      name: `travellers-${order.number}.pdf`,
    }));
  },

  trayPdf(deps: AppDeps, idOrNumber: string, layout: TravellerLayout) {
    const tray = findTray(deps.db, idOrNumber);
    const order = ordersRepository.byId(deps.db, tray.orderId)!;
    const state = trayStatesRepository.byTrayId(deps.db, tray.id) ?? null;
    if (state?.phase === 'merged') throw conflict('tray_merged', `Tray ${tray.number} was merged into another tray; print that one.`);
    return renderTravellersPdf(traysService.cardsFor(deps, order, [{ tray, state }]), layout, printWords(factorySettingsService.language(deps))).then(
      (pdf) => ({
        pdf,
        name: `traveller-${tray.number}-rev${tray.revision}.pdf`,
      }),
    );
  },

  // -------------------------------------------------------------------------------------
  // Mould library

  mouldLibrary(deps: AppDeps): MouldLibraryItem[] {
    const { db } = deps;
    const travellers = mouldsRepository.travellers(db);
    return mouldsRepository.library(db).map(({ mould, orderNumber, orderTitle, customer }) => {
      const mine = travellers.filter((t) => t.mouldId === mould.id);
      const open = mine.find((t) => t.phase !== 'done' && t.phase !== 'scrapped' && t.phase !== 'merged');
      const status: MouldLibraryItem['status'] =
        mould.status === 'retired'
          ? 'retired'
          : open
            ? kindTraits(open.stationKind).mouldShop === 'make'
              ? 'engraving'
              : 'checking'
            : mine.length
              ? 'ready'
              : (mould.status as MouldLibraryItem['status']);
      const lastUsed = mine.reduce<number | null>((m, t) => (m == null || t.releasedAt > m ? t.releasedAt : m), null);
      return {
        id: mould.id,
        number: mould.number,
        side: mould.side,
        designKey: mould.designKey,
        status,
        storageLocation: mould.storageLocation,
        useCount: mould.useCount,
        readyAt: iso(mould.readyAt),
        firstOrder:
          mould.firstOrderId && orderNumber ? { id: mould.firstOrderId, number: orderNumber, title: orderTitle ?? '', customer: customer ?? '' } : null,
        lastUsedAt: iso(lastUsed),
      };
    });
  },

  updateMould(deps: AppDeps, id: string, patch: MouldPatch, actorId: string) {
    const { db } = deps;
    const now = deps.now();
    db.transaction((tx) => {
      const mould = mouldsRepository.byId(tx, id);
      if (!mould) throw notFound('That mould');
      mouldsRepository.update(tx, id, {
        ...(patch.storageLocation !== undefined && { storageLocation: patch.storageLocation || null }),
        ...(patch.retired !== undefined && { status: patch.retired ? 'retired' : 'ready' }),
        updatedAt: now,
      });
      auditRepository.record(tx, now, { userId: actorId, action: 'mould.update', entity: 'mould', entityId: id, detail: patch });
    });
    return traysService.mouldLibrary(deps).find((m) => m.id === id)!;
  },

  /** Releasable quantity of an order, for callers that show it beside trays. */
  releasedQuantity: (order: OrderRow) => releasedQuantity(order.quantity, order.overrunPct),

  summaries(deps: AppDeps, orderId: string): TravellerSummary[] {
    const routing = routingOf(deps.db, orderId, 'tray');
    return traysRepository.forOrder(deps.db, orderId).map((t) => summariseTraveller(deps, t.tray, t.state, routing));
  },
};
