// The measured calibration the app shows beside projected dates: how many held-out orders of
// the backtest shipped by their 85th-percentile date (Gneiting & Raftery 2007: a forecast's
// calibration is judged on outcomes it did not see). `npm run backtest -- --write` keeps it in
// coverage.json next to this file; the server reads it once.
import fs from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import type { ProjectionCoverage } from '@shared/schemas/projections';
import type { BacktestResult } from './backtest';
import { PROJECT_ROOT } from '../lib/project-root';

export const COVERAGE_FILE = path.join(PROJECT_ROOT, 'server', 'backtest', 'coverage.json');

const cutSchema = z.object({ n: z.number().int().min(0), p85Coverage: z.number().min(0).max(1), biasHours: z.number(), maeHours: z.number() });
const fileSchema = z.object({
  measuredOn: z.iso.date(),
  floors: z.number().int().min(1),
  atRelease: cutSchema,
  halfway: cutSchema,
  snapshots: cutSchema,
});
export type CoverageFile = z.infer<typeof fileSchema>;

export function coverageOf(r: BacktestResult, at: Date): CoverageFile {
  return { measuredOn: at.toISOString().slice(0, 10), floors: r.floors, atRelease: r.atRelease, halfway: r.halfway, snapshots: r.snapshots };
}

/** The daily snapshots are the fairest single figure for a date shown on any day of an order's life. */
export function toCoverage(f: CoverageFile): ProjectionCoverage {
  return { p85Coverage: f.snapshots.p85Coverage, measuredOn: f.measuredOn, floors: f.floors, orders: f.snapshots.n };
}

let cached: { coverage: ProjectionCoverage | null } | null = null;

/** The kept coverage, or null when the backtest has not been kept (or the file is damaged). */
export function measuredCoverage(): ProjectionCoverage | null {
  if (cached) return cached.coverage;
  let coverage: ProjectionCoverage | null = null;
  try {
    const parsed = fileSchema.safeParse(JSON.parse(fs.readFileSync(COVERAGE_FILE, 'utf8')));
    if (parsed.success) coverage = toCoverage(parsed.data);
  } catch {
    coverage = null;
  }
  cached = { coverage };
  return coverage;
}
