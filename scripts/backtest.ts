// `npm run backtest [floors] [-- --write]`: projected ship dates against what happened, on
// invented floors made by the demo simulator. Prints the table and writes .tmp/backtest.json;
// with --write it also keeps the measured coverage in server/backtest/coverage.json, which the
// app shows beside every projected date. `npm run backtest -- --fit` instead re-fits the
// conformal width of the 85 % date on the tune floors (never the scored ones) and prints the
// constants to keep as `P85_WIDTH` in shared/domain/floor-projection.ts.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { formatTable, runBacktest } from '../server/backtest/backtest';
import { COVERAGE_FILE, coverageOf } from '../server/backtest/coverage';
import { productProjector } from '../server/backtest/projector';
import { fitP85Width } from '../server/backtest/calibration';
import { P85_WIDTH } from '../shared/domain/floor-projection';
import { PROJECTION_RUNS } from '../server/services/projection.service';

const args = process.argv.slice(2);
const write = args.includes('--write');
const floors = Number(args.find((a) => !a.startsWith('--')) ?? 12);
if (!Number.isInteger(floors) || floors < 1) {
  console.error('usage: npm run backtest [number of floors, default 12] [-- --write | --fit]');
  process.exit(2);
}
const started = Date.now();
if (args.includes('--fit')) {
  console.log(`Fitting the 85 % width · ${floors} tune floors of 70 days · ${PROJECTION_RUNS} runs a projection`);
  const fit = fitP85Width({
    runs: PROJECTION_RUNS,
    floors,
    onFloor: (i) => process.stdout.write(`  floor ${i + 1} of ${floors} (${((Date.now() - started) / 1000).toFixed(0)} s)\n`),
  });
  console.log(`\ncalibration cuts: ${fit.n.justReleased} just released, ${fit.n.underWay} under way (${fit.seedPrefix}-1 … -${fit.floors})`);
  console.log(`kept now:  justReleasedHours ${P85_WIDTH.justReleasedHours}, justReleased ${P85_WIDTH.justReleased}, underWay ${P85_WIDTH.underWay}`);
  const w = fit.width;
  console.log(
    `fitted:    export const P85_WIDTH = { justReleasedHours: ${w.justReleasedHours}, justReleased: ${w.justReleased}, underWay: ${w.underWay} } as const;`,
  );
  console.log(`${((Date.now() - started) / 1000).toFixed(1)} s`);
  process.exit(0);
}
console.log(`Backtest · ${floors} floors of 70 days · ${PROJECTION_RUNS} runs a projection · ${os.cpus().length} cores`);
const result = runBacktest(productProjector(PROJECTION_RUNS), {
  floors,
  onFloor: (i) => process.stdout.write(`  floor ${i + 1} of ${floors} (${((Date.now() - started) / 1000).toFixed(0)} s)\n`),
});
console.log(`\n${formatTable(result)}\n`);
const out = path.join(import.meta.dirname, '..', '.tmp', 'backtest.json');
fs.mkdirSync(path.dirname(out), { recursive: true });
fs.writeFileSync(out, JSON.stringify(result, null, 2));
console.log(`${((Date.now() - started) / 1000).toFixed(1)} s · written to ${path.relative(process.cwd(), out)}`);
if (write) {
  fs.writeFileSync(COVERAGE_FILE, `${JSON.stringify(coverageOf(result, new Date()), null, 2)}\n`);
  console.log(`coverage kept in ${path.relative(process.cwd(), COVERAGE_FILE)}`);
}
