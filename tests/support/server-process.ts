import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import crypto from 'node:crypto';
import { PROJECT_ROOT } from './paths';

export interface ServerProcess {
  url: string;
  port: number;
  dataDir: string;
  stop(): Promise<void>;
  restart(): Promise<void>;
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.listen(0, '127.0.0.1', () => {
      const port = (srv.address() as net.AddressInfo).port;
      srv.close(() => resolve(port));
    });
    srv.on('error', reject);
  });
}

// the demo seed simulates ten weeks of floor history before the server listens: about two minutes on
// one free core, more on a loaded machine; the wait ends as soon as the server answers
async function waitForHealth(url: string, child: ChildProcess, log: () => string, timeoutMs = 900_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`the server exited early:\n${log()}`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the server did not answer within ${timeoutMs} ms:\n${log()}`);
}

/** Runs the real server (built client, real SQLite file) in a child process. */
export async function startServer(
  options: { seed?: 'demo' | 'none'; dataDir?: string; port?: number; env?: Record<string, string> } = {},
): Promise<ServerProcess> {
  const port = options.port ?? (await freePort());
  const dataDir = options.dataDir ?? path.join(PROJECT_ROOT, '.tmp', 'e2e', `server-${crypto.randomUUID()}`);
  fs.mkdirSync(dataDir, { recursive: true });
  const url = `http://127.0.0.1:${port}`;
  let child: ChildProcess;
  let output = '';
  const launch = async () => {
    output = '';
    // the production bundle (npm run build), as `npm start` runs it
    child = spawn(process.execPath, ['--enable-source-maps', 'dist-server/index.mjs'], {
      cwd: PROJECT_ROOT,
      env: {
        ...process.env,
        NODE_ENV: 'production',
        PORT: String(port),
        TRAYCE_DATA_DIR: dataDir,
        TRAYCE_SEED: options.seed ?? 'demo',
        LOG_LEVEL: 'warn',
        ...options.env,
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout?.on('data', (d) => (output += d));
    child.stderr?.on('data', (d) => (output += d));
    await waitForHealth(url, child, () => output);
  };
  const stop = () =>
    new Promise<void>((resolve) => {
      // this process, not whatever `child` points at later (a restart launches a new one)
      const current = child;
      if (!current || current.exitCode !== null) return resolve();
      const force = setTimeout(() => current.kill('SIGKILL'), 5000);
      current.once('exit', () => (clearTimeout(force), resolve()));
      current.kill('SIGTERM');
    });
  await launch();
  return { url, port, dataDir, stop, restart: async () => (await stop(), await launch()) };
}
