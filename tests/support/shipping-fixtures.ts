// Factories for packing, dispatch and status-link tests: orders whose trays stand where the
// test needs them, and dispatch scans written as the scan service writes them.
import crypto from 'node:crypto';
import type { AppDeps } from '../../server/app-deps';
import { customers } from '../../server/db/schema/customers';
import { orders, orderSteps, proofs } from '../../server/db/schema/orders';
import { trays } from '../../server/db/schema/trays';
import { trayStatesRepository } from '../../server/repositories/tray-states.repository';
import { putFile } from '../../server/lib/file-store';
import type { StationKind, TrayPhase } from '@shared/domain/vocabulary';

/** The tail of a routing: forming, inspection, packing and dispatch (common practice order). */
export const PACKING_ROUTING: { name: string; stationKind: StationKind }[] = [
  { name: 'Die striking', stationKind: 'strike' },
  { name: 'Colour 1 of 1: fill', stationKind: 'fill' },
  { name: 'Colour 1 of 1: cure', stationKind: 'cure' },
  { name: 'Polishing', stationKind: 'polish' },
  { name: 'Final inspection', stationKind: 'inspect' },
  { name: 'Bagging', stationKind: 'bag' },
  { name: 'Packing', stationKind: 'pack' },
  { name: 'Dispatch', stationKind: 'dispatch' },
];
export const SEQ = { strike: 1, fill: 2, cure: 3, polish: 4, inspect: 5, bag: 6, pack: 7, dispatch: 8 } as const;

export interface TrayPlan {
  /** pieces in the tray now */
  quantity: number;
  /** the step it waits at (1-based), or 'done' / 'scrapped' */
  at: number | 'done' | 'scrapped';
  onHold?: boolean;
}

export interface ShippingOrderFixture {
  orderId: string;
  number: string;
  customerId: string;
  customer: string;
  title: string;
  trays: { id: string; number: string }[];
}

let counter = 0;

export function insertShippingOrder(
  deps: Pick<AppDeps, 'db'>,
  options: {
    trays: TrayPlan[];
    quantity?: number;
    overrunPct?: number;
    customer?: string;
    title?: string;
    contactEmail?: string | null;
    contactName?: string | null;
    salesOwnerId?: string | null;
    status?: string;
    dueDate?: string;
    releasedAt?: number;
  },
): ShippingOrderFixture {
  counter += 1;
  const number = `${5000 + counter}${crypto.randomInt(10, 99)}`;
  const orderId = crypto.randomUUID();
  const customerId = crypto.randomUUID();
  const customer = options.customer ?? `Invented Lantern Society ${number}`;
  const title = options.title ?? `Lantern festival pin ${number}`;
  const t = options.releasedAt ?? Date.now() - 5 * 86_400_000;
  const quantity = options.quantity ?? options.trays.reduce((a, p) => a + p.quantity, 0);
  const out: ShippingOrderFixture = { orderId, number, customerId, customer, title, trays: [] };
  deps.db.transaction((tx) => {
    tx.insert(customers)
      .values({
        id: customerId,
        name: customer,
        contactName: options.contactName ?? null,
        contactEmail: options.contactEmail ?? null,
        createdAt: t,
        updatedAt: t,
      })
      .run();
    tx.insert(orders)
      .values({
        id: orderId,
        number,
        customerId,
        title,
        process: 'hard_enamel',
        material: 'iron',
        sizeMm: 25,
        quantity,
        overrunPct: options.overrunPct ?? 5,
        colours: [{ name: 'Lantern red', hex: '#b3261e' }],
        plating: 'gold',
        backingType: 'butterfly_clutch',
        packaging: 'individual_bag',
        dueDate: options.dueDate ?? '2099-01-01',
        notes: 'internal: customer pays late, keep an eye on it',
        status: options.status ?? 'in_production',
        designKey: `design-${number}`,
        salesOwnerId: options.salesOwnerId ?? null,
        releasedAt: t,
        createdAt: t - 86_400_000,
        updatedAt: t,
      })
      .run();
    PACKING_ROUTING.forEach((s, i) => {
      tx.insert(orderSteps)
        .values({
          id: crypto.randomUUID(),
          orderId,
          travellerKind: 'tray',
          seq: i + 1,
          name: s.name,
          stationKind: s.stationKind,
          trayMinutes: 5,
          pieceMinutes: 0.05,
          cureMinutes: s.stationKind === 'cure' ? 120 : null,
        })
        .run();
    });
    options.trays.forEach((plan, i) => {
      const id = crypto.randomUUID();
      const trayNumber = `${number}-${String(i + 1).padStart(3, '0')}`;
      const phase: TrayPhase = plan.at === 'done' ? 'done' : plan.at === 'scrapped' ? 'scrapped' : 'waiting';
      const stepSeq = typeof plan.at === 'number' ? plan.at : null;
      tx.insert(trays)
        .values({
          id,
          number: trayNumber,
          kind: 'tray',
          orderId,
          revision: 1,
          quantity: plan.quantity,
          releasedAt: t,
          createdAt: t,
          writtenOffAt: plan.at === 'scrapped' ? t : null,
          writeOffReason: plan.at === 'scrapped' ? 'scratch' : null,
        })
        .run();
      trayStatesRepository.insert(tx, {
        trayId: id,
        kind: 'tray',
        phase,
        stepSeq,
        stationKind: stepSeq ? PACKING_ROUTING[stepSeq - 1].stationKind : null,
        quantity: plan.quantity,
        stationId: null,
        startedAt: null,
        waitingSince: t,
        cureReadyAt: null,
        onHold: !!plan.onHold,
        holdReason: null,
        releasedAt: t,
        lastEventAt: t,
        updatedAt: t,
      });
      out.trays.push({ id, number: trayNumber });
    });
  });
  return out;
}

/** Writes the finish of a tray's dispatch step (as an accepted scan) and marks the tray done. */
export function finishDispatch(deps: Pick<AppDeps, 'db'>, trayId: string, at: number, quantity?: number) {
  const state = trayStatesRepository.byTrayId(deps.db, trayId)!;
  const qty = quantity ?? state.quantity;
  deps.db.transaction((tx) => {
    trayStatesRepository.insertEvents(tx, [
      {
        id: crypto.randomUUID(),
        trayId,
        type: 'start',
        stepSeq: SEQ.dispatch,
        stationKind: 'dispatch',
        occurredAt: at - 60_000,
        receivedAt: at - 60_000,
        qtyIn: qty,
      },
      {
        id: crypto.randomUUID(),
        trayId,
        type: 'finish',
        stepSeq: SEQ.dispatch,
        stationKind: 'dispatch',
        occurredAt: at,
        receivedAt: at + 1000,
        qtyIn: qty,
        goodQty: qty,
        scrapQty: 0,
      },
    ]);
    trayStatesRepository.patch(tx, trayId, { phase: 'done', stepSeq: null, stationKind: null, quantity: qty, lastEventAt: at, updatedAt: at });
  });
}

/** Moves a tray to another step (as the scan service would after a finish). */
export function moveTray(deps: Pick<AppDeps, 'db'>, trayId: string, stepSeq: number, quantity?: number) {
  trayStatesRepository.patch(deps.db, trayId, {
    phase: 'waiting',
    stepSeq,
    stationKind: PACKING_ROUTING[stepSeq - 1].stationKind,
    ...(quantity != null ? { quantity } : {}),
    updatedAt: Date.now(),
  });
}

/** A proof revision stored in the file store, as the proofs upload stores it. */
export function insertProof(deps: Pick<AppDeps, 'db' | 'env'>, orderId: string, revision: number, content: Buffer, mime: string, uploadedBy: string) {
  const { hash, sizeBytes } = putFile(deps.env.dataDir, content);
  deps.db
    .insert(proofs)
    .values({
      id: crypto.randomUUID(),
      orderId,
      revision,
      fileHash: hash,
      mime,
      sizeBytes,
      originalName: `proof-${revision}`,
      uploadedBy,
      uploadedAt: Date.now(),
    })
    .run();
  return hash;
}
