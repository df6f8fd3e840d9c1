import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { PROJECT_ROOT } from '../support/paths';
import { startServer } from '../support/server-process';

/** Builds the client and the server bundle once, then serves the demo factory for the browser tests. */
export default async function setup() {
  const build = spawnSync('npm', ['run', 'build', '--silent'], { cwd: PROJECT_ROOT, stdio: 'inherit' });
  if (build.status !== 0) throw new Error('the build failed');
  fs.rmSync(path.join(PROJECT_ROOT, '.tmp', 'e2e'), { recursive: true, force: true });
  const server = await startServer({ seed: 'demo' });
  process.env.TRAYCE_E2E_URL = server.url;
  process.env.TRAYCE_E2E_DATA = server.dataDir;
  return async () => {
    await server.stop();
  };
}
