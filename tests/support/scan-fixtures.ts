// Factories for scan tests: travellers on the floor, paired tablets, badge sign-ins.
import crypto from 'node:crypto';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import type { AppDeps } from '../../server/app-deps';
import type { DbLike } from '../../server/db/client';
import { customers } from '../../server/db/schema/customers';
import { orders, orderSteps } from '../../server/db/schema/orders';
import { trays } from '../../server/db/schema/trays';
import { rowFromState, trayStatesRepository } from '../../server/repositories/tray-states.repository';
import { moulds, orderMoulds } from '../../server/db/schema/moulds';
import { devicesService } from '../../server/services/devices.service';
import { usersService } from '../../server/services/users.service';
import { stationsRepository } from '../../server/repositories/stations.repository';
import { makeTravellerCode } from '@shared/domain/traveller-code';
import { initialTrayState, type Role, type RoutingStep, type StationKind } from '@shared/domain/vocabulary';
import type { TestApp } from './test-app';
import { DEFAULT_ROUTING_TEMPLATES, expandRouting } from '@shared/domain/routing';
import { releasedQuantity, splitIntoTrays } from '@shared/domain/trays';
import { planOrders } from '../../server/seed/demo-catalogue';
import { makeRng } from '../../server/seed/prng';

const step = (seq: number, name: string, stationKind: StationKind, cureMinutes?: number, colour?: number): RoutingStep => ({
  seq,
  name,
  stationKind,
  trayMinutes: 5,
  pieceMinutes: 0.05,
  cureMinutes: cureMinutes ?? null,
  colour: colour ?? null,
});

/** Two-colour hard enamel, cut short after plating; 120 min per colour cure (common practice: 2 h or more). */
export const TWO_COLOUR_ROUTING: RoutingStep[] = [
  step(1, 'Die striking', 'strike'),
  step(2, 'Trimming', 'trim'),
  step(3, 'Post fitting', 'post'),
  step(4, 'Colour 1 of 2: fill', 'fill', undefined, 1),
  step(5, 'Colour 1 of 2: cure', 'cure', 120, 1),
  step(6, 'Colour 2 of 2: fill', 'fill', undefined, 2),
  step(7, 'Colour 2 of 2: cure', 'cure', 120, 2),
  step(8, 'Stoning', 'stone'),
  step(9, 'Polishing', 'polish'),
  step(10, 'Plating', 'plate'),
];

export interface FloorTray {
  id: string;
  number: string;
  code: string;
  quantity: number;
}

let orderCounter = 0;

/** An order already released to the floor, with its travellers waiting for their first step. */
export function insertFloorOrder(
  deps: Pick<AppDeps, 'db' | 'keys'>,
  options: {
    trays?: number;
    quantity?: number;
    releasedAt: number;
    routing?: RoutingStep[];
    /** a mould the order needs: absent (none), ready, or still being engraved */
    mould?: 'ready' | 'engraving';
    /** where each tray stands, when not at step 1 */
    stepSeq?: number;
    db?: DbLike;
  },
): { orderId: string; number: string; trays: FloorTray[] } {
  const db = options.db ?? deps.db;
  const routing = options.routing ?? TWO_COLOUR_ROUTING;
  const count = options.trays ?? 1;
  const quantity = options.quantity ?? 100;
  orderCounter += 1;
  const number = `${7000 + orderCounter}${crypto.randomInt(10, 99)}`;
  const orderId = crypto.randomUUID();
  const customerId = crypto.randomUUID();
  const t = options.releasedAt;
  const out: FloorTray[] = [];
  db.transaction((tx) => {
    tx.insert(customers)
      .values({ id: customerId, name: `Invented Rowing Club ${number}`, createdAt: t, updatedAt: t })
      .run();
    tx.insert(orders)
      .values({
        id: orderId,
        number,
        customerId,
        title: 'Club crest with crossed oars',
        process: 'hard_enamel',
        material: 'iron',
        sizeMm: 25,
        quantity: count * quantity,
        colours: [
          { name: 'Navy', hex: '#1b2a4a' },
          { name: 'White', hex: '#ffffff' },
        ],
        plating: 'gold',
        backingType: 'butterfly_clutch',
        packaging: 'individual_bag',
        dueDate: '2099-01-01',
        status: 'released',
        designKey: `design-${number}`,
        releasedAt: t,
        createdAt: t,
        updatedAt: t,
      })
      .run();
    for (const s of routing) {
      tx.insert(orderSteps)
        .values({
          id: crypto.randomUUID(),
          orderId,
          travellerKind: 'tray',
          seq: s.seq,
          name: s.name,
          stationKind: s.stationKind,
          trayMinutes: s.trayMinutes,
          pieceMinutes: s.pieceMinutes,
          cureMinutes: s.cureMinutes ?? null,
          colour: s.colour ?? null,
        })
        .run();
    }
    if (options.mould) {
      const mouldId = crypto.randomUUID();
      tx.insert(moulds)
        .values({ id: mouldId, number: `${number}-MF`, designKey: `design-${number}`, side: 'front', status: options.mould, createdAt: t, updatedAt: t })
        .run();
      tx.insert(orderMoulds).values({ orderId, mouldId }).run();
    }
    const seq = options.stepSeq ?? 1;
    for (let i = 1; i <= count; i++) {
      const trayNumber = `${number}-${String(i).padStart(3, '0')}`;
      const id = crypto.randomUUID();
      tx.insert(trays).values({ id, number: trayNumber, kind: 'tray', orderId, revision: 1, quantity, releasedAt: t, createdAt: t }).run();
      const released = new Date(t).toISOString();
      const state = { ...initialTrayState({ trayId: id, kind: 'tray', quantity, releasedAt: released }), stepSeq: seq, lastEventAt: released };
      trayStatesRepository.insert(tx, rowFromState(state, routing, t));
      out.push({ id, number: trayNumber, code: makeTravellerCode({ number: trayNumber, revision: 1 }, deps.keys.traveller), quantity });
    }
  });
  return { orderId, number, trays: out };
}

export function stationId(deps: Pick<AppDeps, 'db'>, code: string): string {
  const s = stationsRepository.byCode(deps.db, code);
  if (!s) throw new Error(`no station ${code} in the seed`);
  return s.id;
}

/** A tablet registered and paired with a station; requests carry its device token. */
export function pairTablet(t: TestApp, stationCode: string): { deviceId: string; token: string; stationId: string } {
  const sid = stationId(t.deps, stationCode);
  const created = devicesService.create(t.deps, { name: `Tablet ${stationCode}`, stationId: sid, locale: 'en', idleMinutes: 10 }, null);
  const paired = devicesService.pair(t.deps, created.pairingCode);
  return { deviceId: created.id, token: paired.token, stationId: sid };
}

/** A person with a badge and PIN. */
export async function insertBadgeUser(t: TestApp, role: Role, badge: string, pin: string) {
  const created = await usersService.create(
    t.deps,
    {
      name: `Badge ${badge}`,
      email: `${badge.toLowerCase()}-${crypto.randomUUID().slice(0, 6)}@test.trayce.local`,
      role,
      password: `pw-${crypto.randomUUID()}`,
      badge,
      pin,
    },
    null,
  );
  return { id: created.id, badge, pin };
}

/** A Supertest agent acting as the tablet, with that person signed in by badge and PIN. */
export async function tabletAgent(t: TestApp, token: string, person?: { badge: string; pin: string }): Promise<TestAgent> {
  const agent = request.agent(t.app).set('Authorization', `Device ${token}`);
  if (person) {
    const res = await agent.post('/api/auth/badge').send({ badge: person.badge, pin: person.pin });
    if (res.status !== 200) throw new Error(`badge sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  }
  return agent;
}

/** A scan event as a tablet makes it. */
export function scan(
  code: string,
  stationIdValue: string,
  type: 'start' | 'finish' | 'hold' | 'release',
  occurredAt: number,
  extra: Record<string, unknown> = {},
) {
  return { id: crypto.randomUUID(), code, stationId: stationIdValue, type, occurredAt: new Date(occurredAt).toISOString(), ...extra };
}

/**
 * A floor like the demo factory's: the demo catalogue's orders on the floor (every process, its
 * routing from the default templates, its tray sizes), released over the last days, each at a
 * random step of its routing. `seed` names the two seeded generators (`<seed>-orders`, `<seed>-floor`).
 */
export function insertDemoFloor(deps: AppDeps, now: number, seed: string, planned = 40) {
  const HOUR = 3_600_000;
  const rng = makeRng(`${seed}-floor`);
  const plans = planOrders(makeRng(`${seed}-orders`), now, planned).filter((p) => p.target === 'in_production' || p.target === 'released');
  for (const p of plans) {
    const routing = expandRouting(DEFAULT_ROUTING_TEMPLATES[p.process], p);
    const trays = splitIntoTrays(releasedQuantity(p.quantity, p.overrunPct), p.traySize);
    insertFloorOrder(deps, {
      trays: trays.length,
      quantity: p.traySize,
      releasedAt: now - rng.int(2, 120) * HOUR,
      routing,
      stepSeq: routing[rng.int(0, routing.length - 1)].seq,
    });
  }
}
