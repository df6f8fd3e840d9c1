// The customer's own production story: for each stage of her order that has begun, when it began
// and ended, and in plain words for a buyer how that stage is done for her process. Only these
// words, her own dates and photos a supervisor chose to share reach her page: no people, no
// stations, no other orders.
import { CUSTOMER_STAGES, STAGE_OF_STATION_KIND, type CustomerStage } from './stages';
import type { Process, StationKind } from './vocabulary';

export type StoryLang = 'en' | 'zh-CN';

type StageWords = Partial<Record<CustomerStage, string>>;

// Plain words on how each stage is done. These are trade facts as factories describe them to
// buyers (common practice, no published source); the factory's own wording may differ.
const COMMON: Record<StoryLang, Record<CustomerStage, string>> = {
  en: {
    artwork_moulds:
      'Your approved artwork is engraved into a steel mould by a cutting machine, using five or six cutters of different sizes from coarse to fine; the mould is then checked before any metal is pressed.',
    metal_forming: 'Each blank is pressed from metal sheet in your mould, the outline is trimmed away and the posts for the backs are fitted.',
    colour: 'The colours of your design are filled in by hand.',
    finishing_plating: 'The badges are smoothed, polished and plated with your chosen finish.',
    inspection: 'Every badge is checked by eye against your approved proof; badges with flaws are taken out.',
    packing: 'The backs are fitted, the badges are packed as you ordered and the parcel is made ready for the courier.',
    shipped: 'Your order has left the factory with the courier.',
  },
  'zh-CN': {
    artwork_moulds: '您确认的图稿由雕刻机刻进钢模，从粗到细要换五六把不同大小的刀具；模具检查合格后才开始压制金属。',
    metal_forming: '在您的模具里把金属片逐个冲压成形，切去外框余料，再装上背针的针柱。',
    colour: '您设计中的颜色由人工逐一填入。',
    finishing_plating: '徽章经过打磨、抛光，再电镀您选择的表面效果。',
    inspection: '每一枚徽章都按您确认的稿件目检，有瑕疵的会被挑出。',
    packing: '装上背扣，按您订购的方式包装，并为快递准备好包裹。',
    shipped: '您的订单已随快递离开工厂。',
  },
};

const BY_PROCESS: Record<StoryLang, Partial<Record<Process, StageWords>>> = {
  en: {
    hard_enamel: {
      // common practice: hard enamel is filled one colour at a time and each colour is cured in an
      // oven for two hours or more before the next goes in; then stoned flush and polished
      colour:
        'Hard enamel is filled by hand, one colour at a time. After each colour the badges go into an oven and cure for two hours or more before the next colour goes in, so every colour adds a few hours.',
      finishing_plating:
        'Once all colours are cured, the enamel is ground flat, level with the metal lines, polished on a wheel and then plated, so the surface is smooth to the touch.',
    },
    soft_enamel: {
      // common practice: soft enamel is plated first, then filled and cured; it stays below the metal lines
      finishing_plating: 'For soft enamel the metal is polished and plated first, before any colour goes in.',
      colour:
        'The colours are filled in by hand into the plated badge and cured in an oven; the enamel stays a little below the raised metal lines, which gives soft enamel its textured feel.',
    },
    die_struck: {
      metal_forming:
        'Your design is struck into the metal with a heavy press, one blank at a time, so the raised and recessed areas come out crisp; the outline is then trimmed.',
    },
    die_cast_3d: {
      // common practice: irregular and 3D shapes are zinc die cast
      metal_forming:
        'Molten zinc alloy is injected into your mould, which lets the badge have a 3D shape and cut-outs; each casting is then trimmed and its edges cleaned.',
    },
    printed: {
      finishing_plating: 'The badge is polished and plated, then your design is printed onto it and sealed so the colours last.',
    },
  },
  'zh-CN': {
    hard_enamel: {
      colour: '硬珐琅由人工填色，一次只填一种颜色。每填完一种颜色，徽章都要进烤炉固化两小时或更久，然后才填下一种，所以每多一种颜色就多几小时。',
      finishing_plating: '所有颜色固化后，把珐琅磨平到与金属线齐平，在布轮上抛光，然后电镀，表面摸起来光滑平整。',
    },
    soft_enamel: {
      finishing_plating: '软珐琅先抛光、电镀金属，之后才填色。',
      colour: '颜色由人工填入电镀好的徽章并进烤炉固化；珐琅略低于凸起的金属线，这就是软珐琅的凹凸手感。',
    },
    die_struck: {
      metal_forming: '用重型压力机把您的设计逐个冲压进金属，凹凸清晰；然后切去外框。',
    },
    die_cast_3d: {
      metal_forming: '把熔化的锌合金压铸进您的模具，徽章因此可以有立体造型和镂空；每件铸件再修边、清理边缘。',
    },
    printed: {
      finishing_plating: '徽章经过抛光、电镀后，把您的设计印在上面并加封保护层，让颜色更耐久。',
    },
  },
};

/** How a stage is done for this process, in the customer's language. */
export function stageStoryText(process: Process, stage: CustomerStage, lang: StoryLang): string {
  return BY_PROCESS[lang][process]?.[stage] ?? COMMON[lang][stage];
}

export interface StepTimes {
  stationKind: StationKind;
  /** first start scan at a station of this kind, epoch ms */
  firstStart: number | null;
  /** last finish scan at a station of this kind, epoch ms */
  lastFinish: number | null;
}

export interface StoryPhoto {
  id: string;
  /** station kind of the scan the photo was taken with; null when not tied to a scan */
  stationKind: StationKind | null;
  takenAt: number;
}

export interface StoryEntry {
  stage: CustomerStage;
  /** when the stage began (epoch ms) */
  startedAt: number;
  /** when it was finished, only once the whole stage is done */
  doneAt: number | null;
  text: string;
  textZh: string;
  photoIds: string[];
}

/**
 * The story of one order from its scan times. A stage has begun at its first start scan (the
 * artwork stage at release); it is finished, with a date, once the progress line marks it done.
 * Photos go with the stage of the scan they were taken at; one without a scan goes with the
 * latest stage begun before it was taken.
 */
export function productionStory(input: {
  process: Process;
  releasedAt: number | null;
  shippedAt: number | null;
  /** stages done, from the progress line */
  done: ReadonlySet<CustomerStage>;
  steps: StepTimes[];
  photos: StoryPhoto[];
}): StoryEntry[] {
  const { process, releasedAt, shippedAt, done, steps, photos } = input;
  if (releasedAt == null) return [];
  const start = new Map<CustomerStage, number>();
  const end = new Map<CustomerStage, number>();
  for (const s of steps) {
    const stage = STAGE_OF_STATION_KIND[s.stationKind];
    if (!stage) continue;
    if (s.firstStart != null) start.set(stage, Math.min(start.get(stage) ?? Infinity, s.firstStart));
    if (s.lastFinish != null) end.set(stage, Math.max(end.get(stage) ?? -Infinity, s.lastFinish));
  }
  start.set('artwork_moulds', Math.min(start.get('artwork_moulds') ?? Infinity, releasedAt));
  if (shippedAt != null) {
    start.set('shipped', shippedAt);
    end.set('shipped', shippedAt);
  }
  const photosBy = new Map<CustomerStage, string[]>();
  for (const p of [...photos].sort((a, b) => a.takenAt - b.takenAt)) {
    const stage = (p.stationKind ? STAGE_OF_STATION_KIND[p.stationKind] : undefined) ?? stageAt(start, p.takenAt);
    photosBy.set(stage, [...(photosBy.get(stage) ?? []), p.id]);
  }
  const out: StoryEntry[] = [];
  for (const stage of CUSTOMER_STAGES) {
    const began = start.get(stage);
    // a stage that the routing skipped (no colour on a plain die-struck badge) has no story
    if (began == null || !Number.isFinite(began)) continue;
    const finished = done.has(stage) ? (end.get(stage) ?? null) : null;
    out.push({
      stage,
      startedAt: began,
      doneAt: finished != null && Number.isFinite(finished) ? Math.max(finished, began) : null,
      text: stageStoryText(process, stage, 'en'),
      textZh: stageStoryText(process, stage, 'zh-CN'),
      photoIds: photosBy.get(stage) ?? [],
    });
  }
  return out;
}

/** The latest stage that had begun at `at` (the artwork stage when none had). */
function stageAt(start: Map<CustomerStage, number>, at: number): CustomerStage {
  let best: CustomerStage = 'artwork_moulds';
  let bestAt = -Infinity;
  for (const [stage, began] of start) {
    if (began <= at && began >= bestAt) {
      best = stage;
      bestAt = began;
    }
  }
  return best;
}
