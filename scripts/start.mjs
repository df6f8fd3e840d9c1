// `npm start`: build the client and the server bundle when missing or older than their sources,
// then serve API and client on one port (the server migrates and seeds an empty database on start).
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

const sources = (paths) => paths.map((p) => path.join(root, p)).filter(fs.existsSync);
const newest = (paths) => Math.max(...sources(paths).map(newestMtime));
const staleAgainst = (output, inputs) => !fs.existsSync(output) || newest(inputs) > fs.statSync(output).mtimeMs;

function run(label, command, args) {
  console.log(label);
  const result = spawnSync(command, args, { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) process.exit(result.status ?? 1);
}

if (staleAgainst(built, ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'package-lock.json']))
  run('Building the client…', 'npx', ['vite', 'build', '--logLevel', 'warn']);
const serverBundle = path.join(root, 'dist-server', 'index.mjs');
if (staleAgainst(serverBundle, ['server', 'shared', 'package-lock.json', 'scripts/build-server.mjs']))
  run('Building the server…', process.execPath, ['scripts/build-server.mjs']);

const server = spawn(process.execPath, ['--enable-source-maps', serverBundle], {
  cwd: root,
  stdio: 'inherit',
  env: { NODE_ENV: 'production', ...process.env },
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code) => process.exit(code ?? 0));
