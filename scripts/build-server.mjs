// Bundles the server (our code only; packages stay in node_modules) into dist-server/ so
// `npm start` runs plain Node: half the memory and a faster start than transpiling on load.
import { build } from 'esbuild';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
await build({
  entryPoints: [path.join(root, 'server/index.ts'), path.join(root, 'server/db/backup-cli.ts'), path.join(root, 'server/db/migrate-cli.ts')],
  outdir: path.join(root, 'dist-server'),
  outExtension: { '.js': '.mjs' },
  entryNames: '[name]',
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'esm',
  packages: 'external',
  tsconfig: path.join(root, 'tsconfig.json'),
  sourcemap: 'linked',
  logLevel: 'warning',
});
