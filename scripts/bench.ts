// `npm run bench`: the speed and memory figures reported in the README. Never run as a test:
// this machine is shared and noisy, so figures are reported, not asserted.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawnSync } from 'node:child_process';

type Figures = Record<string, unknown>;
interface Section {
  name: string;
  module: string;
  run: (mod: any) => Promise<Figures>;
}

const sections: Section[] = [
  {
    name: 'Travellers PDF (100 trays)',
    module: './bench/travellers.ts',
    run: async (m) => {
      const a6 = await m.benchTravellers('a6');
      return { 'A6 cards: ms': Math.round(a6.ms), 'A6 cards: bytes': a6.bytes };
    },
  },
  { name: 'Scans', module: './bench/scans.ts', run: (m) => m.benchScans() },
  { name: 'Ship-date projection (200 open orders)', module: './bench/projection.ts', run: (m) => m.benchProjection() },
  { name: 'Reports, WIP and the wall at a year of history', module: './bench/reports.ts', run: (m) => m.benchReports() },
];

// The servers measured here run the production bundle, as `npm start` does.
const build = spawnSync('npm', ['run', 'build', '--silent'], { cwd: path.join(import.meta.dirname, '..'), stdio: 'inherit' });
if (build.status !== 0) process.exit(build.status ?? 1);

const only = process.argv.slice(2);
const results: Record<string, Figures> = {};
console.log(`Trayce bench · ${new Date().toISOString()} · node ${process.version} · ${os.cpus().length} cores · ${Math.round(os.totalmem() / 2 ** 30)} GiB`);
for (const section of sections) {
  if (only.length && !only.some((o) => section.name.toLowerCase().includes(o.toLowerCase()))) continue;
  const file = path.join(import.meta.dirname, section.module);
  if (!fs.existsSync(file)) {
    console.log(`\n## ${section.name}\n(not measured: ${section.module} is missing)`);
    continue;
  }
  console.log(`\n## ${section.name}`);
  const started = Date.now();
  const figures = await section.run(await import(file));
  results[section.name] = figures;
  for (const [k, v] of Object.entries(figures)) console.log(`  ${k.padEnd(48)} ${typeof v === 'number' ? v.toLocaleString('en-GB') : String(v)}`);
  console.log(`  (section took ${((Date.now() - started) / 1000).toFixed(1)} s)`);
}
const out = path.join(import.meta.dirname, '..', '.tmp', 'bench-results.json');
fs.mkdirSync(path.dirname(out), { recursive: true });
fs.writeFileSync(out, JSON.stringify({ at: new Date().toISOString(), results }, null, 2));
console.log(`\nwritten to ${path.relative(process.cwd(), out)}`);
