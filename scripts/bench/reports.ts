// A year of history for a busy factory, and how fast WIP, the wall and every report answer on it.
// `generateYearOfHistory()` writes at least 1,000,000 scan events and 5,000 orders into a fresh
// database (bulk inserts in a few transactions); `benchReports()` then starts the real server on
// it in a child process and times WIP, each report over 90 days and over a year, and the wall's
// first load, and reads the server's peak memory. Called by `npm run bench`; also runnable
// alone: npx tsx scripts/bench/reports.ts
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { boot } from '../../server/boot';
import { loadEnv } from '../../server/env';
import type { AppDeps } from '../../server/app-deps';
import { sqlClient } from '../../server/repositories/sql-client';
import { reportFactsService } from '../../server/services/report-facts.service';
import { usersService } from '../../server/services/users.service';
import { calendarService } from '../../server/services/calendar.service';
import { DEFAULT_ROUTING_TEMPLATES, expandRouting } from '../../shared/domain/routing';
import { seededRandom } from '../../shared/domain/stats';
import { PLATINGS, PROCESSES, standardMinutes, type Process, type RoutingStep } from '../../shared/domain/vocabulary';
import { startServer, type ServerProcess } from '../../tests/support/server-process';
import { PROJECT_ROOT } from '../../tests/support/paths';
import { cures } from '../../shared/domain/traveller/station-kinds';

const MIN = 60_000;
const DAY = 24 * 60 * MIN;

export interface HistoryOptions {
  dataDir?: string;
  days?: number;
  minEvents?: number;
  minOrders?: number;
  seed?: number;
  /** the end of the history (default: now) */
  now?: number;
}

export interface GeneratedHistory {
  dataDir: string;
  deps: AppDeps;
  orders: number;
  trays: number;
  events: number;
  generateMs: number;
  stepRunsMs: number;
  manager: { email: string; password: string };
}

// Mean queue (working minutes) before a step of each kind: the oven and plating are the slow spots.
const QUEUE_MEAN: Record<string, number> = { cure: 50, plate: 240, pack: 180, dispatch: 300, fill: 90, inspect: 120 };
const SCRAP_REASON: Record<string, string> = {
  strike: 'misstrike',
  cast: 'casting_porosity',
  post: 'bent_post',
  fill: 'colour_bleed',
  stone: 'over_stoned',
  plate: 'plating_defect',
  print: 'print_misregister',
  epoxy: 'epoxy_bubble',
  inspect: 'scratch',
};

/** Writes a year of orders, trays, scan events and tray states. */
export async function generateYearOfHistory(options: HistoryOptions = {}): Promise<GeneratedHistory> {
  const started = performance.now();
  const dataDir = options.dataDir ?? path.join(PROJECT_ROOT, '.tmp', 'bench', `year-${crypto.randomUUID().slice(0, 8)}`);
  fs.rmSync(dataDir, { recursive: true, force: true });
  fs.mkdirSync(dataDir, { recursive: true });
  const env = loadEnv({ TRAYCE_DATA_DIR: dataDir, TRAYCE_SEED: 'none', LOG_LEVEL: 'silent', NODE_ENV: 'production' });
  const deps = await boot(env);
  const db = sqlClient(deps.db);
  const now = options.now ?? Math.floor(Date.now() / MIN) * MIN;
  const days = options.days ?? 365;
  const start = now - days * DAY;
  const minEvents = options.minEvents ?? 1_000_000;
  const minOrders = options.minOrders ?? 5_000;
  const rnd = seededRandom(options.seed ?? 20250101);
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
  const exp = (mean: number) => -Math.log(1 - rnd()) * mean;
  const logNormal = (sigma: number) => Math.exp(sigma * Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd()) - (sigma * sigma) / 2);

  const manager = { email: 'bench.manager@bench.trayce.local', password: 'bench-manager-password' };
  await usersService.create(deps, { name: 'Bench Manager', email: manager.email, role: 'manager', password: manager.password }, null);
  const operatorId = (
    await usersService.create(
      deps,
      { name: 'Bench Operator', email: 'bench.operator@bench.trayce.local', role: 'operator', password: 'bench-operator-password' },
      null,
    )
  ).id;
  const stations = db.prepare('select id, kind from stations where active = 1').all() as { id: string; kind: string }[];
  const stationsOf = new Map<string, string[]>();
  for (const s of stations) stationsOf.set(s.kind, [...(stationsOf.get(s.kind) ?? []), s.id]);
  const cal = calendarService.calendar(deps);

  const customers = Array.from({ length: 400 }, (_, i) => ({ id: crypto.randomUUID(), name: `Bench customer ${String(i + 1).padStart(3, '0')}` }));
  const insCustomer = db.prepare('insert into customers (id, name, created_at, updated_at) values (?, ?, ?, ?)');
  const insOrder =
    db.prepare(`insert into orders (id, number, customer_id, title, process, material, size_mm, quantity, overrun_pct, colours, plating, backing_type, backing_count,
    back_logo, printing, epoxy, packaging, due_date, notes, status, design_key, tray_size, released_at, packed_at, shipped_at, created_at, updated_at)
    values (?, ?, ?, ?, ?, ?, 25, ?, 5, ?, ?, 'butterfly_clutch', 1, 0, ?, ?, 'individual_bag', ?, '', ?, ?, 200, ?, ?, ?, ?, ?)`);
  const updOrder = db.prepare(`update orders set status = 'shipped', packed_at = ?, shipped_at = ?, updated_at = ? where id = ?`);
  const insStep = db.prepare(`insert into order_steps (id, order_id, traveller_kind, seq, name, station_kind, tray_minutes, piece_minutes, cure_minutes, colour)
    values (?, ?, 'tray', ?, ?, ?, ?, ?, ?, ?)`);
  const insTray = db.prepare(
    `insert into trays (id, number, kind, order_id, revision, quantity, released_at, created_at) values (?, ?, 'tray', ?, 1, ?, ?, ?)`,
  );
  const insState =
    db.prepare(`insert into tray_states (tray_id, kind, phase, step_seq, station_kind, quantity, station_id, started_at, waiting_since, cure_ready_at,
    on_hold, hold_reason, released_at, last_event_at, updated_at) values (?, 'tray', ?, ?, ?, ?, ?, ?, ?, ?, 0, null, ?, ?, ?)`);
  const insEvent =
    db.prepare(`insert into scan_events (id, tray_id, type, step_seq, station_id, station_kind, user_id, occurred_at, received_at, qty_in, good_qty, scrap_qty, rework_qty, scrap_reason)
    values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`);

  db.transaction(() => {
    for (const c of customers) insCustomer.run(c.id, c.name, start, start);
  })();

  const routings = new Map<string, RoutingStep[]>();
  const routingFor = (process: Process, colours: number, printing: boolean, epoxy: boolean) => {
    const key = `${process}|${colours}|${printing}|${epoxy}`;
    let r = routings.get(key);
    if (!r) {
      r = expandRouting(DEFAULT_ROUTING_TEMPLATES[process], {
        process,
        colours: Array.from({ length: colours }, () => ({})),
        backLogo: false,
        printing,
        epoxy,
        backing: { type: 'butterfly_clutch', count: 1 },
        plating: 'gold',
        secondPlating: null,
        sandblast: false,
      });
      routings.set(key, r);
    }
    return r;
  };

  let orders = 0;
  let trays = 0;
  let events = 0;
  // orders arrive at an even pace over the year; enough of them to pass both minimums
  const perDay = Math.max(minOrders / days, 14);
  let releaseClock = start;
  const tx = db.transaction((fn: () => void) => fn());
  while (orders < minOrders || events < minEvents) {
    tx(() => {
      for (let k = 0; k < 250; k++) {
        releaseClock += exp(DAY / perDay);
        const releasedAt = cal.factory.addWorkingMinutes(Math.min(releaseClock, now - 60 * MIN), 0);
        if (releasedAt >= now) break;
        const process = rnd() < 0.45 ? 'hard_enamel' : pick(PROCESSES);
        const colours = process === 'die_struck' || process === 'printed' ? 0 : 1 + Math.floor(rnd() * 4);
        const printing = rnd() < 0.15;
        const epoxy = process !== 'printed' && rnd() < 0.1;
        const routing = routingFor(process, colours, printing, epoxy);
        const quantity = 300 + Math.floor(rnd() * 17) * 100;
        const orderId = crypto.randomUUID();
        const number = `B${String(orders + 1).padStart(6, '0')}`;
        const leadDays = 12 + Math.floor(rnd() * 12);
        const dueDate = new Date(releasedAt + leadDays * DAY).toISOString().slice(0, 10);
        insOrder.run(
          orderId,
          number,
          pick(customers).id,
          `Bench badge ${orders + 1}`,
          process,
          process === 'die_cast_3d' ? 'zinc_alloy' : 'iron',
          quantity,
          JSON.stringify(Array.from({ length: colours }, (_, i) => ({ name: `Colour ${i + 1}` }))),
          pick(PLATINGS),
          printing ? 1 : 0,
          epoxy ? 1 : 0,
          dueDate,
          'in_production',
          `bench-${number}`,
          releasedAt,
          null,
          null,
          releasedAt,
          releasedAt,
        );
        for (const s of routing)
          insStep.run(crypto.randomUUID(), orderId, s.seq, s.name, s.stationKind, s.trayMinutes, s.pieceMinutes, s.cureMinutes ?? null, s.colour ?? null);
        const released = Math.ceil(quantity * 1.05);
        const traySizes: number[] = [];
        for (let left = released; left > 0; left -= 200) traySizes.push(Math.min(200, left));
        let lastFinish = 0;
        let allDone = true;
        traySizes.forEach((size, i) => {
          const trayId = crypto.randomUUID();
          insTray.run(trayId, `${number}-${String(i + 1).padStart(3, '0')}`, orderId, size, releasedAt, releasedAt);
          trays += 1;
          let t = releasedAt;
          let qty = size;
          let state: {
            phase: string;
            seq: number | null;
            kind: string | null;
            station: string | null;
            startedAt: number | null;
            waitingSince: number | null;
            cureReadyAt: number | null;
          } | null = null;
          let lastEvent = releasedAt;
          let cureOpen: { start: number; minutes: number; seq: number; kind: string; station: string } | null = null;
          for (const step of routing) {
            const line = cal.forStation(step.stationKind);
            const ready = cureOpen ? cureOpen.start + cureOpen.minutes * MIN : t;
            const startAt = line.addWorkingMinutes(Math.max(t, ready), exp(QUEUE_MEAN[step.stationKind] ?? 60));
            if (startAt >= now) {
              // still in the oven (or ready there: the guards read that as waiting for the next step)
              state = cureOpen
                ? {
                    phase: 'curing',
                    seq: cureOpen.seq,
                    kind: cureOpen.kind,
                    station: cureOpen.station,
                    startedAt: cureOpen.start,
                    waitingSince: null,
                    cureReadyAt: cureOpen.start + cureOpen.minutes * MIN,
                  }
                : { phase: 'waiting', seq: step.seq, kind: step.stationKind, station: null, startedAt: null, waitingSince: t, cureReadyAt: null };
              break;
            }
            cureOpen = null;
            const station = pick(stationsOf.get(step.stationKind) ?? [null as unknown as string]);
            insEvent.run(
              crypto.randomUUID(),
              trayId,
              'start',
              step.seq,
              station,
              step.stationKind,
              operatorId,
              startAt,
              startAt + 5_000,
              qty,
              null,
              null,
              null,
              null,
            );
            events += 1;
            lastEvent = startAt;
            if (cures(step.stationKind)) {
              // the oven closes on its own when the next step starts
              cureOpen = { start: startAt, minutes: step.cureMinutes ?? 0, seq: step.seq, kind: step.stationKind, station };
              t = startAt;
              continue;
            }
            const minutes = standardMinutes(step, qty) * logNormal(0.35);
            const finishAt = line.addWorkingMinutes(startAt, minutes);
            if (finishAt >= now) {
              state = { phase: 'in_process', seq: step.seq, kind: step.stationKind, station, startedAt: startAt, waitingSince: null, cureReadyAt: null };
              break;
            }
            const scrap = SCRAP_REASON[step.stationKind] && rnd() < 0.25 ? Math.min(qty - 1, Math.floor(exp(qty * 0.01))) : 0;
            const good = qty - scrap;
            const rework = step.stationKind === 'fill' || step.stationKind === 'inspect' ? (rnd() < 0.1 ? Math.floor(good * 0.03) : 0) : 0;
            insEvent.run(
              crypto.randomUUID(),
              trayId,
              'finish',
              step.seq,
              station,
              step.stationKind,
              operatorId,
              finishAt,
              finishAt + 5_000,
              qty,
              good,
              scrap,
              rework,
              scrap ? SCRAP_REASON[step.stationKind] : null,
            );
            events += 1;
            lastEvent = finishAt;
            qty = good;
            t = finishAt;
          }
          if (!state) {
            insState.run(trayId, 'done', null, null, qty, null, null, null, null, releasedAt, lastEvent, lastEvent);
            lastFinish = Math.max(lastFinish, lastEvent);
          } else {
            allDone = false;
            insState.run(
              trayId,
              state.phase,
              state.seq,
              state.kind,
              qty,
              state.station,
              state.startedAt,
              state.waitingSince,
              state.cureReadyAt,
              releasedAt,
              lastEvent,
              lastEvent,
            );
          }
        });
        if (allDone) updOrder.run(lastFinish, lastFinish, lastFinish, orderId);
        orders += 1;
      }
    });
    if (releaseClock >= now - 60 * MIN) {
      // the year is full: pack the remaining orders in faster
      releaseClock = start + rnd() * days * DAY;
    }
  }
  const generateMs = performance.now() - started;
  const t1 = performance.now();
  reportFactsService.catchUp(deps, { full: true });
  const stepRunsMs = performance.now() - t1;
  db.pragma('wal_checkpoint(TRUNCATE)');
  return { dataDir, deps, orders, trays, events, generateMs, stepRunsMs, manager };
}

async function signIn(url: string, who: { email: string; password: string }): Promise<string> {
  const res = await fetch(`${url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(who) });
  if (!res.ok) throw new Error(`bench sign-in failed: ${res.status}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

async function timed(url: string, cookie: string, path: string): Promise<{ ms: number; bytes: number }> {
  const t = performance.now();
  const res = await fetch(`${url}${path}`, { headers: { cookie } });
  const body = await res.text();
  if (!res.ok) throw new Error(`${path}: ${res.status} ${body.slice(0, 200)}`);
  return { ms: performance.now() - t, bytes: body.length };
}

function peakRssMb(pid: number): number | null {
  try {
    const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
    const m = /VmHWM:\s+(\d+) kB/.exec(status);
    return m ? Math.round(Number(m[1]) / 1024) : null;
  } catch {
    return null;
  }
}

export async function benchReports(options: HistoryOptions = {}): Promise<Record<string, number | string>> {
  const h = await generateYearOfHistory(options);
  const figures: Record<string, number | string> = {
    'history: orders': h.orders,
    'history: trays': h.trays,
    'history: scan events': h.events,
    'generate the year: s': Math.round(h.generateMs / 100) / 10,
    'derive step runs (once): s': Math.round(h.stepRunsMs / 100) / 10,
  };
  h.deps.db.$client.close();
  let server: ServerProcess | null = null;
  try {
    server = await startServer({ seed: 'none', dataDir: h.dataDir, env: { LOG_LEVEL: 'warn' } });
    const pid = await findServerPid(server.port);
    const cookie = await signIn(server.url, h.manager);
    const wall = await timed(server.url, cookie, '/api/wall');
    figures['wall first load: ms'] = Math.round(wall.ms);
    const wip: number[] = [];
    for (let i = 0; i < 20; i++) wip.push((await timed(server.url, cookie, '/api/wip')).ms);
    wip.sort((a, b) => a - b);
    figures['WIP: median ms (20 calls)'] = Math.round(wip[10] * 10) / 10;
    figures['WIP: slowest ms'] = Math.round(wip[19] * 10) / 10;
    const end = new Date(Date.now()).toISOString().slice(0, 10);
    for (const [label, days] of [
      ['90 days', 90],
      ['a year', 365],
    ] as const) {
      const from = new Date(Date.now() - days * DAY).toISOString().slice(0, 10);
      for (const report of ['lead-time', 'cycle-time', 'flow', 'on-time', 'yield']) {
        const bucket = report === 'flow' || report === 'on-time' ? `&bucket=${days > 120 ? 'week' : 'day'}` : '';
        const path = `/api/reports/${report}?from=${from}&to=${end}${bucket}`;
        const first = await timed(server.url, cookie, path);
        const second = await timed(server.url, cookie, path);
        figures[`${report}, ${label}: ms (first / again)`] = `${Math.round(first.ms)} / ${Math.round(second.ms)}`;
      }
    }
    const lateRisk = await timed(server.url, cookie, '/api/reports/late-risk');
    figures['late-risk list: ms'] = Math.round(lateRisk.ms);
    if (pid) figures['server peak memory (VmHWM): MB'] = peakRssMb(pid) ?? 'unknown';
  } finally {
    await server?.stop();
    fs.rmSync(h.dataDir, { recursive: true, force: true });
  }
  return figures;
}

/** The pid of the process listening on that port (the spawned server). */
async function findServerPid(port: number): Promise<number | null> {
  const hex = port.toString(16).toUpperCase().padStart(4, '0');
  const inodes = new Set<string>();
  for (const f of ['/proc/net/tcp', '/proc/net/tcp6']) {
    try {
      for (const line of fs.readFileSync(f, 'utf8').split('\n').slice(1)) {
        const cols = line.trim().split(/\s+/);
        if (cols[1]?.endsWith(`:${hex}`) && cols[3] === '0A') inodes.add(cols[9]);
      }
    } catch {
      /* not Linux */
    }
  }
  for (const pid of fs.readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      for (const fd of fs.readdirSync(`/proc/${pid}/fd`)) {
        const link = fs.readlinkSync(`/proc/${pid}/fd/${fd}`);
        const m = /socket:\[(\d+)\]/.exec(link);
        if (m && inodes.has(m[1])) return Number(pid);
      }
    } catch {
      /* not ours */
    }
  }
  return null;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const figures = await benchReports();
  for (const [k, v] of Object.entries(figures)) console.log(`${k.padEnd(48)} ${v}`);
}
