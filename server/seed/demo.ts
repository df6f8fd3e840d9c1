import { eq } from 'drizzle-orm';
import type { AppDeps } from '../app-deps';
import type { Tx } from '../db/client';
import { users } from '../db/schema/users';
import { calendarShifts, reasonCodes, settings } from '../db/schema/reference-data';
import { stations } from '../db/schema/stations';
import { devices } from '../db/schema/devices';
import { customers } from '../db/schema/customers';
import { orders } from '../db/schema/orders';
import { moulds } from '../db/schema/moulds';
import { trays } from '../db/schema/trays';
import { overrides, scanRejections } from '../db/schema/scans';
import { cartons, shipments } from '../db/schema/shipping';
import { hashSecret } from '../services/auth.service';
import { rowFromState, stateFromRow, trayStatesRepository } from '../repositories/tray-states.repository';
import { ordersService } from '../services/orders.service';
import { routingOf as routingOfOrder } from '../services/order-spec.service';
import { orderGatesService } from '../services/order-gates.service';
import { orderReleaseService } from '../services/order-release.service';
import { ordersRepository } from '../repositories/orders.repository';
import { auditRepository } from '../repositories/audit.repository';
import { randomToken, sha256Hex } from '../lib/keys';
import { orderSpecSchema } from '@shared/schemas/orders';
import { planCartons } from '@shared/domain/shipping';
import type { Process, Role, RoutingStep, StationKind } from '@shared/domain/vocabulary';
import { DEMO_FACTORY, DEMO_PASSWORD, DEMO_PEOPLE } from './demo-people';
import { DEMO_CREW, STATION_CREW } from './demo-crew';
import { planOrders, DEMO_CUSTOMERS, type OrderPlan } from './demo-catalogue';
import { demoProofPdf } from './demo-proof';
import { decodeUpload, type DecodedUpload } from '../lib/upload-decode';
import { makeRng } from './prng';
import { simulateFloor, type SimOrder, type SimTraveller } from './simulate-floor';
import { DEMO_SHIFTS, DEMO_WORKDAYS, HOUR, factoryDate, nextWorking } from './floor/demo-clock';
import { MINUTE } from '@shared/domain/calendar';
import { DAY } from '@shared/domain/time-zone';
import { kindTraits } from '@shared/domain/traveller';
import { calendarService } from '../services/calendar.service';

/** Weeks of floor history behind "now". */
export const DEMO_HISTORY_DAYS = 70;
export const DEMO_SEED = 'tallowmere-2026';

const HOLD_NOTE = 'Customer asked us to wait: artwork change under discussion';

const CARRIERS = [
  { name: 'Swiftlane Couriers', prefix: 'SL', trackingUrl: 'https://track.swiftlane.example/parcel/{number}' },
  { name: 'Harbourline Express', prefix: 'HX', trackingUrl: 'https://harbourline.example/track?id={number}' },
  { name: 'Kitefield Freight', prefix: 'KF', trackingUrl: 'https://kitefield.example/t/{number}' },
];

const UNIT_PRICE: Record<Process, number> = { hard_enamel: 1.35, soft_enamel: 0.95, die_struck: 1.1, printed: 0.85, die_cast_3d: 1.9 };

function insertMany<T>(tx: Tx, table: Parameters<Tx['insert']>[0], rows: T[], chunk = 200) {
  for (let i = 0; i < rows.length; i += chunk) {
    tx.insert(table)
      .values(rows.slice(i, i + chunk) as any)
      .run();
  }
}

export interface DemoSeedOptions {
  seed?: string;
}

/**
 * The invented demo factory: its people, customers and orders, and ten weeks of floor history
 * made by simulating the floor through the product's own scan guards. The same seed and the
 * same "now" give the same factory.
 *
 * Orders, payments, proofs, releases and scans are written here directly through Drizzle, with
 * the same domain functions the services use (routing expansion, tray split, traveller numbers,
 * scan guards), in one transaction.
 */
export async function seedDemo(deps: AppDeps, options: DemoSeedOptions = {}): Promise<void> {
  const { db } = deps;
  const now = deps.now();
  const t0 = Date.now();
  const lap = (what: string) => deps.log.debug({ ms: Date.now() - t0 }, `demo seed: ${what}`);
  const rng = makeRng(options.seed ?? DEMO_SEED);
  const ids = rng.fork('ids');
  const passwordHash = await hashSecret(DEMO_PASSWORD);
  const everyone = [...DEMO_PEOPLE, ...DEMO_CREW];
  const pinHashes = new Map(await Promise.all(everyone.filter((p) => p.pin).map(async (p) => [p.email, await hashSecret(p.pin!)] as const)));

  db.transaction((tx) => {
    tx.insert(settings)
      .values({ key: 'factory', value: { name: DEMO_FACTORY.name, timeZone: DEMO_FACTORY.timeZone } })
      .onConflictDoUpdate({ target: settings.key, set: { value: { name: DEMO_FACTORY.name, timeZone: DEMO_FACTORY.timeZone } } })
      .run();
    // the demo factory's (invented) carriers and their public tracking pages
    const carriers = CARRIERS.map((c) => ({ name: c.name, trackingUrl: c.trackingUrl }));
    tx.insert(settings)
      .values({ key: 'carriers', value: carriers })
      .onConflictDoUpdate({ target: settings.key, set: { value: carriers } })
      .run();
    for (const p of everyone) {
      tx.insert(users)
        .values({
          id: ids.uuid(),
          name: p.name,
          email: p.email,
          role: p.role,
          passwordHash,
          locale: p.locale ?? 'en',
          badge: p.badge ?? null,
          pinHash: pinHashes.get(p.email) ?? null,
          createdAt: now - (DEMO_HISTORY_DAYS + 14) * DAY,
          updatedAt: now - (DEMO_HISTORY_DAYS + 14) * DAY,
        })
        .onConflictDoNothing()
        .run();
    }
  });

  lap('people');
  const people = db.select({ id: users.id, email: users.email, role: users.role }).from(users).all();
  const userId = new Map(people.map((p) => [p.email, p.id]));
  const roleOf = new Map<string, Role>(people.map((p) => [p.id, p.role]));
  const who = (email: string) => {
    const id = userId.get(email);
    if (!id) throw new Error(`demo person missing: ${email}`);
    return id;
  };
  const planner = who('planner@tallowmere.test');
  const manager = who('manager@tallowmere.test');
  const sales = who('sales@tallowmere.test');
  const supervisors = DEMO_PEOPLE.filter((p) => p.role === 'supervisor').map((p) => who(p.email));

  const stationRows = db.select().from(stations).all();
  const reasonRows = db.select().from(reasonCodes).all();

  // One tablet per station (tokens are random and never shown: pair a real tablet from the admin screens).
  const deviceRows = stationRows.map((s) => ({
    id: ids.uuid(),
    name: `${s.name} tablet`,
    kind: 'tablet' as const,
    stationId: s.id,
    tokenHash: sha256Hex(randomToken()),
    // the colour, plating and press benches run their tablets in Chinese
    locale: ['FIL', 'OVN', 'PLT', 'STN', 'POL', 'STR', 'CST'].includes(s.code.slice(0, 3)) ? 'zh' : 'en',
    createdAt: now - (DEMO_HISTORY_DAYS + 7) * DAY,
    updatedAt: now,
    lastSeenAt: now - ids.int(1, 90) * MINUTE,
    clockOffsetMs: ids.int(-2500, 2500),
  }));
  const deviceOf = new Map(deviceRows.map((d) => [d.stationId, d.id]));
  // and the supervisors' wall display (read-only, no station)
  const wallDevice = {
    id: ids.uuid(),
    name: 'Floor wall display',
    kind: 'wall' as const,
    stationId: null,
    tokenHash: sha256Hex(randomToken()),
    locale: 'en',
    createdAt: now - (DEMO_HISTORY_DAYS + 7) * DAY,
    updatedAt: now,
    lastSeenAt: now - MINUTE,
  };

  // ---- the order book, entered through the orders service ---------------------------------
  const plans = planOrders(rng.fork('orders'), now, DEMO_HISTORY_DAYS);
  const customerIds = new Map(DEMO_CUSTOMERS.map((c) => [c.name, ids.uuid()]));
  // customers first, with their contacts; the service finds them by name
  db.transaction((tx) =>
    insertMany(
      tx,
      customers,
      DEMO_CUSTOMERS.map((c) => ({
        id: customerIds.get(c.name)!,
        name: c.name,
        contactName: c.contactName,
        contactEmail: c.contactEmail,
        createdAt: now - (DEMO_HISTORY_DAYS + 30) * DAY,
        updatedAt: now - (DEMO_HISTORY_DAYS + 30) * DAY,
      })),
    ),
  );
  const at = (t: number): AppDeps => ({ ...deps, now: () => Math.round(t) });
  const orderIds = new Map<OrderPlan, string>();
  const simOrders: SimOrder[] = [];
  const simTravellers: SimTraveller[] = [];
  const routingOf = new Map<string, RoutingStep[]>();

  const stageAt = (plan: OrderPlan) => {
    // office steps between entry and release, in office hours
    const end = plan.releasedAt ?? now;
    const span = Math.max(HOUR, end - plan.createdAt);
    const stamp = (f: number) => Math.min(end - 10 * MINUTE, Math.max(plan.createdAt + MINUTE, nextWorking(plan.createdAt + span * f)));
    return { proof1: stamp(0.15), paid: stamp(0.3), proof2: stamp(0.5), approved: stamp(0.8) };
  };

  // releases happen in office hours
  for (const plan of plans) {
    if (plan.releasedAt == null) continue;
    const r = nextWorking(plan.releasedAt);
    if (r <= now - 10 * MINUTE) plan.releasedAt = r;
  }

  // Proof files first (drawing a PDF is asynchronous); then the office work in one transaction.
  const proofPdfs = new Map<OrderPlan, { pdf: Buffer; decoded: DecodedUpload }[]>();
  for (const plan of plans) {
    const released = plan.releasedAt != null;
    const approved = released || plan.target === 'draft';
    const uploaded = approved || plan.target === 'awaiting_proof' || (plan.target === 'awaiting_payment' && ids.chance(0.6));
    if (!uploaded) continue;
    const revisions = ids.chance(0.2) ? 2 : 1;
    const st = stageAt(plan);
    const files: { pdf: Buffer; decoded: DecodedUpload }[] = [];
    for (let rev = 1; rev <= revisions; rev++) {
      const pdf = await demoProofPdf({
        number: plan.number,
        customer: plan.customer.name,
        title: plan.title,
        process: plan.process,
        sizeMm: plan.sizeMm,
        plating: plan.plating,
        colours: plan.colours,
        backLogo: plan.backLogo,
        revision: rev,
        createdAt: rev === 1 ? st.proof1 : st.proof2,
      });
      // checked and drawn to a thumbnail exactly as an uploaded proof is
      files.push({ pdf, decoded: await decodeUpload(pdf, `proof-${plan.number}-r${rev}.pdf`, ['application/pdf']) });
    }
    proofPdfs.set(plan, files);
  }

  db.transaction(() => {
    for (const plan of plans) {
      const released = plan.releasedAt != null;
      const provisionalDue = factoryDate((plan.releasedAt ?? plan.createdAt) + 14 * DAY);
      const spec = orderSpecSchema.parse({
        customer: plan.customer.name,
        title: plan.title,
        productType: plan.productType,
        process: plan.process,
        material: plan.material,
        sizeMm: plan.sizeMm,
        quantity: plan.quantity,
        overrunPct: plan.overrunPct,
        colours: plan.colours,
        plating: plan.plating,
        backing: plan.backing,
        backLogo: plan.backLogo,
        printing: plan.printing,
        epoxy: plan.epoxy,
        sandblast: plan.sandblast,
        secondPlating: plan.secondPlating,
        packaging: plan.packaging,
        dueDate: provisionalDue,
        notes: plan.target === 'packed' ? 'Customer collects at the gate with their next order.' : plan.notes,
        ...(plan.reorderOf ? { reorderOf: orderIds.get(plan.reorderOf) } : {}),
      });
      const orderId = ordersService.createInTx(at(plan.createdAt), db, spec, planner);
      orderIds.set(plan, orderId);
      const entered = ordersRepository.byId(db, orderId)!;
      if (entered.number !== plan.number) throw new Error(`demo order ${plan.number} was numbered ${entered.number}`);
      const st = stageAt(plan);

      // gates: payment (or a manager's exception) and an approved proof revision
      const paid = released || plan.target === 'awaiting_proof' || plan.target === 'draft';
      const proofApproved = released || plan.target === 'draft';
      const pdfs = proofPdfs.get(plan) ?? [];
      if (pdfs.length) {
        pdfs.forEach(({ pdf, decoded }, i) => {
          orderGatesService.storeProof(
            at(i === 0 ? st.proof1 : st.proof2),
            orderId,
            { buffer: pdf, name: `proof-${plan.number}-r${i + 1}.pdf`, decoded },
            planner,
          );
        });
        if (proofApproved) {
          orderGatesService.approveProof(at(st.approved), orderId, pdfs.length, { note: `Approved by ${plan.customer.contactName} by e-mail` }, planner);
        }
      }
      if (paid) {
        const exception = released && plan.target === 'in_production' && plan.number.endsWith('7');
        if (exception) {
          orderGatesService.recordPayment(
            at(st.paid),
            orderId,
            { exception: true, reason: 'Long-standing customer on 30-day terms' },
            { id: manager, role: 'manager' },
          );
        } else {
          const amount = Math.round(plan.quantity * UNIT_PRICE[plan.process] * (1 + plan.colours.length * 0.08) * 100) / 100;
          orderGatesService.recordPayment(at(st.paid), orderId, { amount, reference: `BANK-${ids.int(100000, 999999)}` }, { id: planner, role: 'planner' });
        }
      }
      if (released) {
        orderReleaseService.release(at(plan.releasedAt!), orderId, { traySize: plan.traySize }, planner);
        const holdAt = plan.target === 'on_hold' ? Math.min(now - HOUR, nextWorking(now - ids.int(18, 36) * HOUR)) : null;
        simOrders.push({
          id: orderId,
          releasedAt: plan.releasedAt!,
          startsOnFloor: plan.target !== 'released',
          holdAt,
          holdNote: holdAt ? HOLD_NOTE : null,
          keepFromCourier: plan.target === 'packed',
        });
        const trayRoutes = { tray: routingOfOrder(db, orderId, 'tray'), mould: routingOfOrder(db, orderId, 'mould') };
        const travellers = db.select().from(trays).where(eq(trays.orderId, orderId)).all();
        travellers.sort((x, y) => (x.kind === y.kind ? x.number.localeCompare(y.number) : x.kind === 'mould' ? -1 : 1));
        for (const t of travellers) {
          const row = trayStatesRepository.byTrayId(db, t.id)!;
          const routing = trayRoutes[t.kind];
          routingOf.set(t.id, routing);
          simTravellers.push({
            id: t.id,
            number: t.number,
            kind: t.kind,
            orderId,
            mouldId: t.mouldId,
            quantity: t.quantity,
            releasedAt: t.releasedAt,
            routing,
            initial: stateFromRow(row),
          });
        }
      }
    }
  });
  lap('order book');
  // ---- the floor ------------------------------------------------------------------------
  const simStations = stationRows
    .filter((s) => s.active)
    .map((s) => ({ id: s.id, code: s.code, name: s.name, kind: s.kind as StationKind, capacity: s.capacityTrays, deviceId: deviceOf.get(s.id)! }));
  const operatorsByKind: Partial<Record<StationKind, string[]>> = {};
  for (const [kind, emails] of Object.entries(STATION_CREW)) operatorsByKind[kind as StationKind] = emails.map(who);
  const sim = simulateFloor({
    rng: rng.fork('floor'),
    now,
    stations: simStations,
    people: { operatorsByKind, supervisors, roleOf },
    orders: simOrders,
    travellers: simTravellers,
    reasonCodes: reasonRows.map((r) => ({ code: r.code, kind: r.kind, stationKind: (r.stationKind as StationKind | null) ?? null })),
  });

  lap('floor simulated');
  // ---- order states from what happened on the floor (written directly: no service moves
  // an order through production in bulk; the same rules as the shipping service's status sync)
  const orderRows = db.select().from(orders).all();
  const planOf = new Map([...orderIds].map(([p, id]) => [id, p]));
  const travellersOf = new Map<string, SimTraveller[]>();
  for (const t of simTravellers) travellersOf.set(t.orderId, [...(travellersOf.get(t.orderId) ?? []), t]);
  const lastEventOf = new Map<string, number>();
  for (const e of sim.events) lastEventOf.set(e.trayId, Math.max(lastEventOf.get(e.trayId) ?? 0, e.occurredAt));
  const shippedLeads: number[] = [];
  const shipmentRows: (typeof shipments.$inferInsert)[] = [];
  const cartonRows: (typeof cartons.$inferInsert)[] = [];
  const orderPatches = new Map<string, Partial<typeof orders.$inferInsert>>();
  const packer = who('zhou.lanfen@tallowmere.test');

  for (const o of orderRows) {
    const plan = planOf.get(o.id)!;
    const patch: Partial<typeof orders.$inferInsert> = { salesOwnerId: sales };
    orderPatches.set(o.id, patch);
    const list = travellersOf.get(o.id) ?? [];
    let last = o.updatedAt;
    for (const t of list) last = Math.max(last, lastEventOf.get(t.id) ?? 0);
    patch.updatedAt = last;
    if (o.releasedAt == null) {
      if (plan.target === 'cancelled') {
        patch.status = 'cancelled';
        patch.cancelledAt = Math.min(now - DAY, o.createdAt + ids.int(2, 9) * DAY);
        patch.notes = 'Cancelled: the customer’s event was postponed.';
        patch.updatedAt = patch.cancelledAt;
      }
      continue;
    }
    const trayList = list.filter((t) => t.kind === 'tray');
    const living = trayList.filter((t) => sim.states.get(t.id)!.phase !== 'scrapped');
    const goodPieces = living.reduce((sum, t) => sum + sim.states.get(t.id)!.quantity, 0);
    const allDone = living.length > 0 && living.every((t) => sim.states.get(t.id)!.phase === 'done');
    const allPacked = living.length > 0 && living.every((t) => sim.packedAt.has(t.id));
    const anyScan = list.some((t) => lastEventOf.has(t.id));
    if (allPacked) patch.packedAt = Math.max(...living.map((t) => sim.packedAt.get(t.id)!));
    if (plan.target === 'on_hold') {
      patch.status = 'on_hold';
      patch.holdReason = HOLD_NOTE;
    } else if (allDone) {
      patch.status = 'shipped';
      patch.shippedAt = Math.max(...living.map((t) => sim.finishedAt.get(t.id)!));
      shippedLeads.push(patch.shippedAt - o.releasedAt);
    } else if (allPacked) patch.status = 'packed';
    else if (anyScan) patch.status = 'in_production';

    if (patch.status === 'shipped' || patch.status === 'packed') {
      const perCarton = plan.packaging === 'gift_box' ? 100 : plan.packaging === 'backing_card' ? 250 : 500;
      const carrier = ids.pick(CARRIERS);
      const shipmentId = patch.status === 'shipped' ? ids.uuid() : null;
      if (shipmentId) {
        shipmentRows.push({
          id: shipmentId,
          orderId: o.id,
          number: 1,
          carrier: carrier.name,
          trackingNumber: `${carrier.prefix}${ids.int(1000, 9999)}${ids.int(100000, 999999)}`,
          pieces: goodPieces,
          shippedAt: patch.shippedAt!,
          createdBy: packer,
          createdAt: patch.shippedAt!,
        });
      }
      // Full cartons and one part carton; the weight is per carton (about 8 g a 25 mm pin, plus the box).
      const fill = planCartons(goodPieces, perCarton);
      for (const [count, pieces] of [
        [fill.full, perCarton],
        [fill.partPieces > 0 ? 1 : 0, fill.partPieces],
      ]) {
        if (count === 0) continue;
        cartonRows.push({
          id: ids.uuid(),
          orderId: o.id,
          shipmentId,
          count,
          piecesPerCarton: pieces,
          weightKg: Math.round((pieces * (plan.sizeMm / 25) * 0.008 + 0.3) * 10) / 10,
          createdBy: packer,
          createdAt: patch.packedAt ?? last,
        });
      }
    }
  }

  // Due dates as promised at order entry: the usual lead time plus some slack; a few promised
  // too tightly, so some orders shipped late and some on the floor are at risk.
  const sortedLeads = [...shippedLeads].sort((x, y) => x - y);
  const typicalLead = sortedLeads.length ? sortedLeads[Math.floor(sortedLeads.length / 2)] : 12 * DAY;
  const dues = rng.fork('due');
  for (const o of orderRows) {
    const patch = orderPatches.get(o.id)!;
    const base = o.releasedAt ?? Math.max(now, o.createdAt + 7 * DAY);
    let due: number;
    if (patch.shippedAt != null) {
      due = dues.chance(0.18) ? patch.shippedAt - dues.int(1, 4) * DAY : patch.shippedAt + dues.int(1, 6) * DAY;
    } else if (planOf.get(o.id)!.target === 'packed') {
      // packed and waiting to be collected: the customer's date is still ahead
      due = now + dues.int(2, 6) * DAY;
    } else {
      due = base + typicalLead + (dues.chance(0.25) ? -dues.int(2, 6) : dues.int(1, 7)) * DAY;
    }
    patch.dueDate = factoryDate(Math.max(due, o.createdAt + 5 * DAY));
  }

  // The mould library: each mould's state from its latest traveller.
  const mouldRows = db.select().from(moulds).all();
  const mouldPatches = new Map<string, Partial<typeof moulds.$inferInsert>>();
  for (const m of mouldRows) {
    const travellers = simTravellers.filter((t) => t.kind === 'mould' && t.mouldId === m.id);
    const latest = travellers[travellers.length - 1];
    const state = latest ? sim.states.get(latest.id) : undefined;
    const readyTimes = travellers.map((t) => sim.finishedAt.get(t.id)).filter((x): x is number => x != null);
    const step = state && latest ? latest.routing.find((r) => r.seq === state.stepSeq) : undefined;
    mouldPatches.set(m.id, {
      status: state?.phase === 'done' ? 'ready' : kindTraits(step?.stationKind).mouldShop === 'make' ? 'engraving' : 'checking',
      readyAt: readyTimes.length ? Math.min(...readyTimes) : null,
      storageLocation: readyTimes.length ? `Rack ${String.fromCharCode(65 + ids.int(0, 3))}-${String(ids.int(1, 24)).padStart(2, '0')}` : null,
      updatedAt: readyTimes.length ? Math.max(...readyTimes) : m.updatedAt,
    });
  }

  db.transaction((tx) => {
    insertMany(tx, devices, [...deviceRows, wallDevice]);
    const shiftRows: (typeof calendarShifts.$inferInsert)[] = [];
    for (const weekday of DEMO_WORKDAYS)
      for (const sh of DEMO_SHIFTS) shiftRows.push({ id: ids.uuid(), stationId: null, weekday, startMinute: sh.start, endMinute: sh.end });
    insertMany(tx, calendarShifts, shiftRows);
    for (const [id, patch] of orderPatches) tx.update(orders).set(patch).where(eq(orders.id, id)).run();
    for (const [id, patch] of mouldPatches) tx.update(moulds).set(patch).where(eq(moulds.id, id)).run();
    for (const t of simTravellers) {
      const state = sim.states.get(t.id)!;
      trayStatesRepository.put(tx, rowFromState(state, t.routing, Date.parse(state.lastEventAt ?? state.releasedAt)));
    }
    insertMany(tx, overrides, sim.overrides);
    for (const o of sim.overrides) {
      const used = sim.events.find((e) => e.id === o.usedEventId)!;
      auditRepository.record(tx, used.receivedAt, {
        userId: o.supervisorId,
        action: 'scan.override',
        entity: 'tray',
        entityId: o.trayId,
        detail: { eventId: o.usedEventId, overridden: [o.kind], reason: o.reason, operatorId: used.userId },
      });
    }
    trayStatesRepository.insertEvents(tx, sim.events);
    insertMany(
      tx,
      scanRejections,
      sim.rejections.map((r) => ({ ...r, resolvedAt: null, resolvedBy: null, resolution: null })),
    );
    insertMany(tx, shipments, shipmentRows);
    insertMany(tx, cartons, cartonRows);
  });
  // the shifts were written here, not through the calendar service: drop its compiled calendar
  calendarService.forget(deps);
  lap('written');
}
