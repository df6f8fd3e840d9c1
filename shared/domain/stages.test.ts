import { describe, expect, it } from 'vitest';
import type { RoutingStep, StationKind, TrayPhase } from './vocabulary';
import { STATION_KINDS } from './vocabulary';
import { CUSTOMER_STAGES, CUSTOMER_STAGE_NAMES, STAGE_OF_STATION_KIND, describeStage, orderStage, type TravellerProgress } from './stages';

type Step = Pick<RoutingStep, 'seq' | 'stationKind'>;

function routing(kinds: StationKind[]): Step[] {
  return kinds.map((stationKind, i) => ({ seq: i + 1, stationKind }));
}

// Hard enamel order of steps (product brief, trade facts, common practice): posts fitted,
// colours filled and cured one at a time, ground flush, polished, plated, screen printed,
// inspected, clutches fitted, bagged, packed, shipped.
const HARD_ENAMEL: StationKind[] = [
  'strike',
  'trim',
  'post',
  'fill',
  'cure',
  'fill',
  'cure',
  'stone',
  'polish',
  'plate',
  'print',
  'inspect',
  'clutch',
  'bag',
  'pack',
  'dispatch',
];
// Soft enamel (product brief rule 2): plated first, then filled and cured.
const SOFT_ENAMEL: StationKind[] = ['strike', 'trim', 'post', 'plate', 'fill', 'fill', 'cure', 'epoxy', 'inspect', 'clutch', 'bag', 'pack', 'dispatch'];
const MOULD: StationKind[] = ['engrave', 'mould_check'];

function tray(kinds: StationKind[], stepSeq: number | null, phase: TrayPhase = 'waiting'): TravellerProgress {
  return { kind: 'tray', phase: stepSeq === null ? 'done' : phase, stepSeq, routing: routing(kinds) };
}

describe('customer stages', () => {
  it('has the seven stages of the status page, in order', () => {
    expect(CUSTOMER_STAGES.map((s) => CUSTOMER_STAGE_NAMES[s])).toEqual([
      'Artwork and moulds',
      'Metal forming',
      'Colour',
      'Finishing and plating',
      'Inspection',
      'Packing',
      'Shipped',
    ]);
  });

  it('places every station kind in a stage', () => {
    for (const k of STATION_KINDS) expect(CUSTOMER_STAGES).toContain(STAGE_OF_STATION_KIND[k]);
  });

  it('follows the hard enamel routing step by step and visits every stage in order (common practice order of steps)', () => {
    const seen: string[] = [];
    for (let seq = 1; seq <= HARD_ENAMEL.length; seq++) {
      const s = orderStage({ status: 'in_production', travellers: [tray(HARD_ENAMEL, seq)] });
      if (seen[seen.length - 1] !== s.stage) seen.push(s.stage as string);
    }
    expect(seen).toEqual(['metal_forming', 'colour', 'finishing_plating', 'inspection', 'packing']);
  });

  it('never moves backwards on soft enamel, where plating comes before the colours (product rule 2)', () => {
    let last = -1;
    for (let seq = 1; seq <= SOFT_ENAMEL.length; seq++) {
      const s = orderStage({ status: 'in_production', travellers: [tray(SOFT_ENAMEL, seq)] });
      const i = CUSTOMER_STAGES.indexOf(s.stage!);
      expect(i).toBeGreaterThanOrEqual(last);
      last = i;
    }
    // While the tray is at plating, the colours are still to come: the order is at colour.
    expect(orderStage({ status: 'in_production', travellers: [tray(SOFT_ENAMEL, 4)] }).stage).toBe('colour');
    // After the last cure, epoxy is finishing.
    expect(orderStage({ status: 'in_production', travellers: [tray(SOFT_ENAMEL, 8)] }).stage).toBe('finishing_plating');
  });

  it('is at the stage of the least advanced traveller, moulds included', () => {
    const travellers: TravellerProgress[] = [
      { kind: 'mould', phase: 'in_process', stepSeq: 2, routing: routing(MOULD) },
      tray(HARD_ENAMEL, 1),
      tray(HARD_ENAMEL, 1),
    ];
    const s = orderStage({ status: 'released', travellers });
    expect(s.stage).toBe('artwork_moulds');
    expect(s.stages.filter((x) => x.done)).toEqual([]);
    travellers[0] = { ...travellers[0], phase: 'done', stepSeq: null };
    travellers[1] = tray(HARD_ENAMEL, 12); // at inspection
    const t = orderStage({ status: 'in_production', travellers });
    expect(t.stage).toBe('metal_forming');
    expect(t.stages.map((x) => x.done)).toEqual([true, false, false, false, false, false, false]);
  });

  it('ignores trays written off or merged into another', () => {
    const s = orderStage({
      status: 'in_production',
      travellers: [{ ...tray(HARD_ENAMEL, 2), phase: 'scrapped' }, { ...tray(HARD_ENAMEL, 3), phase: 'merged' }, tray(HARD_ENAMEL, 12)],
    });
    expect(s.stage).toBe('inspection');
    expect(s.stages.filter((x) => x.done).map((x) => x.name)).toEqual(['Artwork and moulds', 'Metal forming', 'Colour', 'Finishing and plating']);
  });

  it('before release the order is at artwork and moulds', () => {
    for (const status of ['draft', 'awaiting_payment', 'awaiting_proof'] as const) {
      expect(orderStage({ status, travellers: [] }).stage).toBe('artwork_moulds');
    }
  });

  it('marks shipped done only for a shipped order; every tray dispatched but status not yet updated stays at packing', () => {
    const all = orderStage({ status: 'shipped', travellers: [tray(HARD_ENAMEL, null)] });
    expect(all.stage).toBe('shipped');
    expect(all.stages.every((x) => x.done)).toBe(true);
    const pending = orderStage({ status: 'packed', travellers: [tray(HARD_ENAMEL, null)] });
    expect(pending.stage).toBe('packing');
    expect(pending.stages.at(-1)).toEqual({ key: 'shipped', name: 'Shipped', done: false });
  });

  it('at the dispatch step the order is still packing', () => {
    const s = orderStage({ status: 'packed', travellers: [tray(HARD_ENAMEL, HARD_ENAMEL.length)] });
    expect(s.stage).toBe('packing');
    expect(s.stages.at(-2)!.done).toBe(false);
  });

  it('a cancelled order has no stage and nothing done', () => {
    const s = orderStage({ status: 'cancelled', travellers: [tray(HARD_ENAMEL, 5)] });
    expect(s.stage).toBeNull();
    expect(s.cancelled).toBe(true);
    expect(s.stages.some((x) => x.done)).toBe(false);
  });
});

describe('stage in plain words', () => {
  it('names the stage and where the trays stand', () => {
    const text = describeStage({
      status: 'in_production',
      travellers: [tray(HARD_ENAMEL, 4), tray(HARD_ENAMEL, 4), tray(HARD_ENAMEL, 5, 'curing'), tray(HARD_ENAMEL, 9), tray(HARD_ENAMEL, null)],
    });
    expect(text).toBe(
      'Colour: enamel colours are being filled and cured. 2 trays at colour fill, 1 tray at curing oven, 1 tray at polishing, 1 tray dispatched.',
    );
  });

  it('explains the gates before release', () => {
    expect(describeStage({ status: 'awaiting_proof', travellers: [] })).toMatch(/approve the artwork proof/);
    expect(describeStage({ status: 'awaiting_payment', travellers: [] })).toMatch(/payment/);
  });

  it('says when trays or the order are on hold', () => {
    const held = { ...tray(HARD_ENAMEL, 1), onHold: true };
    expect(describeStage({ status: 'in_production', travellers: [held, tray(HARD_ENAMEL, 1)] })).toBe(
      'Metal forming: the badges are being struck or cast from metal, trimmed and fitted with posts. 2 trays at die striking. 1 tray is on hold.',
    );
    expect(describeStage({ status: 'on_hold', travellers: [tray(HARD_ENAMEL, 1)] })).toMatch(/The order is on hold\.$/);
  });

  it('counts unfinished moulds', () => {
    const text = describeStage({
      status: 'released',
      travellers: [
        { kind: 'mould', phase: 'waiting', stepSeq: 1, routing: routing(MOULD) },
        { kind: 'mould', phase: 'done', stepSeq: null, routing: routing(MOULD) },
        tray(HARD_ENAMEL, 1),
      ],
    });
    expect(text).toBe('Artwork and moulds: the artwork proof and the moulds are being prepared. 1 tray at die striking, 1 mould in the making.');
  });
});
