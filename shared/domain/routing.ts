// Routing from the spec: a template per process expands into the order's steps.
// Templates are data so admins can edit them; the defaults below are what a new
// factory starts with. All standard minutes here are demo values, meant to be edited.
import { ANTIQUE_PLATINGS, type BackingType, type Plating, type Process, type RoutingStep, type StationKind } from './vocabulary';
import { FILL_KIND, OVEN_KIND, cures, kindTraits, kindsWhere } from './traveller/station-kinds';

/**
 * When a template step applies to an order. `fittings`: a backing fitted after inspection
 * (clutch, magnet); `posts`: a post soldered to the back for a clutch or nut; `safety_pin`: a
 * safety pin soldered on; `antique`: an antique finish (oxidised and relief-polished after
 * plating); `second_plating`: a two-tone finish; `sandblast`: a sandblasted texture.
 */
export const STEP_CONDITIONS = [
  'always',
  'back_logo',
  'printing',
  'epoxy',
  'fittings',
  'posts',
  'safety_pin',
  'antique',
  'second_plating',
  'sandblast',
] as const;
export type StepCondition = (typeof STEP_CONDITIONS)[number];

export interface TemplateTimes {
  trayMinutes: number;
  pieceMinutes: number;
}

export interface TemplateSingleStep extends TemplateTimes {
  type: 'step';
  name: string;
  stationKind: StationKind;
  /** minimum minutes a cure step must run before the next step may start */
  cureMinutes?: number | null;
  when?: StepCondition;
}

/**
 * One fill per enamel colour, cured as the template says:
 * `each` – a cure step after every colour (hard enamel: colour i+1 may not go in before colour i has cured);
 * `once` – one bake after all colours (soft enamel in many shops);
 * `none` – no cure step (air-dried).
 */
export interface TemplateColourBlock {
  type: 'colours';
  fill: TemplateTimes;
  cure: 'each' | 'once' | 'none';
  cureStep: TemplateTimes & { cureMinutes: number };
  /** name of the single bake when cure is `once` */
  onceName: string;
}

export type TemplateEntry = TemplateSingleStep | TemplateColourBlock;

export interface RoutingTemplate {
  process: Process;
  name: string;
  steps: TemplateEntry[];
}

/** The parts of an order spec that shape its routing. */
export interface RoutingSpec {
  process: Process;
  colours: readonly unknown[];
  backLogo: boolean;
  printing: boolean;
  epoxy: boolean;
  backing: { type: BackingType; count: number };
  plating: Plating;
  /** the second finish of a two-tone badge (null: one finish) */
  secondPlating: Plating | null;
  /** a sandblasted (matt) texture on the recessed metal */
  sandblast: boolean;
}

/** Fittings that need a post soldered to the back (common practice). */
export const POST_FITTINGS: readonly BackingType[] = ['butterfly_clutch', 'rubber_clutch', 'locking_clutch', 'screw_nut'];

/** True when the order's finish (either tone) is an antique one. */
export function isAntique(spec: Pick<RoutingSpec, 'plating' | 'secondPlating'>): boolean {
  return ANTIQUE_PLATINGS.includes(spec.plating) || (spec.secondPlating != null && ANTIQUE_PLATINGS.includes(spec.secondPlating));
}

function applies(when: StepCondition | undefined, spec: RoutingSpec): boolean {
  switch (when ?? 'always') {
    case 'always':
      return true;
    case 'back_logo':
      return spec.backLogo;
    case 'printing':
      return spec.printing;
    case 'epoxy':
      return spec.epoxy;
    case 'fittings':
      // a safety pin is soldered on before plating and needs nothing fitted afterwards (common practice)
      return spec.backing.type !== 'none' && spec.backing.type !== 'safety_pin' && spec.backing.count > 0;
    case 'posts':
      return POST_FITTINGS.includes(spec.backing.type) && spec.backing.count > 0;
    case 'safety_pin':
      return spec.backing.type === 'safety_pin' && spec.backing.count > 0;
    case 'antique':
      return isAntique(spec);
    case 'second_plating':
      return spec.secondPlating != null && spec.secondPlating !== spec.plating;
    case 'sandblast':
      return spec.sandblast;
  }
}

export function colourStepName(i: number, n: number, kind: StationKind): string {
  return `Colour ${i} of ${n}: ${kindTraits(kind).colourStep ?? kind}`;
}

/** Expands a template into the order's routing: seq 1..n, one fill (and cure) per colour. */
export function expandRouting(template: RoutingTemplate, spec: RoutingSpec): RoutingStep[] {
  if (template.process !== spec.process) {
    throw new Error(`Template for ${template.process} used for a ${spec.process} order`);
  }
  const out: Omit<RoutingStep, 'seq'>[] = [];
  const n = spec.colours.length;
  for (const entry of template.steps) {
    if (entry.type === 'step') {
      if (!applies(entry.when, spec)) continue;
      out.push({
        name: entry.name,
        stationKind: entry.stationKind,
        trayMinutes: entry.trayMinutes,
        pieceMinutes: entry.pieceMinutes,
        cureMinutes: cures(entry.stationKind) ? (entry.cureMinutes ?? 0) : null,
        colour: null,
      });
      continue;
    }
    if (n === 0) continue;
    for (let i = 1; i <= n; i++) {
      out.push({
        name: colourStepName(i, n, FILL_KIND),
        stationKind: FILL_KIND,
        trayMinutes: entry.fill.trayMinutes,
        pieceMinutes: entry.fill.pieceMinutes,
        cureMinutes: null,
        colour: i,
      });
      if (entry.cure === 'each') {
        out.push({
          name: colourStepName(i, n, OVEN_KIND),
          stationKind: OVEN_KIND,
          trayMinutes: entry.cureStep.trayMinutes,
          pieceMinutes: entry.cureStep.pieceMinutes,
          cureMinutes: entry.cureStep.cureMinutes,
          colour: i,
        });
      }
    }
    if (entry.cure === 'once') {
      out.push({
        name: entry.onceName,
        stationKind: OVEN_KIND,
        trayMinutes: entry.cureStep.trayMinutes,
        pieceMinutes: entry.cureStep.pieceMinutes,
        cureMinutes: entry.cureStep.cureMinutes,
        colour: null,
      });
    }
  }
  return out.map((s, i) => ({ seq: i + 1, ...s }));
}

// ---------------------------------------------------------------------------------------
// Default templates. Demo values for standard minutes; cure times are common practice:
// hard enamel cures 2 h or more per colour; a soft-enamel bake is about 15 min; a warm
// epoxy cure is 2–4 h (3 h here).

export const HARD_ENAMEL_CURE_MINUTES = 120;
export const SOFT_ENAMEL_BAKE_MINUTES = 15;
export const EPOXY_WARM_CURE_MINUTES = 180;

const t = (trayMinutes: number, pieceMinutes: number): TemplateTimes => ({ trayMinutes, pieceMinutes });
const step = (
  name: string,
  stationKind: StationKind,
  times: TemplateTimes,
  extra: { when?: StepCondition; cureMinutes?: number } = {},
): TemplateSingleStep => ({ type: 'step', name, stationKind, ...times, ...extra });

const STRIKE = step('Strike', 'strike', t(15, 0.15));
const CAST = step('Cast', 'cast', t(20, 0.2));
const TRIM = step('Trim', 'trim', t(5, 0.05));
const POSTS = step('Fit posts', 'post', t(5, 0.2), { when: 'posts' });
// a safety pin is soldered to the back before plating, so the plating covers the joint (common practice)
const SAFETY_PIN = step('Solder safety pin', 'solder', t(5, 0.25), { when: 'safety_pin' });
const STONE = step('Stone flush', 'stone', t(10, 0.05));
const POLISH = step('Polish', 'polish', t(10, 0.08));
// sandblasting textures the bare metal, so it comes before plating (common practice)
const SANDBLAST = step('Sandblast texture', 'sandblast', t(10, 0.04), { when: 'sandblast' });
// enamel work is checked before the plating bath, the step that costs most to redo (common practice)
const CHECK_BEFORE_PLATING = step('Check before plating', 'inspect', t(5, 0.03));
const PLATE = step('Plate', 'plate', t(20, 0.02));
// two-tone: the areas of the first finish are masked and the second finish plated (common practice)
const SECOND_PLATE = step('Plate second tone', 'plate', t(25, 0.03), { when: 'second_plating' });
// antique finishes: the plated piece is darkened, then the raised metal polished bright again (common practice)
const ANTIQUE = step('Antique: oxidise and relief-polish', 'antique', t(15, 0.06), { when: 'antique' });
const PLATING: TemplateSingleStep[] = [PLATE, SECOND_PLATE, ANTIQUE];
const PRINT_OPTIONAL = step('Print', 'print', t(15, 0.1), { when: 'printing' });
const EPOXY_OPTIONAL = step('Epoxy dome', 'epoxy', t(10, 0.1), { when: 'epoxy' });
const EPOXY_CURE_OPTIONAL = step('Epoxy: cure', OVEN_KIND, t(5, 0), { when: 'epoxy', cureMinutes: EPOXY_WARM_CURE_MINUTES });
const FINISH: TemplateSingleStep[] = [
  step('Inspect', 'inspect', t(5, 0.05)),
  step('Fit clutches', 'clutch', t(3, 0.05), { when: 'fittings' }),
  step('Bag', 'bag', t(3, 0.05)),
  step('Pack', 'pack', t(10, 0.01)),
  step('Dispatch', 'dispatch', t(10, 0)),
];

const hardColours: TemplateColourBlock = {
  type: 'colours',
  fill: t(5, 0.25),
  cure: 'each',
  cureStep: { ...t(5, 0), cureMinutes: HARD_ENAMEL_CURE_MINUTES },
  onceName: 'Cure all colours',
};
const softColours: TemplateColourBlock = {
  type: 'colours',
  fill: t(5, 0.15),
  cure: 'once',
  cureStep: { ...t(5, 0), cureMinutes: SOFT_ENAMEL_BAKE_MINUTES },
  onceName: 'Bake all colours',
};

/** After striking or casting, the soft-enamel way: colours go in after plating (soft enamel and 3D die-cast). */
const SOFT_COLOURS_AFTER_FORMING = [
  TRIM,
  POSTS,
  SAFETY_PIN,
  POLISH,
  SANDBLAST,
  CHECK_BEFORE_PLATING,
  ...PLATING,
  softColours,
  PRINT_OPTIONAL,
  EPOXY_OPTIONAL,
  EPOXY_CURE_OPTIONAL,
  ...FINISH,
];

export const DEFAULT_ROUTING_TEMPLATES: Record<Process, RoutingTemplate> = {
  hard_enamel: {
    process: 'hard_enamel',
    name: 'Hard enamel',
    steps: [
      STRIKE,
      TRIM,
      POSTS,
      SAFETY_PIN,
      hardColours,
      STONE,
      POLISH,
      SANDBLAST,
      CHECK_BEFORE_PLATING,
      ...PLATING,
      PRINT_OPTIONAL,
      EPOXY_OPTIONAL,
      EPOXY_CURE_OPTIONAL,
      ...FINISH,
    ],
  },
  soft_enamel: {
    process: 'soft_enamel',
    name: 'Soft enamel',
    steps: [STRIKE, ...SOFT_COLOURS_AFTER_FORMING],
  },
  die_struck: {
    process: 'die_struck',
    name: 'Die-struck, no colour',
    steps: [STRIKE, TRIM, POSTS, SAFETY_PIN, POLISH, SANDBLAST, ...PLATING, PRINT_OPTIONAL, EPOXY_OPTIONAL, EPOXY_CURE_OPTIONAL, ...FINISH],
  },
  // Printed badges: a sheet is plated and printed whole, domed when the order asks for epoxy, and
  // only then cut out with a cutting die; fittings go on after cutting (common practice).
  printed: {
    process: 'printed',
    name: 'Printed',
    steps: [
      step('Plate blanks', 'plate', t(20, 0.02)),
      ANTIQUE,
      step('Print', 'print', t(15, 0.1)),
      EPOXY_OPTIONAL,
      EPOXY_CURE_OPTIONAL,
      step('Cut out with the cutting die', 'strike', t(10, 0.1)),
      POSTS,
      SAFETY_PIN,
      ...FINISH,
    ],
  },
  // 3D shapes cannot be stoned flat, so colours go in after plating, soft-enamel style
  // (common practice); the admin can switch the cure to one per colour.
  die_cast_3d: {
    process: 'die_cast_3d',
    name: '3D die-cast',
    steps: [CAST, ...SOFT_COLOURS_AFTER_FORMING],
  },
};

// ---------------------------------------------------------------------------------------
// Moulds

export const MOULD_SIDES = ['front', 'back'] as const;
export type MouldSide = (typeof MOULD_SIDES)[number];

/**
 * The tool a mould traveller makes. Struck and cast badges need an engraved front mould (and a
 * back mould for a back logo); printed badges are cut out of a plated, printed sheet with a
 * cutting die, which takes the front mould's place (common practice).
 */
export const MOULD_TOOLS = ['front_mould', 'back_mould', 'cutting_die'] as const;
export type MouldTool = (typeof MOULD_TOOLS)[number];

export const MOULD_TOOL_NAMES: Record<MouldTool, string> = {
  front_mould: 'Front mould',
  back_mould: 'Back mould',
  cutting_die: 'Cutting die',
};

/** Which tool the mould of a side is, for an order of this process. */
export function mouldTool(process: Process, side: MouldSide): MouldTool {
  if (side === 'back') return 'back_mould';
  return process === 'printed' ? 'cutting_die' : 'front_mould';
}

/** A front mould (or cutting die) always; a back mould only when the design has a back logo. */
export function requiredMoulds(spec: Pick<RoutingSpec, 'backLogo'>): MouldSide[] {
  return spec.backLogo ? ['front', 'back'] : ['front'];
}

export interface MouldTemplate {
  engrave: TemplateTimes;
  check: TemplateTimes;
  /** making a cutting die for a printed badge's outline */
  cut: TemplateTimes;
}

/** Engraving a front mould takes five or six cutters and is slow; a cutting die follows only the
 * outline and is much quicker (common practice); minutes are demo values. */
export const DEFAULT_MOULD_TEMPLATE: MouldTemplate = {
  engrave: t(240, 0),
  check: t(20, 0),
  cut: t(60, 0),
};

/** The mould shop's kinds: where tools are made, and where they are checked. */
export const MOULD_MAKE_KIND: StationKind = kindsWhere((t) => t.mouldShop === 'make')[0];
export const MOULD_CHECK_KIND: StationKind = kindsWhere((t) => t.mouldShop === 'check')[0];

/** The names of the mould shop's steps for each tool. */
export function mouldStepName(shop: 'make' | 'check', tool: MouldTool | null): string {
  if (tool === 'cutting_die') return shop === 'make' ? 'Make cutting die' : 'Check cutting die';
  const what = tool === 'back_mould' ? 'back mould' : tool === 'front_mould' ? 'front mould' : 'mould';
  return shop === 'make' ? `Engrave ${what}` : `Check ${what}`;
}

/**
 * The routing of a mould traveller: make (engrave or cut) then check; a reused tool only gets
 * checked. Without a tool the steps have the names every mould of the order shares; an order's
 * mould travellers share one stored routing, and each shows it under its own tool's names
 * (`mouldStepsFor`).
 */
export function mouldRouting(opts: { reuse: boolean; tool?: MouldTool | null; process?: Process; template?: MouldTemplate }): RoutingStep[] {
  const tpl = opts.template ?? DEFAULT_MOULD_TEMPLATE;
  const cutting = opts.tool === 'cutting_die' || (opts.tool == null && opts.process === 'printed');
  const tool = opts.tool ?? (cutting ? 'cutting_die' : null);
  const steps: Omit<RoutingStep, 'seq'>[] = [];
  if (!opts.reuse) {
    steps.push({ name: mouldStepName('make', tool), stationKind: MOULD_MAKE_KIND, ...(cutting ? tpl.cut : tpl.engrave), cureMinutes: null, colour: null });
  }
  steps.push({ name: mouldStepName('check', tool), stationKind: MOULD_CHECK_KIND, ...tpl.check, cureMinutes: null, colour: null });
  return steps.map((s, i) => ({ seq: i + 1, ...s }));
}

/** An order's stored mould routing as one tool's traveller shows it: the mould shop's steps under that tool's names. */
export function mouldStepsFor<T extends Pick<RoutingStep, 'stationKind' | 'name'>>(steps: readonly T[], tool: MouldTool): T[] {
  return steps.map((s) => {
    const shop = kindTraits(s.stationKind).mouldShop;
    return shop ? { ...s, name: mouldStepName(shop, tool) } : s;
  });
}

/** Station kinds whose start needs the order's moulds to be ready. */
export const MOULD_USING_KINDS: readonly StationKind[] = kindsWhere((t) => t.needsMould);

// ---------------------------------------------------------------------------------------
// Edited routings

export type RoutingProblemCode = 'empty' | 'numbering' | 'no_name' | 'negative_minutes' | 'no_cure_time';

export interface RoutingProblem {
  seq: number | null;
  /** what is wrong, for screens in any language (with `params`) */
  code: RoutingProblemCode;
  params?: Record<string, string | number>;
  message: string;
}

/** Puts steps in the given order and numbers them 1..n. */
export function renumber<T extends Omit<RoutingStep, 'seq'> & { seq?: number }>(steps: readonly T[]): RoutingStep[] {
  return steps.map((s, i) => ({ ...s, seq: i + 1 }));
}

/** What is wrong with an edited routing (empty list: fine). */
export function routingProblems(steps: readonly RoutingStep[]): RoutingProblem[] {
  const problems: RoutingProblem[] = [];
  if (steps.length === 0) problems.push({ seq: null, code: 'empty', message: 'A routing needs at least one step' });
  steps.forEach((s, i) => {
    if (s.seq !== i + 1) problems.push({ seq: s.seq, code: 'numbering', params: { n: i + 1, seq: s.seq }, message: `Step ${i + 1} is numbered ${s.seq}` });
    if (!s.name.trim()) problems.push({ seq: s.seq, code: 'no_name', message: 'Every step needs a name' });
    if (!(s.trayMinutes >= 0) || !(s.pieceMinutes >= 0)) {
      problems.push({ seq: s.seq, code: 'negative_minutes', message: 'Standard minutes cannot be negative' });
    }
    if (cures(s.stationKind) && !(typeof s.cureMinutes === 'number' && s.cureMinutes > 0)) {
      problems.push({ seq: s.seq, code: 'no_cure_time', params: { name: s.name }, message: `${s.name}: a cure step needs a minimum cure time` });
    }
  });
  return problems;
}
