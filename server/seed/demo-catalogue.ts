// The demo factory's invented customers and the orders they place. Everything here is made up:
// names, contacts, e-mail addresses (reserved `.test` domain) and designs.
import type { ColourSpec } from '../db/schema/orders';
import type { BackingType, Material, OrderStatus, Packaging, Plating, Process } from '@shared/domain/vocabulary';
import type { ProductType } from '@shared/schemas/orders';
import type { Rng } from './prng';

export interface DemoCustomer {
  name: string;
  contactName: string;
  contactEmail: string;
  /** what they order: shapes the titles */
  kind: 'club' | 'school' | 'event' | 'firm';
}

export const DEMO_CUSTOMERS: DemoCustomer[] = [
  { name: 'Harrowgate Rovers Football Club', contactName: 'Lena Thorsby', contactEmail: 'lena.thorsby@harrowgate-rovers.test', kind: 'club' },
  { name: 'Marlow Heath Primary School', contactName: 'Owen Pritchard-Lowe', contactEmail: 'office@marlowheath-primary.test', kind: 'school' },
  { name: 'Kestrel Valley Rowing Club', contactName: 'Saskia Imrie', contactEmail: 'captain@kestrelvalley-rowing.test', kind: 'club' },
  { name: 'Saltmarsh Folk Festival', contactName: 'Jory Penhallow', contactEmail: 'merch@saltmarsh-folk.test', kind: 'event' },
  { name: 'Brindle & Oake Surveyors', contactName: 'Hattie Brindle', contactEmail: 'hattie@brindle-oake.test', kind: 'firm' },
  { name: 'Northfold Cycling Association', contactName: 'Emeka Duarte', contactEmail: 'secretary@northfold-cycling.test', kind: 'club' },
  { name: "St Ambrel's Academy", contactName: 'Miriam Colquhoun', contactEmail: 'pta@st-ambrels.test', kind: 'school' },
  { name: 'Pellham Lantern Parade', contactName: 'Ravi Castellane', contactEmail: 'hello@pellham-lanterns.test', kind: 'event' },
  { name: 'Quillon Robotics Club', contactName: 'Ada Fenwright', contactEmail: 'team@quillon-robotics.test', kind: 'club' },
  { name: 'Tansy Lane Bakery Co.', contactName: 'Bram Olufemi', contactEmail: 'bram@tansylane-bakery.test', kind: 'firm' },
  { name: 'Ostrel Vale Chess Society', contactName: 'Greta Wyndham', contactEmail: 'greta@ostrelvale-chess.test', kind: 'club' },
  { name: 'Moorcombe Fell Marathon', contactName: 'Niamh Okafor', contactEmail: 'race@moorcombe-fell.test', kind: 'event' },
];

/** Enamel colours with swatches (our own names; the customer's reference code goes in `ref`). */
export const DEMO_COLOURS: Required<Pick<ColourSpec, 'name' | 'hex'>>[] = [
  { name: 'Signal red', hex: '#C8102E' },
  { name: 'Navy', hex: '#1B2A4A' },
  { name: 'Sky blue', hex: '#5BA4D9' },
  { name: 'Leaf green', hex: '#3A7D44' },
  { name: 'Sunflower yellow', hex: '#F2C230' },
  { name: 'White', hex: '#FFFFFF' },
  { name: 'Black', hex: '#1A1A1A' },
  { name: 'Tangerine', hex: '#E8772E' },
  { name: 'Plum', hex: '#6A3D9A' },
  { name: 'Blossom pink', hex: '#E88BB0' },
  { name: 'Teal', hex: '#1F8A8A' },
  { name: 'Maroon', hex: '#7A1F2B' },
  { name: 'Slate grey', hex: '#6E7781' },
  { name: 'Cream', hex: '#F3E9D2' },
  { name: 'Royal blue', hex: '#2750A8' },
  { name: 'Chestnut', hex: '#7B4B2A' },
];

const TITLES: Record<DemoCustomer['kind'], string[]> = {
  club: ['Crest pin', 'Members badge', 'Anniversary pin', 'Season pin', 'Volunteer badge', 'Trophy medal', 'Captain badge'],
  school: ['House badges', 'Prefect badge', 'Sports day medal', 'Reading award pin', 'Leavers pin'],
  event: ['Festival pin', 'Finisher medal', 'Crew badge', 'Souvenir coin', 'Sponsor pin'],
  firm: ['Logo pin', 'Long-service badge', 'Staff name badge', 'Anniversary coin', 'Key ring'],
};

export interface OrderPlan {
  number: string;
  customer: DemoCustomer;
  title: string;
  productType: ProductType;
  process: Process;
  material: Material;
  sizeMm: number;
  quantity: number;
  overrunPct: number;
  colours: ColourSpec[];
  plating: Plating;
  backing: { type: BackingType; count: number };
  backLogo: boolean;
  printing: boolean;
  epoxy: boolean;
  secondPlating: Plating | null;
  sandblast: boolean;
  packaging: Packaging;
  notes: string;
  designKey: string;
  /** the order whose moulds this reorder reuses */
  reorderOf: OrderPlan | null;
  traySize: number;
  /** what the planner is aiming at; the floor decides the rest */
  target: OrderStatus;
  createdAt: number;
  /** release to the floor (null: not released) */
  releasedAt: number | null;
}

const QUANTITIES = [100, 200, 250, 300, 400, 500, 500, 600, 750, 800, 1000, 1000, 1200, 1500, 1500, 2000, 2500, 3000];

function pickWeighted<T>(rng: Rng, items: readonly (readonly [T, number])[]): T {
  const total = items.reduce((s, [, w]) => s + w, 0);
  let x = rng.next() * total;
  for (const [v, w] of items) {
    x -= w;
    if (x < 0) return v;
  }
  return items[items.length - 1][0];
}

function pickColours(rng: Rng, n: number): ColourSpec[] {
  const pool = [...DEMO_COLOURS];
  const out: ColourSpec[] = [];
  for (let i = 0; i < n && pool.length; i++) {
    const c = pool.splice(rng.int(0, pool.length - 1), 1)[0];
    out.push(rng.chance(0.4) ? { name: c.name, hex: c.hex, ref: `CR-${rng.int(100, 999)}` } : { name: c.name, hex: c.hex });
  }
  return out;
}

function processSpec(rng: Rng, process: Process) {
  switch (process) {
    case 'hard_enamel':
      return {
        material: pickWeighted<Material>(rng, [
          ['iron', 3],
          ['copper', 2],
          ['brass', 1],
        ]),
        colours: pickColours(
          rng,
          pickWeighted(rng, [
            [1, 1],
            [2, 3],
            [3, 4],
            [4, 3],
            [5, 2],
            [6, 1],
          ]),
        ),
        plating: pickWeighted<Plating>(rng, [
          ['gold', 4],
          ['silver', 3],
          ['black_nickel', 2],
          ['nickel', 1],
          ['rainbow', 1],
          ['dyed', 1],
        ]),
        printing: rng.chance(0.15),
        epoxy: false,
      };
    case 'soft_enamel':
      return {
        material: 'iron' as Material,
        colours: pickColours(
          rng,
          pickWeighted(rng, [
            [2, 2],
            [3, 3],
            [4, 3],
            [5, 2],
            [6, 1],
            [7, 1],
            [8, 1],
          ]),
        ),
        plating: pickWeighted<Plating>(rng, [
          ['gold', 3],
          ['silver', 3],
          ['black_nickel', 2],
          ['copper', 1],
        ]),
        printing: rng.chance(0.2),
        epoxy: rng.chance(0.35),
      };
    case 'die_struck':
      return {
        material: pickWeighted<Material>(rng, [
          ['brass', 2],
          ['copper', 2],
          ['iron', 1],
        ]),
        colours: [] as ColourSpec[],
        plating: pickWeighted<Plating>(rng, [
          ['antique_gold', 2],
          ['antique_silver', 2],
          ['antique_bronze', 2],
          ['antique_copper', 1],
        ]),
        printing: false,
        epoxy: false,
      };
    case 'printed':
      return {
        material: pickWeighted<Material>(rng, [
          ['iron', 2],
          ['brass', 1],
        ]),
        colours: pickColours(rng, rng.int(3, 8)),
        plating: pickWeighted<Plating>(rng, [
          ['gold', 2],
          ['silver', 2],
          ['nickel', 1],
        ]),
        printing: true,
        epoxy: true,
      };
    case 'die_cast_3d':
      return {
        material: 'zinc_alloy' as Material,
        colours: pickColours(rng, rng.int(1, 5)),
        plating: pickWeighted<Plating>(rng, [
          ['antique_gold', 2],
          ['antique_silver', 2],
          ['gold', 1],
          ['antique_bronze', 1],
        ]),
        printing: false,
        epoxy: rng.chance(0.15),
      };
  }
}

const DAY = 86_400_000;
const HOUR = 3_600_000;

/** How many orders end up aiming at each status (the floor may move a few on). */
const TARGETS: [OrderStatus, number][] = [
  ['shipped', 30],
  ['in_production', 17],
  ['packed', 3],
  ['released', 2],
  ['on_hold', 2],
  ['awaiting_proof', 3],
  ['awaiting_payment', 3],
  ['draft', 3],
  ['cancelled', 2],
];

/** Every process appears; hard enamel is the bread and butter. */
const PROCESS_WEIGHTS: [Process, number][] = [
  ['hard_enamel', 40],
  ['soft_enamel', 24],
  ['die_struck', 12],
  ['printed', 10],
  ['die_cast_3d', 14],
];

/**
 * The order book: release times spread over the last `historyDays`, finished ones early,
 * those on the floor recent, the ones not yet released at the end. Reorders reuse a design
 * (and so its moulds) shipped earlier.
 */
export function planOrders(rng: Rng, nowMs: number, historyDays: number): OrderPlan[] {
  const targets: OrderStatus[] = [];
  for (const [status, n] of TARGETS) for (let i = 0; i < n; i++) targets.push(status);
  const plans: Omit<OrderPlan, 'number'>[] = [];
  const shippedCount = TARGETS[0][1];
  let shippedIndex = 0;
  let designNo = 0;
  const processCycle: Process[] = ['hard_enamel', 'soft_enamel', 'die_struck', 'printed', 'die_cast_3d'];
  targets.forEach((target, i) => {
    // the first few orders take each process once so every process is present
    const process = i < processCycle.length ? processCycle[i] : pickWeighted(rng, PROCESS_WEIGHTS);
    const customer = rng.pick(DEMO_CUSTOMERS);
    const spec = processSpec(rng, process);
    const quantity = rng.pick(QUANTITIES);
    const title = rng.pick(TITLES[customer.kind]);
    const productType: ProductType = /coin/i.test(title) ? 'coin' : /medal/i.test(title) ? 'medal' : /key ring/i.test(title) ? 'key_ring' : 'pin';
    const sizeMm =
      productType === 'coin'
        ? rng.pick([38, 40, 45, 50])
        : productType === 'medal'
          ? rng.pick([50, 55, 60])
          : process === 'die_cast_3d'
            ? rng.int(30, 50)
            : rng.pick([20, 22, 25, 25, 28, 30, 32, 35, 38, 45]);
    const traySize = sizeMm >= 40 ? rng.pick([50, 60, 80]) : sizeMm >= 30 ? rng.pick([80, 100, 120]) : rng.pick([100, 150, 200]);
    const backing: OrderPlan['backing'] =
      process === 'die_cast_3d' && rng.chance(0.3)
        ? { type: 'none', count: 0 }
        : {
            type: pickWeighted<BackingType>(rng, [
              ['butterfly_clutch', 6],
              ['rubber_clutch', 3],
              ['locking_clutch', 2],
              ['magnet', 1],
              ['safety_pin', 1],
              ['screw_nut', 1],
            ]),
            count: sizeMm >= 35 ? 2 : 1,
          };
    let releasedAt: number | null = null;
    let createdAt: number;
    switch (target) {
      case 'shipped': {
        const span = historyDays - 16;
        releasedAt = nowMs - (historyDays - 1) * DAY + (span * DAY * shippedIndex) / shippedCount + rng.int(0, 20) * HOUR;
        shippedIndex += 1;
        break;
      }
      case 'packed':
        releasedAt = nowMs - rng.int(14, 19) * DAY;
        break;
      case 'in_production':
        releasedAt = nowMs - rng.int(6, 190) * HOUR;
        break;
      case 'on_hold':
        releasedAt = nowMs - rng.int(50, 100) * HOUR;
        break;
      case 'released':
        releasedAt = nowMs - rng.int(30, 90) * 60_000;
        break;
      default:
        releasedAt = null;
    }
    if (releasedAt != null) {
      createdAt = releasedAt - rng.int(3, 9) * DAY - rng.int(0, 8) * HOUR;
    } else if (target === 'cancelled') {
      createdAt = nowMs - rng.int(20, 45) * DAY;
    } else {
      createdAt = nowMs - (target === 'draft' ? rng.int(2, 30) * HOUR : rng.int(1, 6) * DAY + rng.int(0, 8) * HOUR);
    }
    designNo += 1;
    plans.push({
      customer,
      title,
      productType,
      process,
      material: spec.material,
      sizeMm,
      quantity,
      overrunPct: rng.pick([3, 5, 5, 5, 8]),
      colours: spec.colours,
      plating: spec.plating,
      backing,
      // a printed badge is cut from a printed sheet: no struck back logo (the draw stays, so the rest of the demo is unchanged)
      backLogo: rng.chance(0.2) && process !== 'printed',
      printing: spec.printing,
      epoxy: spec.epoxy,
      // some die-struck designs have a sandblasted field, a few a second tone (fixed by design number, not drawn)
      sandblast: process === 'die_struck' && designNo % 3 === 0,
      secondPlating: process === 'die_struck' && designNo % 4 === 0 ? 'black_nickel' : null,
      packaging: pickWeighted<Packaging>(rng, [
        ['individual_bag', 5],
        ['bulk', 2],
        ['backing_card', 2],
        ['gift_box', 1],
      ]),
      notes: rng.chance(0.25)
        ? rng.pick([
            'Ship in one consignment.',
            'Check the colour order against the proof.',
            'Customer collects at the gate.',
            'Pack by house: one carton each.',
            'Repeat customer: match last year’s shade.',
          ])
        : '',
      designKey: `D-${String(designNo).padStart(4, '0')}`,
      reorderOf: null,
      traySize,
      target,
      createdAt,
      releasedAt,
    });
  });

  // Reorders: a later order of the same artwork reuses the stored moulds of an early one.
  const byRelease = plans.filter((p) => p.releasedAt != null).sort((a, b) => a.releasedAt! - b.releasedAt!);
  const early = byRelease.filter((p) => p.target === 'shipped' && p.process !== 'printed').slice(0, 8);
  const late = byRelease.filter((p) => p.releasedAt! > nowMs - 25 * DAY && p.target !== 'released');
  for (let k = 0; k < 4 && k < early.length && k < late.length; k++) {
    const original = early[k * 2] as OrderPlan;
    const re = late[late.length - 1 - k * 3];
    if (!original || !re || re === original) continue;
    Object.assign(re, {
      customer: original.customer,
      title: `${original.title} (reorder)`,
      productType: original.productType,
      process: original.process,
      material: original.material,
      sizeMm: original.sizeMm,
      colours: original.colours,
      plating: original.plating,
      backing: original.backing,
      backLogo: original.backLogo,
      printing: original.printing,
      epoxy: original.epoxy,
      sandblast: original.sandblast,
      secondPlating: original.secondPlating,
      traySize: original.traySize,
      designKey: original.designKey,
      reorderOf: original,
    });
  }

  const sorted = [...plans].sort((a, b) => a.createdAt - b.createdAt);
  return sorted.map((p, i) => Object.assign(p, { number: String(1001 + i) }) as OrderPlan);
}
