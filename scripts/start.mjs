// `npm start`: build the client when it is missing or older than its sources, then serve API and
// client on one port (the server migrates and seeds an empty database on start).
import { spawnSync, spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const built = path.join(root, 'dist', 'index.html');

function newestMtime(target) {
  const stat = fs.statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = 0;
  for (const entry of fs.readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

const sources = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'package-lock.json'].map((p) => path.join(root, p));
const stale = !fs.existsSync(built) || Math.max(...sources.filter(fs.existsSync).map(newestMtime)) > fs.statSync(built).mtimeMs;
if (stale) {
  console.log('Building the client…');
  const result = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) process.exit(result.status ?? 1);
}

const server = spawn('npx', ['tsx', 'server/index.ts'], {
  cwd: root,
  stdio: 'inherit',
  env: { NODE_ENV: 'production', ...process.env },
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code) => process.exit(code ?? 0));
