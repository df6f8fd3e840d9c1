// How fast POST /api/scans takes scans, on a database holding a year of history, side by side
// with what the machine can do at all in the same run:
// - accepted events per second sent in batches of 500 (one client, sequential batches), against
//   raw SQLite writes of the same rows with the same durability (WAL, synchronous=FULL, one
//   commit per 500 rows);
// - p50/p95 latency of single-event posts with 20 concurrent clients, against a bare Express JSON
//   echo at the same concurrency.
// Called by `npm run bench`; also runnable alone: npx tsx scripts/bench/scans.ts
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { spawn } from 'node:child_process';
import { performance } from 'node:perf_hooks';
import Database from 'better-sqlite3';
import { generateYearOfHistory } from './reports';
import { openDb, migrateDb } from '../../server/db/client';
import { usersService } from '../../server/services/users.service';
import { stationsRepository } from '../../server/repositories/stations.repository';
import { insertFloorOrder, type FloorTray } from '../../tests/support/scan-fixtures';
import { startServer, type ServerProcess } from '../../tests/support/server-process';
import { PROJECT_ROOT } from '../../tests/support/paths';
import { quantile } from '../../shared/domain/stats';
import { uuidv7 } from '../../shared/domain/event-id';

const BATCH = 500;
const CLIENTS = 20;

export interface ScanBenchOptions {
  /** scan events in the year of history (default 1,000,000) */
  minEvents?: number;
  /** trays scanned in batches (each gets a start and a finish) */
  batchTrays?: number;
  /** single-event posts made by the 20 clients together */
  singlePosts?: number;
}

const round1 = (x: number) => Math.round(x * 10) / 10;

async function signIn(url: string, who: { email: string; password: string }): Promise<string> {
  const res = await fetch(`${url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(who) });
  if (!res.ok) throw new Error(`bench sign-in failed: ${res.status}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

/** A scan as a tablet makes it (its id a time-ordered UUIDv7, like the tablets'). */
function event(tray: FloorTray, stationId: string, type: 'start' | 'finish', at: number) {
  return { id: uuidv7(), code: tray.code, stationId, type, occurredAt: new Date(at).toISOString() };
}

async function post(url: string, body: unknown, cookie?: string): Promise<{ ms: number; json: any }> {
  const t = performance.now();
  const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json', ...(cookie ? { cookie } : {}) }, body: JSON.stringify(body) });
  const json = await res.json();
  const ms = performance.now() - t;
  if (!res.ok) throw new Error(`${url}: ${res.status} ${JSON.stringify(json).slice(0, 200)}`);
  return { ms, json };
}

/** `CLIENTS` workers take bodies from one queue, one request each at a time; the latency of each. */
async function concurrent(url: string, bodies: unknown[], cookie?: string): Promise<{ latencies: number[]; wallMs: number; answers: any[] }> {
  const latencies: number[] = [];
  const answers: any[] = [];
  let next = 0;
  const t = performance.now();
  await Promise.all(
    Array.from({ length: CLIENTS }, async () => {
      for (;;) {
        const i = next++;
        if (i >= bodies.length) return;
        const r = await post(url, bodies[i], cookie);
        latencies.push(r.ms);
        answers.push(r.json);
      }
    }),
  );
  return { latencies, wallMs: performance.now() - t, answers };
}

function startEcho(): Promise<{ url: string; stop: () => Promise<void> }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', path.join(PROJECT_ROOT, 'scripts', 'bench', 'echo-server.ts')], {
      cwd: PROJECT_ROOT,
      env: { ...process.env, NODE_ENV: 'production' },
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    child.stdout!.on('data', (d: Buffer) => {
      const m = /listening (\d+)/.exec(String(d));
      if (m)
        resolve({
          url: `http://127.0.0.1:${m[1]}`,
          stop: () =>
            new Promise<void>((done) => {
              child.once('exit', () => done());
              child.kill('SIGTERM');
            }),
        });
    });
    child.once('exit', (code) => reject(new Error(`echo server exited ${code}`)));
  });
}

/** Raw better-sqlite3 inserts of the same rows into scan_events, same pragmas as the server, 500 rows per commit. */
function rawSqlite(
  dir: string,
  rows: { id: string; trayId: string; type: string; stepSeq: number; stationId: string; at: number }[],
  synchronous: 'FULL' | 'NORMAL',
) {
  const file = path.join(dir, `raw-${synchronous}.db`);
  const drizzleDb = openDb(file);
  migrateDb(drizzleDb);
  drizzleDb.$client.close();
  const db = new Database(file);
  db.pragma('journal_mode = WAL');
  db.pragma(`synchronous = ${synchronous}`);
  db.pragma('foreign_keys = OFF'); // the trays are not in this file; the server's check of them is part of its own cost
  const ins = db.prepare(`insert into scan_events (id, tray_id, type, step_seq, station_id, station_kind, user_id, occurred_at, received_at, qty_in)
    values (?, ?, ?, ?, ?, 'trim', null, ?, ?, 100)`);
  const commit = db.transaction((part: typeof rows) => {
    for (const r of part) ins.run(r.id, r.trayId, r.type, r.stepSeq, r.stationId, r.at, Date.now());
  });
  const t = performance.now();
  for (let i = 0; i < rows.length; i += BATCH) commit(rows.slice(i, i + BATCH));
  const ms = performance.now() - t;
  db.close();
  return rows.length / (ms / 1000);
}

export async function benchScans(options: ScanBenchOptions = {}): Promise<Record<string, number | string>> {
  const batchTrays = options.batchTrays ?? 10_000;
  const singlePosts = options.singlePosts ?? 4_000;
  const h = await generateYearOfHistory({ minEvents: options.minEvents ?? 1_000_000 });
  const figures: Record<string, number | string> = { 'history: scan events': h.events, 'history: trays': h.trays };
  const now = Date.now();
  const trim = stationsRepository.byCode(h.deps.db, 'TRM-1')!.id;
  const trays: FloorTray[] = [];
  for (let made = 0; made < batchTrays + singlePosts; made += BATCH) {
    trays.push(
      ...insertFloorOrder(h.deps, { trays: Math.min(BATCH, batchTrays + singlePosts - made), quantity: 100, releasedAt: now - 3600_000, stepSeq: 2 }).trays,
    );
  }
  const operator = { email: 'bench.scanner@bench.trayce.local', password: 'bench-scanner-password' };
  await usersService.create(h.deps, { name: 'Bench Scanner', email: operator.email, role: 'operator', password: operator.password }, null);
  h.deps.db.$client.pragma('wal_checkpoint(TRUNCATE)');
  h.deps.db.$client.close();

  const forBatches = trays.slice(0, batchTrays);
  const forSingles = trays.slice(batchTrays);
  const starts = forBatches.map((t, i) => event(t, trim, 'start', now - 30 * 60_000 + i));
  const finishes = forBatches.map((t, i) => event(t, trim, 'finish', now - 10 * 60_000 + i));
  const batchEvents = [...starts, ...finishes];

  // The same rows written raw, with the same durability, in the same run.
  const rawDir = path.join(PROJECT_ROOT, '.tmp', 'bench', `raw-${crypto.randomUUID().slice(0, 8)}`);
  fs.mkdirSync(rawDir, { recursive: true });
  const rawRows = batchEvents.map((e, i) => ({
    id: e.id,
    trayId: forBatches[i % batchTrays].id,
    type: e.type,
    stepSeq: 2,
    stationId: trim,
    at: Date.parse(e.occurredAt),
  }));
  const rawFull = rawSqlite(rawDir, rawRows, 'FULL');
  const rawNormal = rawSqlite(rawDir, rawRows, 'NORMAL');
  fs.rmSync(rawDir, { recursive: true, force: true });

  let server: ServerProcess | null = null;
  let echo: Awaited<ReturnType<typeof startEcho>> | null = null;
  try {
    server = await startServer({ seed: 'none', dataDir: h.dataDir, env: { LOG_LEVEL: 'warn' } });
    const cookie = await signIn(server.url, operator);
    const scansUrl = `${server.url}/api/scans`;
    // warm up (code paths, statement caches) with refused scans of unknown trays
    for (let i = 0; i < 20; i++) await post(scansUrl, { events: [{ ...event(forSingles[0], trim, 'finish', now), code: `99999-${i}` }] }, cookie);

    // 1. batches of 500, one after another
    const batchMs: number[] = [];
    let accepted = 0;
    const t0 = performance.now();
    for (let i = 0; i < batchEvents.length; i += BATCH) {
      const r = await post(scansUrl, { events: batchEvents.slice(i, i + BATCH) }, cookie);
      batchMs.push(r.ms);
      accepted += (r.json.results as { status: string }[]).filter((x) => x.status === 'accepted').length;
    }
    const totalMs = performance.now() - t0;
    const perSecond = accepted / (totalMs / 1000);
    figures['batches of 500: events sent'] = batchEvents.length;
    figures['batches of 500: accepted'] = accepted;
    figures['batches of 500: accepted events/s'] = Math.round(perSecond);
    figures['batches of 500: p50 / p95 ms per batch'] = `${round1(quantile(batchMs, 0.5))} / ${round1(quantile(batchMs, 0.95))}`;
    figures['raw SQLite, same rows, WAL + FULL, 500 per commit: rows/s'] = Math.round(rawFull);
    figures['raw SQLite, same rows, WAL + NORMAL: rows/s'] = Math.round(rawNormal);
    figures['our batches as a share of raw FULL writes'] = `${round1((100 * perSecond) / rawFull)} %`;

    // 2. single-event posts, 20 clients at once
    const singles = forSingles.slice(0, singlePosts).map((t, i) => ({ events: [event(t, trim, 'start', now - 5 * 60_000 + i)] }));
    const ours = await concurrent(scansUrl, singles, cookie);
    const singleAccepted = ours.answers.filter((a) => a.results?.[0]?.status === 'accepted').length;
    echo = await startEcho();
    const echoUrl = `${echo.url}/echo`;
    const echoBodies = singles.map((b) => ({ ...b, results: [{ id: crypto.randomUUID(), status: 'accepted' }] }));
    await concurrent(echoUrl, echoBodies.slice(0, 200)); // warm up
    const bare = await concurrent(echoUrl, echoBodies);
    const p = (xs: number[], q: number) => round1(quantile(xs, q));
    figures['single scans, 20 clients: posts / accepted'] = `${singles.length} / ${singleAccepted}`;
    figures['single scans, 20 clients: p50 / p95 / p97.5 ms'] = `${p(ours.latencies, 0.5)} / ${p(ours.latencies, 0.95)} / ${p(ours.latencies, 0.975)}`;
    figures['single scans, 20 clients: posts/s'] = Math.round(singles.length / (ours.wallMs / 1000));
    figures['bare Express echo, 20 clients: p50 / p95 / p97.5 ms'] = `${p(bare.latencies, 0.5)} / ${p(bare.latencies, 0.95)} / ${p(bare.latencies, 0.975)}`;
    figures['single scan p95 ÷ echo p95'] = round1(quantile(ours.latencies, 0.95) / quantile(bare.latencies, 0.95));
    figures['percentiles'] = 'Hyndman & Fan type 7';
  } finally {
    await echo?.stop();
    await server?.stop();
    fs.rmSync(h.dataDir, { recursive: true, force: true });
  }
  return figures;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const small = process.argv.includes('--small');
  const figures = await benchScans(small ? { minEvents: 50_000, batchTrays: 2_000, singlePosts: 1_000 } : {});
  for (const [k, v] of Object.entries(figures)) console.log(`${k.padEnd(60)} ${v}`);
}
