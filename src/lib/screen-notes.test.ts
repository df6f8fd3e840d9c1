// The server's stage and projection notes said on screens: the client's English matches the
// English line the API sends beside the code (one wording, two places), and the Chinese has no
// English words of ours left. Times in the factory's zone: 2026-12-10T02:27Z is Thu 10 Dec 10:27
// in Asia/Shanghai (UTC+8 all year, IANA tz database).
import { describe, expect, it } from 'vitest';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describeStage, stageNote, type StageDescriptionInput } from '@shared/domain/stages';
import { projectionNoteEnglish, roundHours, type ProjectionNote } from '@shared/domain/projection-note';
import type { StationKind } from '@shared/domain/vocabulary';
import { applyLocale } from '@/lib/i18n';
import { setFactoryTimeZone } from '@/lib/datetime';
import { useProjectionNote } from '@/lib/projection-note';
import { useStageNote } from '@/features/sales/stage-note';

const ZONE = 'Asia/Shanghai';
const HARD_ENAMEL: StationKind[] = ['strike', 'trim', 'post', 'fill', 'cure', 'stone', 'polish', 'plate', 'inspect', 'clutch', 'bag', 'pack', 'dispatch'];
const routing = HARD_ENAMEL.map((stationKind, i) => ({ seq: i + 1, stationKind }));
const tray = (stepSeq: number | null, onHold = false) => ({
  kind: 'tray' as const,
  phase: stepSeq === null ? ('done' as const) : ('waiting' as const),
  stepSeq,
  routing,
  onHold,
});

const STAGES: StageDescriptionInput[] = [
  { status: 'awaiting_proof', travellers: [] },
  { status: 'in_production', travellers: [tray(4), tray(4), tray(5, true), tray(8), tray(null)] },
  { status: 'on_hold', travellers: [tray(2), tray(2, true)] },
  { status: 'in_production', travellers: [tray(1), { kind: 'mould', phase: 'waiting', stepSeq: 1, routing: [{ seq: 1, stationKind: 'engrave' }] }] },
  { status: 'shipped', travellers: [tray(null)] },
];

const NOTES: ProjectionNote[] = [
  { code: 'none' },
  { code: 'all_done' },
  { code: 'after_release' },
  {
    code: 'measured',
    params: {
      expectedAt: '2026-12-10T02:27:00.000Z',
      p85At: '2026-12-11T06:00:00.000Z',
      runs: 100,
      historyDays: 90,
      remainingSteps: 7,
      standardMinutes: 138,
      drivingKind: 'cure',
      drivingWaitMinutes: 840,
      traysOnHold: 1,
    },
  },
];

function render(stages: StageDescriptionInput[], notes: ProjectionNote[]): { stage: string[]; note: string[] } {
  let out = { stage: [] as string[], note: [] as string[] };
  function Probe() {
    const s = useStageNote();
    const n = useProjectionNote();
    out = { stage: stages.map((x) => s(stageNote(x))), note: notes.map(n) };
    return null;
  }
  renderToStaticMarkup(createElement(Probe));
  return out;
}

describe('stage and projection notes on screens', () => {
  it('rounds hours as the English line does: one decimal below ten hours, whole hours above', () => {
    expect(roundHours(138)).toBe(2.3);
    expect(roundHours(840)).toBe(14);
  });

  it('English: the same words as the English line in the API answer', () => {
    setFactoryTimeZone(ZONE);
    applyLocale('en');
    const { stage, note } = render(STAGES, NOTES);
    expect(stage).toEqual(STAGES.map(describeStage));
    expect(note).toEqual(NOTES.map((n) => projectionNoteEnglish(n, ZONE)));
    // worked out by hand: the expected instant in Shanghai, and the numbers written in
    expect(note[3]).toContain('Expected Thu 10 Dec, 10:27, and by Fri 11 Dec, 14:00 in 85 of 100 simulated runs');
    expect(note[3]).toContain('7 steps left: 2.3 h of standard work. The longest waiting is at curing oven (about 14 h a run). 1 tray is on hold.');
    expect(stage[1]).toBe(
      'Colour: enamel colours are being filled and cured. 2 trays at colour fill, 1 tray at curing oven, 1 tray at plating, 1 tray dispatched. 1 tray is on hold.',
    );
  });

  it('Chinese: said in Chinese, no English words of ours left', () => {
    setFactoryTimeZone(ZONE);
    applyLocale('zh-CN');
    const { stage, note } = render(STAGES, NOTES);
    for (const line of [...stage, ...note]) expect(line.match(/[A-Za-z]{3,}/g) ?? [], line).toEqual([]);
    expect(stage[1]).toContain('填色 2 个托盘');
    expect(note[3]).toContain('12月10日周四');
    expect(note[3]).toContain('10:27');
    applyLocale('en');
  });
});
