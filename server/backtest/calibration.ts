// Re-fits the conformal width of the 85 % date (`P85_WIDTH` in shared/domain/floor-projection.ts):
// split conformal calibration (Lei, G'Sell, Rinaldo, Tibshirani & Wasserman 2018,
// "Distribution-Free Predictive Inference for Regression", JASA 113(523)). The calibration set
// is every cut of the backtest on floors of another seed prefix than the scored ones
// ('tune-floor' by default), projected with the runs' own 85th percentile; each cut scores
// (actual − expected) / (runs' 85th percentile − expected) in the factory's working time, and
// each group's factor is the ⌈(n + 1)·0.85⌉-th smallest of its scores.
import { conformalQuantile } from '@shared/domain/conformal';
import { P85_WIDTH, p85Score, type P85Width } from '@shared/domain/floor-projection';
import type { WorkingCalendar } from '@shared/domain/calendar';
import { runBacktest } from './backtest';
import { productProjector } from './projector';

export interface P85Fit {
  width: P85Width;
  /** calibration cuts per group */
  n: { justReleased: number; underWay: number };
  seedPrefix: string;
  floors: number;
}

export function fitP85Width(o: {
  runs: number;
  floors?: number;
  seedPrefix?: string;
  justReleasedHours?: number;
  level?: number;
  onFloor?: (i: number) => void;
}): P85Fit {
  const floors = o.floors ?? 12;
  const seedPrefix = o.seedPrefix ?? 'tune-floor';
  if (seedPrefix === 'backtest-floor') throw new Error('the width is fitted on other floors than the scored ones');
  const hours = o.justReleasedHours ?? P85_WIDTH.justReleasedHours;
  const level = o.level ?? 0.85;
  const released = new Map<string, number>();
  let calendar: WorkingCalendar | null = null;
  const scores = { justReleased: [] as number[], underWay: [] as number[] };
  runBacktest(productProjector(o.runs, null), {
    floors,
    seedPrefix,
    onFloor: (i, floor) => {
      o.onFloor?.(i);
      calendar = floor.calendar;
      released.clear();
      for (const s of floor.shipped) released.set(s.orderId, s.releasedAt);
    },
    onSample: (s) => {
      if (s.expectedAt == null || s.p85At == null || !calendar) return;
      const group = s.t - released.get(s.orderId)! < hours * 3_600_000 ? 'justReleased' : 'underWay';
      scores[group].push(p85Score(calendar.factory, s.expectedAt, s.p85At, s.actual));
    },
  });
  // rounded up, so the kept factor is never narrower than the fitted one
  const r3 = (x: number) => Math.ceil(x * 1000) / 1000;
  return {
    width: {
      justReleasedHours: hours,
      justReleased: r3(conformalQuantile(scores.justReleased, level)),
      underWay: r3(conformalQuantile(scores.underWay, level)),
    },
    n: { justReleased: scores.justReleased.length, underWay: scores.underWay.length },
    seedPrefix,
    floors,
  };
}
