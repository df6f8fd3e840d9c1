import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * The project folder, found by walking up to our package.json: the same answer whether the
 * server runs from its sources (tsx) or from the bundle in dist-server/.
 */
function findRoot(): string {
  let dir = path.dirname(fileURLToPath(import.meta.url));
  for (;;) {
    const pkg = path.join(dir, 'package.json');
    if (fs.existsSync(pkg) && JSON.parse(fs.readFileSync(pkg, 'utf8')).name === 'trayce') return dir;
    const parent = path.dirname(dir);
    if (parent === dir) throw new Error('Trayce cannot find its project folder (package.json named "trayce").');
    dir = parent;
  }
}

export const PROJECT_ROOT = findRoot();
