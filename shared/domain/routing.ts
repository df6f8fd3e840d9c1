// Routing from the spec: a template per process expands into the order's steps.
// Templates are data so admins can edit them; the defaults below are what a new
// factory starts with. All standard minutes here are demo values, meant to be edited.
import type { BackingType, Process, RoutingStep, StationKind } from './vocabulary';

/** When a template step applies to an order. */
export const STEP_CONDITIONS = ['always', 'back_logo', 'printing', 'epoxy', 'fittings', 'posts'] as const;
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
}

/** Fittings that need a post soldered to the back (common practice). */
const POST_FITTINGS: readonly BackingType[] = ['butterfly_clutch', 'rubber_clutch', 'locking_clutch', 'screw_nut'];

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
      return spec.backing.type !== 'none' && spec.backing.count > 0;
    case 'posts':
      return POST_FITTINGS.includes(spec.backing.type) && spec.backing.count > 0;
  }
}

export function colourStepName(i: number, n: number, what: 'fill' | 'cure'): string {
  return `Colour ${i} of ${n}: ${what}`;
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
        cureMinutes: entry.stationKind === 'cure' ? (entry.cureMinutes ?? 0) : null,
        colour: null,
      });
      continue;
    }
    if (n === 0) continue;
    for (let i = 1; i <= n; i++) {
      out.push({
        name: colourStepName(i, n, 'fill'),
        stationKind: 'fill',
        trayMinutes: entry.fill.trayMinutes,
        pieceMinutes: entry.fill.pieceMinutes,
        cureMinutes: null,
        colour: i,
      });
      if (entry.cure === 'each') {
        out.push({
          name: colourStepName(i, n, 'cure'),
          stationKind: 'cure',
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
        stationKind: 'cure',
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
const STONE = step('Stone flush', 'stone', t(10, 0.05));
const POLISH = step('Polish', 'polish', t(10, 0.08));
const PLATE = step('Plate', 'plate', t(20, 0.02));
const PRINT_OPTIONAL = step('Print', 'print', t(15, 0.1), { when: 'printing' });
const EPOXY_OPTIONAL = step('Epoxy dome', 'epoxy', t(10, 0.1), { when: 'epoxy' });
const EPOXY_CURE_OPTIONAL = step('Epoxy: cure', 'cure', t(5, 0), { when: 'epoxy', cureMinutes: EPOXY_WARM_CURE_MINUTES });
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

export const DEFAULT_ROUTING_TEMPLATES: Record<Process, RoutingTemplate> = {
  hard_enamel: {
    process: 'hard_enamel',
    name: 'Hard enamel',
    steps: [STRIKE, TRIM, POSTS, hardColours, STONE, POLISH, PLATE, PRINT_OPTIONAL, EPOXY_OPTIONAL, EPOXY_CURE_OPTIONAL, ...FINISH],
  },
  soft_enamel: {
    process: 'soft_enamel',
    name: 'Soft enamel',
    steps: [STRIKE, TRIM, POSTS, POLISH, PLATE, softColours, PRINT_OPTIONAL, EPOXY_OPTIONAL, EPOXY_CURE_OPTIONAL, ...FINISH],
  },
  die_struck: {
    process: 'die_struck',
    name: 'Die-struck, no colour',
    steps: [STRIKE, TRIM, POSTS, POLISH, PLATE, PRINT_OPTIONAL, EPOXY_OPTIONAL, EPOXY_CURE_OPTIONAL, ...FINISH],
  },
  printed: {
    process: 'printed',
    name: 'Printed',
    steps: [
      step('Stamp blanks', 'strike', t(10, 0.1)),
      TRIM,
      POSTS,
      POLISH,
      PLATE,
      step('Print', 'print', t(15, 0.1)),
      step('Epoxy dome', 'epoxy', t(10, 0.1)),
      step('Epoxy: cure', 'cure', t(5, 0), { cureMinutes: EPOXY_WARM_CURE_MINUTES }),
      ...FINISH,
    ],
  },
  // 3D shapes cannot be stoned flat, so colours go in after plating, soft-enamel style
  // (common practice); the admin can switch the cure to one per colour.
  die_cast_3d: {
    process: 'die_cast_3d',
    name: '3D die-cast',
    steps: [CAST, TRIM, POSTS, POLISH, PLATE, softColours, PRINT_OPTIONAL, EPOXY_OPTIONAL, EPOXY_CURE_OPTIONAL, ...FINISH],
  },
};

// ---------------------------------------------------------------------------------------
// Moulds

export const MOULD_SIDES = ['front', 'back'] as const;
export type MouldSide = (typeof MOULD_SIDES)[number];

/** A front mould always; a back mould only when the design has a back logo. */
export function requiredMoulds(spec: Pick<RoutingSpec, 'backLogo'>): MouldSide[] {
  return spec.backLogo ? ['front', 'back'] : ['front'];
}

export interface MouldTemplate {
  engrave: TemplateTimes;
  check: TemplateTimes;
}

/** Engraving a front mould takes five or six cutters and is slow (common practice); minutes are demo values. */
export const DEFAULT_MOULD_TEMPLATE: MouldTemplate = {
  engrave: t(240, 0),
  check: t(20, 0),
};

/** The routing of a mould traveller: engrave then check; a reused mould only gets checked. */
export function mouldRouting(opts: { reuse: boolean; side?: MouldSide; template?: MouldTemplate }): RoutingStep[] {
  const side = opts.side ?? 'front';
  const tpl = opts.template ?? DEFAULT_MOULD_TEMPLATE;
  const label = side === 'front' ? 'front' : 'back';
  const steps: Omit<RoutingStep, 'seq'>[] = [];
  if (!opts.reuse) {
    steps.push({ name: `Engrave ${label} mould`, stationKind: 'engrave', ...tpl.engrave, cureMinutes: null, colour: null });
  }
  steps.push({ name: `Check ${label} mould`, stationKind: 'mould_check', ...tpl.check, cureMinutes: null, colour: null });
  return steps.map((s, i) => ({ seq: i + 1, ...s }));
}

/** Station kinds whose start needs the order's moulds to be ready. */
export const MOULD_USING_KINDS: readonly StationKind[] = ['strike', 'cast'];

// ---------------------------------------------------------------------------------------
// Edited routings

export interface RoutingProblem {
  seq: number | null;
  message: string;
}

/** Puts steps in the given order and numbers them 1..n. */
export function renumber<T extends Omit<RoutingStep, 'seq'> & { seq?: number }>(steps: readonly T[]): RoutingStep[] {
  return steps.map((s, i) => ({ ...s, seq: i + 1 }));
}

/** What is wrong with an edited routing (empty list: fine). */
export function routingProblems(steps: readonly RoutingStep[]): RoutingProblem[] {
  const problems: RoutingProblem[] = [];
  if (steps.length === 0) problems.push({ seq: null, message: 'A routing needs at least one step' });
  steps.forEach((s, i) => {
    if (s.seq !== i + 1) problems.push({ seq: s.seq, message: `Step ${i + 1} is numbered ${s.seq}` });
    if (!s.name.trim()) problems.push({ seq: s.seq, message: 'Every step needs a name' });
    if (!(s.trayMinutes >= 0) || !(s.pieceMinutes >= 0)) {
      problems.push({ seq: s.seq, message: 'Standard minutes cannot be negative' });
    }
    if (s.stationKind === 'cure' && !(typeof s.cureMinutes === 'number' && s.cureMinutes > 0)) {
      problems.push({ seq: s.seq, message: `${s.name}: a cure step needs a minimum cure time` });
    }
  });
  return problems;
}

/** Total standard minutes of a routing for a tray of `pieces` (cure time excluded: the oven works alone). */
export function routingStandardMinutes(steps: readonly RoutingStep[], pieces: number): number {
  return steps.reduce((sum, s) => sum + s.trayMinutes + s.pieceMinutes * pieces, 0);
}
