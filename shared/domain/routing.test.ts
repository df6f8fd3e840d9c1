import { describe, expect, it } from 'vitest';
import {
  DEFAULT_MOULD_TEMPLATE,
  DEFAULT_ROUTING_TEMPLATES,
  HARD_ENAMEL_CURE_MINUTES,
  expandRouting,
  mouldRouting,
  renumber,
  requiredMoulds,
  routingProblems,
  MOULD_USING_KINDS,
  mouldStepsFor,
  mouldTool,
  type RoutingSpec,
  type RoutingTemplate,
} from './routing';
import { ANTIQUE_PLATINGS, PROCESSES, STATION_KINDS, type Process, type RoutingStep, type StationKind } from './vocabulary';

function spec(process: Process, colours: number, extra: Partial<RoutingSpec> = {}): RoutingSpec {
  return {
    process,
    colours: Array.from({ length: colours }, (_, i) => ({ name: `C${i + 1}` })),
    backLogo: false,
    printing: false,
    epoxy: false,
    backing: { type: 'butterfly_clutch', count: 1 },
    plating: 'gold',
    secondPlating: null,
    sandblast: false,
    ...extra,
  };
}

const kinds = (steps: RoutingStep[]) => steps.map((s) => s.stationKind);
const idx = (steps: RoutingStep[], kind: StationKind) => steps.findIndex((s) => s.stationKind === kind);
const lastIdx = (steps: RoutingStep[], kind: StationKind) => steps.map((s) => s.stationKind).lastIndexOf(kind);
const route = (s: RoutingSpec) => expandRouting(DEFAULT_ROUTING_TEMPLATES[s.process], s);

const COLOUR_COUNTS = [1, 4, 8];

describe('expandRouting: every process, 1, 4 and 8 colours, back logo on and off', () => {
  for (const process of PROCESSES) {
    for (const n of COLOUR_COUNTS) {
      for (const backLogo of [false, true]) {
        it(`${process}, ${n} colour(s), back logo ${backLogo ? 'on' : 'off'}: well-formed`, () => {
          const steps = route(spec(process, n, { backLogo }));
          // seq is 1-based and contiguous
          expect(steps.map((s) => s.seq)).toEqual(steps.map((_, i) => i + 1));
          expect(routingProblems(steps)).toEqual([]);
          for (const s of steps) {
            expect(STATION_KINDS).toContain(s.stationKind);
            expect(s.trayMinutes).toBeGreaterThanOrEqual(0);
            expect(s.pieceMinutes).toBeGreaterThanOrEqual(0);
            if (s.stationKind === 'cure') expect(s.cureMinutes).toBeGreaterThan(0);
            else expect(s.cureMinutes ?? null).toBeNull();
          }
          // striking, or casting for 3D die-cast, comes first; printed blanks are plated first (common practice)
          expect(steps[0].stationKind).toBe(process === 'die_cast_3d' ? 'cast' : process === 'printed' ? 'plate' : 'strike');
          expect(kinds(steps)).not.toContain(process === 'die_cast_3d' ? 'strike' : 'cast');
          // the tail is the same for every process: inspect, clutches, bag, pack, dispatch (common practice)
          expect(kinds(steps).slice(-5)).toEqual(['inspect', 'clutch', 'bag', 'pack', 'dispatch']);
          // a back logo needs a back mould, not an extra tray step
          expect(steps).toEqual(route(spec(process, n, { backLogo: !backLogo })));
          expect(requiredMoulds({ backLogo })).toEqual(backLogo ? ['front', 'back'] : ['front']);
        });
      }
    }
  }
});

describe('hard enamel: one fill and cure per colour, then stone, polish, plate (common practice)', () => {
  for (const n of COLOUR_COUNTS) {
    it(`${n} colour(s): one fill and one cure per colour, cured before the next colour goes in`, () => {
      const steps = route(spec('hard_enamel', n));
      const colourSteps = steps.filter((s) => s.colour != null);
      expect(colourSteps).toHaveLength(2 * n);
      for (let i = 1; i <= n; i++) {
        const fill = steps.findIndex((s) => s.name === `Colour ${i} of ${n}: fill`);
        const cure = steps.findIndex((s) => s.name === `Colour ${i} of ${n}: cure`);
        expect(steps[fill].stationKind).toBe('fill');
        expect(steps[fill].colour).toBe(i);
        expect(steps[cure].stationKind).toBe('cure');
        // each colour cures in an oven for two hours or more before the next colour (common practice)
        expect(steps[cure].cureMinutes).toBeGreaterThanOrEqual(120);
        expect(cure).toBe(fill + 1);
      }
      // posts fitted, colours filled and cured, stoned flush, polished, plated (common practice)
      expect(idx(steps, 'post')).toBeLessThan(idx(steps, 'fill'));
      expect(lastIdx(steps, 'cure')).toBeLessThan(idx(steps, 'stone'));
      expect(idx(steps, 'stone')).toBeLessThan(idx(steps, 'polish'));
      expect(idx(steps, 'polish')).toBeLessThan(idx(steps, 'plate'));
      expect(idx(steps, 'plate')).toBeLessThan(lastIdx(steps, 'inspect'));
    });
  }

  it('the whole routing of a two-colour pin with printing and epoxy, in trade order', () => {
    const steps = route(spec('hard_enamel', 2, { printing: true, epoxy: true }));
    expect(steps.map((s) => s.name)).toEqual([
      'Strike',
      'Trim',
      'Fit posts',
      'Colour 1 of 2: fill',
      'Colour 1 of 2: cure',
      'Colour 2 of 2: fill',
      'Colour 2 of 2: cure',
      'Stone flush',
      'Polish',
      'Check before plating',
      'Plate',
      'Print',
      'Epoxy dome',
      'Epoxy: cure',
      'Inspect',
      'Fit clutches',
      'Bag',
      'Pack',
      'Dispatch',
    ]);
    expect(steps.find((s) => s.name === 'Colour 2 of 2: cure')!.cureMinutes).toBe(HARD_ENAMEL_CURE_MINUTES);
  });

  it('printing and epoxy only when asked', () => {
    const plain = route(spec('hard_enamel', 3));
    expect(kinds(plain)).not.toContain('print');
    expect(kinds(plain)).not.toContain('epoxy');
    const printed = route(spec('hard_enamel', 3, { printing: true }));
    expect(kinds(printed)).toContain('print');
    expect(kinds(printed)).not.toContain('epoxy');
    expect(printed).toHaveLength(plain.length + 1);
    const domed = route(spec('hard_enamel', 3, { epoxy: true }));
    expect(kinds(domed)).toContain('epoxy');
    // dome, then its cure (warm cure 2–4 h: common practice)
    const e = idx(domed, 'epoxy');
    expect(domed[e + 1].stationKind).toBe('cure');
    expect(domed[e + 1].cureMinutes).toBeGreaterThanOrEqual(120);
    expect(domed[e + 1].cureMinutes).toBeLessThanOrEqual(240);
  });

  it('no posts or clutches for a badge without fittings; no posts for a magnet', () => {
    const none = route(spec('hard_enamel', 1, { backing: { type: 'none', count: 0 } }));
    expect(kinds(none)).not.toContain('post');
    expect(kinds(none)).not.toContain('clutch');
    const magnet = route(spec('hard_enamel', 1, { backing: { type: 'magnet', count: 1 } }));
    expect(kinds(magnet)).not.toContain('post');
    expect(kinds(magnet)).toContain('clutch');
  });
});

describe('soft enamel: plate first, then fill and cure (common practice)', () => {
  for (const n of COLOUR_COUNTS) {
    it(`${n} colour(s): plated before filling, one bake after the last colour`, () => {
      const steps = route(spec('soft_enamel', n));
      expect(steps.filter((s) => s.stationKind === 'fill')).toHaveLength(n);
      expect(steps.filter((s) => s.stationKind === 'cure')).toHaveLength(1);
      expect(idx(steps, 'plate')).toBeLessThan(idx(steps, 'fill'));
      expect(idx(steps, 'cure')).toBe(lastIdx(steps, 'fill') + 1);
      expect(kinds(steps)).not.toContain('stone');
      // about 230 °C for 12–15 min in some shops (common practice)
      expect(steps[idx(steps, 'cure')].cureMinutes).toBeGreaterThanOrEqual(12);
    });

    it(`${n} colour(s): a cure per colour when the template says so`, () => {
      const base = DEFAULT_ROUTING_TEMPLATES.soft_enamel;
      const perColour: RoutingTemplate = {
        ...base,
        steps: base.steps.map((e) => (e.type === 'colours' ? { ...e, cure: 'each' as const } : e)),
      };
      const steps = expandRouting(perColour, spec('soft_enamel', n));
      expect(steps.filter((s) => s.stationKind === 'cure')).toHaveLength(n);
      for (let i = 1; i <= n; i++) {
        const fill = steps.findIndex((s) => s.name === `Colour ${i} of ${n}: fill`);
        expect(steps[fill + 1].name).toBe(`Colour ${i} of ${n}: cure`);
      }
    });
  }

  it('air-dried colours: no cure step at all', () => {
    const base = DEFAULT_ROUTING_TEMPLATES.soft_enamel;
    const airDry: RoutingTemplate = {
      ...base,
      steps: base.steps.map((e) => (e.type === 'colours' ? { ...e, cure: 'none' as const } : e)),
    };
    expect(kinds(expandRouting(airDry, spec('soft_enamel', 4)))).not.toContain('cure');
  });
});

describe('other processes', () => {
  for (const n of COLOUR_COUNTS) {
    it(`die-struck with ${n} colour(s) listed: no enamel steps`, () => {
      const steps = route(spec('die_struck', n));
      expect(kinds(steps)).not.toContain('fill');
      expect(kinds(steps)).not.toContain('cure');
      expect(idx(steps, 'polish')).toBeLessThan(idx(steps, 'plate'));
    });

    it(`printed with ${n} colour(s): printed even without the flag, domed only when asked`, () => {
      const steps = route(spec('printed', n));
      expect(kinds(steps)).toContain('print');
      expect(kinds(steps)).not.toContain('epoxy');
      expect(kinds(steps)).not.toContain('cure');
      expect(kinds(steps)).not.toContain('fill');
      expect(idx(steps, 'plate')).toBeLessThan(idx(steps, 'print'));
      const domed = route(spec('printed', n, { epoxy: true }));
      expect(idx(domed, 'print')).toBeLessThan(idx(domed, 'epoxy'));
      expect(domed[idx(domed, 'epoxy') + 1].stationKind).toBe('cure');
      // asking again for printing does not double the print step
      expect(route(spec('printed', n, { printing: true }))).toEqual(steps);
    });

    it(`3D die-cast with ${n} colour(s): cast, never struck, one fill per colour`, () => {
      const steps = route(spec('die_cast_3d', n));
      expect(steps[0].stationKind).toBe('cast');
      expect(steps.filter((s) => s.stationKind === 'fill')).toHaveLength(n);
    });
  }

  it('3D die-cast without colours: no fill or bake', () => {
    const steps = route(spec('die_cast_3d', 0));
    expect(kinds(steps)).not.toContain('fill');
    expect(kinds(steps)).not.toContain('cure');
  });

  it('refuses a template of another process', () => {
    expect(() => expandRouting(DEFAULT_ROUTING_TEMPLATES.hard_enamel, spec('soft_enamel', 1))).toThrow(/hard_enamel/);
  });

  it('edited templates change the expansion (times are data, not code)', () => {
    const base = DEFAULT_ROUTING_TEMPLATES.hard_enamel;
    const slowerOven: RoutingTemplate = {
      ...base,
      steps: base.steps.map((e) => (e.type === 'colours' ? { ...e, cureStep: { ...e.cureStep, cureMinutes: 240 } } : e)),
    };
    const steps = expandRouting(slowerOven, spec('hard_enamel', 2));
    expect(steps.filter((s) => s.stationKind === 'cure').map((s) => s.cureMinutes)).toEqual([240, 240]);
  });
});

describe('mould travellers: engrave and check; a stored mould is only checked', () => {
  it('a new back mould is engraved, then checked, as the back mould', () => {
    const steps = mouldRouting({ reuse: false, tool: 'back_mould' });
    expect(kinds(steps)).toEqual(['engrave', 'mould_check']);
    expect(steps.map((s) => s.seq)).toEqual([1, 2]);
    expect(steps.map((s) => s.name)).toEqual(['Engrave back mould', 'Check back mould']);
    expect(steps[0].trayMinutes).toBe(DEFAULT_MOULD_TEMPLATE.engrave.trayMinutes);
  });

  it('a reused mould skips engraving', () => {
    const steps = mouldRouting({ reuse: true, tool: 'front_mould' });
    expect(kinds(steps)).toEqual(['mould_check']);
    expect(steps[0].seq).toBe(1);
    expect(steps[0].name).toBe('Check front mould');
  });

  it('the routing an order stores names no side; each mould traveller shows it under its own tool', () => {
    const stored = mouldRouting({ reuse: false, process: 'hard_enamel' });
    expect(stored.map((s) => s.name)).toEqual(['Engrave mould', 'Check mould']);
    expect(mouldStepsFor(stored, 'front_mould').map((s) => s.name)).toEqual(['Engrave front mould', 'Check front mould']);
    expect(mouldStepsFor(stored, 'back_mould').map((s) => s.name)).toEqual(['Engrave back mould', 'Check back mould']);
    // a routing stored before with the front mould's names reads right on the back mould's traveller
    const old = stored.map((s) => ({ ...s, name: s.stationKind === 'engrave' ? 'Engrave front mould' : 'Check front mould' }));
    expect(mouldStepsFor(old, 'back_mould').map((s) => s.name)).toEqual(['Engrave back mould', 'Check back mould']);
  });

  for (const process of PROCESSES) {
    it(`${process}: ${process === 'printed' ? 'a cutting die, made quickly, no engraved front mould' : 'an engraved front mould, and a back mould for a back logo'}`, () => {
      expect(mouldTool(process, 'front')).toBe(process === 'printed' ? 'cutting_die' : 'front_mould');
      expect(mouldTool(process, 'back')).toBe('back_mould');
      const steps = mouldRouting({ reuse: false, process });
      if (process === 'printed') {
        expect(steps.map((s) => s.name)).toEqual(['Make cutting die', 'Check cutting die']);
        // a cutting die follows the outline only: far less than the 240 min of an engraved mould (common practice)
        expect(steps[0].trayMinutes).toBe(DEFAULT_MOULD_TEMPLATE.cut.trayMinutes);
        expect(steps[0].trayMinutes).toBeLessThan(DEFAULT_MOULD_TEMPLATE.engrave.trayMinutes);
      } else {
        expect(steps[0].trayMinutes).toBe(240);
      }
    });
  }
});

// ---------------------------------------------------------------------------------------
// One case per process and option: where each trade step goes (all common practice).

const ENAMEL: readonly Process[] = ['hard_enamel', 'soft_enamel', 'die_cast_3d'];
const coloursFor = (p: Process) => (p === 'die_struck' ? 0 : 2);
const firstIdx = (steps: RoutingStep[], kind: StationKind) => idx(steps, kind);

describe('safety pin: soldered on, no clutch fitting', () => {
  for (const process of PROCESSES) {
    it(`${process}: ${process === 'printed' ? 'soldered after cutting out' : 'soldered before plating'}, never a clutch or a post`, () => {
      const steps = route(spec(process, coloursFor(process), { backing: { type: 'safety_pin', count: 1 } }));
      expect(steps.filter((s) => s.stationKind === 'solder')).toHaveLength(1);
      expect(kinds(steps)).not.toContain('clutch');
      expect(kinds(steps)).not.toContain('post');
      if (process === 'printed') {
        // the printed sheet is plated whole before anything is cut: fittings go on the cut pieces
        expect(idx(steps, 'solder')).toBeGreaterThan(idx(steps, 'strike'));
      } else {
        expect(idx(steps, 'solder')).toBeLessThan(firstIdx(steps, 'plate'));
      }
      const clutch = route(spec(process, coloursFor(process)));
      expect(kinds(clutch)).not.toContain('solder');
      expect(kinds(clutch)).toContain('clutch');
    });
  }
});

describe('antique finishes: oxidised and relief-polished after plating', () => {
  for (const process of PROCESSES) {
    for (const plating of ANTIQUE_PLATINGS) {
      it(`${process}, ${plating}: one antique step right after the plating`, () => {
        const steps = route(spec(process, coloursFor(process), { plating }));
        expect(steps.filter((s) => s.stationKind === 'antique')).toHaveLength(1);
        const a = idx(steps, 'antique');
        expect(steps[a - 1].stationKind).toBe('plate');
      });
    }
    it(`${process}, bright gold: no antique step`, () => {
      expect(kinds(route(spec(process, coloursFor(process), { plating: 'gold' })))).not.toContain('antique');
    });
  }
});

describe('two-tone: a second plating', () => {
  for (const process of PROCESSES.filter((p) => p !== 'printed')) {
    it(`${process}: plated twice, the second tone straight after the first`, () => {
      const steps = route(spec(process, coloursFor(process), { plating: 'gold', secondPlating: 'black_nickel' }));
      const plates = steps.map((s, i) => (s.stationKind === 'plate' ? i : -1)).filter((i) => i >= 0);
      expect(plates).toHaveLength(2);
      expect(plates[1]).toBe(plates[0] + 1);
      expect(steps[plates[1]].name).toBe('Plate second tone');
      expect(route(spec(process, coloursFor(process))).filter((s) => s.stationKind === 'plate')).toHaveLength(1);
    });

    it(`${process}: antique with a second tone darkens after both platings`, () => {
      const steps = route(spec(process, coloursFor(process), { plating: 'antique_silver', secondPlating: 'gold' }));
      expect(idx(steps, 'antique')).toBe(lastIdx(steps, 'plate') + 1);
    });
  }
});

describe('sandblasted texture: blasted before plating', () => {
  for (const process of PROCESSES.filter((p) => p !== 'printed')) {
    it(`${process}: one sandblast step, after polishing and before plating`, () => {
      const steps = route(spec(process, coloursFor(process), { sandblast: true }));
      expect(steps.filter((s) => s.stationKind === 'sandblast')).toHaveLength(1);
      expect(idx(steps, 'sandblast')).toBeGreaterThan(idx(steps, 'polish'));
      expect(idx(steps, 'sandblast')).toBeLessThan(idx(steps, 'plate'));
      expect(kinds(route(spec(process, coloursFor(process))))).not.toContain('sandblast');
    });
  }
});

describe('check before plating: enamel work is inspected before the bath', () => {
  for (const process of PROCESSES) {
    const enamel = ENAMEL.includes(process);
    it(`${process}: ${enamel ? 'a check before plating' : 'no check before plating'}, a final inspection always`, () => {
      const steps = route(spec(process, coloursFor(process)));
      const check = steps.findIndex((s) => s.name === 'Check before plating');
      if (enamel) {
        expect(steps[check].stationKind).toBe('inspect');
        expect(check).toBe(idx(steps, 'plate') - 1);
      } else {
        expect(check).toBe(-1);
      }
      expect(steps.filter((s) => s.stationKind === 'inspect')).toHaveLength(enamel ? 2 : 1);
    });
  }
});

describe('printed: cut from a plated, printed sheet with a cutting die', () => {
  it('plated, printed, domed, cured, then cut, then fitted', () => {
    const steps = route(spec('printed', 3, { epoxy: true, backing: { type: 'butterfly_clutch', count: 1 } }));
    expect(steps.map((s) => s.name)).toEqual([
      'Plate blanks',
      'Print',
      'Epoxy dome',
      'Epoxy: cure',
      'Cut out with the cutting die',
      'Fit posts',
      'Inspect',
      'Fit clutches',
      'Bag',
      'Pack',
      'Dispatch',
    ]);
    // the cut step runs on the press with the cutting die, so it waits for the die like striking waits for its mould
    expect(MOULD_USING_KINDS).toContain(steps[4].stationKind);
  });
});

describe('edited routings', () => {
  it('renumbers after a reorder and finds what is wrong', () => {
    const steps = route(spec('hard_enamel', 1));
    const moved = renumber([steps[1], steps[0], ...steps.slice(2)]);
    expect(moved.map((s) => s.seq)).toEqual(steps.map((s) => s.seq));
    expect(moved[0].name).toBe('Trim');
    expect(routingProblems(moved)).toEqual([]);

    const broken = moved.map((s) => (s.stationKind === 'cure' ? { ...s, cureMinutes: null } : s));
    expect(routingProblems(broken)).toHaveLength(1);
    expect(routingProblems(broken)[0]).toMatchObject({ code: 'no_cure_time', params: { name: expect.any(String) } });
    expect(routingProblems([{ ...moved[0], seq: 2 }])[0]).toMatchObject({ code: 'numbering', params: { n: 1, seq: 2 } });
    expect(routingProblems([{ ...moved[0], seq: 2 }])[0].message).toMatch(/numbered 2/);
    expect(routingProblems([])).toHaveLength(1);
    expect(routingProblems([])[0].code).toBe('empty');
    expect(routingProblems([{ ...moved[0], trayMinutes: -1 }])[0].message).toMatch(/negative/);
    expect(routingProblems([{ ...moved[0], trayMinutes: -1 }])[0].code).toBe('negative_minutes');
    expect(routingProblems([{ ...moved[0], name: ' ' }])[0].code).toBe('no_name');
  });
});
