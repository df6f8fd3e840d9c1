import { describe, expect, it } from 'vitest';
import { productionStory, stageStoryText } from './production-story';

const H = 3_600_000;
const t0 = Date.UTC(2026, 10, 2, 8);

describe('production story', () => {
  it('tells hard enamel colour work as one colour at a time, cured two hours or more', () => {
    // common practice: each hard-enamel colour cures in an oven for two hours or more before the next
    expect(stageStoryText('hard_enamel', 'colour', 'en')).toMatch(/one colour at a time/);
    expect(stageStoryText('hard_enamel', 'colour', 'en')).toMatch(/two hours or more/);
    expect(stageStoryText('hard_enamel', 'colour', 'zh-CN')).toMatch(/两小时或更久/);
    // soft enamel is plated before its colours go in (common practice)
    expect(stageStoryText('soft_enamel', 'finishing_plating', 'en')).toMatch(/plated first/);
  });

  it('dates each begun stage from the scans and closes only the stages that are done', () => {
    const story = productionStory({
      process: 'hard_enamel',
      releasedAt: t0,
      shippedAt: null,
      done: new Set(['artwork_moulds', 'metal_forming']),
      steps: [
        { stationKind: 'engrave', firstStart: t0 + 1 * H, lastFinish: t0 + 5 * H },
        { stationKind: 'mould_check', firstStart: t0 + 6 * H, lastFinish: t0 + 7 * H },
        { stationKind: 'strike', firstStart: t0 + 8 * H, lastFinish: t0 + 10 * H },
        { stationKind: 'post', firstStart: t0 + 11 * H, lastFinish: t0 + 12 * H },
        { stationKind: 'fill', firstStart: t0 + 13 * H, lastFinish: t0 + 14 * H },
        { stationKind: 'cure', firstStart: t0 + 14 * H, lastFinish: null },
      ],
      photos: [
        { id: 'p2', stationKind: 'fill', takenAt: t0 + 14 * H },
        { id: 'p1', stationKind: 'strike', takenAt: t0 + 9 * H },
        { id: 'p3', stationKind: null, takenAt: t0 + 15 * H },
      ],
    });
    expect(story.map((s) => s.stage)).toEqual(['artwork_moulds', 'metal_forming', 'colour']);
    expect(story[0]).toMatchObject({ startedAt: t0, doneAt: t0 + 7 * H });
    expect(story[1]).toMatchObject({ startedAt: t0 + 8 * H, doneAt: t0 + 12 * H, photoIds: ['p1'] });
    // colour has begun but is not done: no end date although one fill finished
    // p3 was not taken with a scan: it goes with the latest stage begun before it (colour)
    expect(story[2]).toMatchObject({ startedAt: t0 + 13 * H, doneAt: null, photoIds: ['p2', 'p3'] });
  });

  it('has nothing before release', () => {
    expect(productionStory({ process: 'hard_enamel', releasedAt: null, shippedAt: null, done: new Set(), steps: [], photos: [] })).toEqual([]);
  });
});
