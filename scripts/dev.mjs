// `npm run dev`: the API with reload (tsx watch) on PORT+1 behind Vite's dev server on PORT.
import { spawn } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const port = Number(process.env.PORT ?? 5180);
const apiPort = port + 1;
const children = [
  spawn('npx', ['tsx', 'watch', '--clear-screen=false', 'server/index.ts'], { cwd: root, stdio: 'inherit', env: { ...process.env, PORT: String(apiPort) } }),
  spawn('npx', ['vite', '--port', String(port), '--strictPort'], { cwd: root, stdio: 'inherit', env: { ...process.env, TRAYCE_API_PORT: String(apiPort) } }),
];
const stop = () => children.forEach((c) => c.kill('SIGTERM'));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
children.forEach((c) => c.on('exit', (code) => (stop(), process.exit(code ?? 0))));
