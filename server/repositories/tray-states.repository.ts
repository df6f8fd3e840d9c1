// The one owner of `tray_states` and `scan_events`: the row ↔ state mapping (the guards' TrayState
// with ISO instants ↔ the stored row with epoch ms) and every write of a traveller's state or an
// event row. The scan path, release, split and merge, the demo seed (with the floor simulator's
// output) and the test fixtures all write through here. Reads joined with other tables for a
// screen stay with that screen's repository and map their state columns with `stateFromRow`.
import { asc, eq, gte, sql } from 'drizzle-orm';
import type Database from 'better-sqlite3';
import type { DbLike as Db } from '../db/client';
import { trayStates } from '../db/schema/trays';
import { scanEvents } from '../db/schema/scans';
import { stations } from '../db/schema/stations';
import { users } from '../db/schema/users';
import { sqlClient } from './sql-client';
import type { RoutingStep, TrayState } from '@shared/domain/vocabulary';
import { iso } from '@shared/domain/time-zone';

export type TrayStateRow = typeof trayStates.$inferSelect;
export type ScanEventInsert = typeof scanEvents.$inferInsert;

const ms = (text: string | null | undefined) => (text == null ? null : Date.parse(text));

/** The guards' view of a stored state (instants as ISO text). */
export function stateFromRow(r: TrayStateRow): TrayState {
  return {
    trayId: r.trayId,
    kind: r.kind,
    phase: r.phase,
    stepSeq: r.stepSeq,
    quantity: r.quantity,
    stationId: r.stationId,
    startedAt: iso(r.startedAt),
    waitingSince: iso(r.waitingSince),
    cureReadyAt: iso(r.cureReadyAt),
    onHold: r.onHold,
    holdReason: r.holdReason,
    releasedAt: iso(r.releasedAt)!,
    lastEventAt: iso(r.lastEventAt),
  };
}

/** The stored row of a traveller's state; the station kind it waits for comes from its routing. */
export function rowFromState(s: TrayState, routing: readonly RoutingStep[], now: number): TrayStateRow {
  const step = s.stepSeq == null ? undefined : routing.find((r) => r.seq === s.stepSeq);
  return {
    trayId: s.trayId,
    kind: s.kind,
    phase: s.phase,
    stepSeq: s.stepSeq,
    stationKind: step?.stationKind ?? null,
    quantity: s.quantity,
    stationId: s.stationId,
    startedAt: ms(s.startedAt),
    waitingSince: ms(s.waitingSince),
    cureReadyAt: ms(s.cureReadyAt),
    onHold: s.onHold,
    holdReason: s.holdReason,
    releasedAt: ms(s.releasedAt)!,
    lastEventAt: ms(s.lastEventAt ?? null),
    updatedAt: now,
  };
}

// The scan path runs for every scan a tablet sends, so its statements are prepared once per
// connection and reused. Lists go in as one JSON array parameter, read with json_each.
const STATE_COLS = `tray_id as trayId, kind, phase, step_seq as stepSeq, station_kind as stationKind, quantity, station_id as stationId,
  started_at as startedAt, waiting_since as waitingSince, cure_ready_at as cureReadyAt, on_hold as onHold, hold_reason as holdReason,
  released_at as releasedAt, last_event_at as lastEventAt, updated_at as updatedAt`;
const IN_LIST = '(select value from json_each(?))';

function prepareAll(c: Database.Database) {
  return {
    acceptedIds: c.prepare(`select id from scan_events where id in ${IN_LIST}`).pluck(),
    statesByTrayIds: c.prepare(`select ${STATE_COLS} from tray_states where tray_id in ${IN_LIST}`),
    insertEvent: c.prepare(`insert into scan_events (id, tray_id, type, step_seq, station_id, station_kind, device_id, user_id, occurred_at, received_at,
      qty_in, good_qty, scrap_qty, rework_qty, scrap_reason, override_id, note, photo_hash)
      values (@id, @trayId, @type, @stepSeq, @stationId, @stationKind, @deviceId, @userId, @occurredAt, @receivedAt,
      @qtyIn, @goodQty, @scrapQty, @reworkQty, @scrapReason, @overrideId, @note, @photoHash)`),
    insertState: c.prepare(`insert into tray_states (tray_id, kind, phase, step_seq, station_kind, quantity, station_id, started_at, waiting_since,
      cure_ready_at, on_hold, hold_reason, released_at, last_event_at, updated_at)
      values (@trayId, @kind, @phase, @stepSeq, @stationKind, @quantity, @stationId, @startedAt, @waitingSince,
      @cureReadyAt, @onHold, @holdReason, @releasedAt, @lastEventAt, @updatedAt)`),
    updateState: c.prepare(`update tray_states set kind = @kind, phase = @phase, step_seq = @stepSeq, station_kind = @stationKind, quantity = @quantity,
      station_id = @stationId, started_at = @startedAt, waiting_since = @waitingSince, cure_ready_at = @cureReadyAt, on_hold = @onHold,
      hold_reason = @holdReason, released_at = @releasedAt, last_event_at = @lastEventAt, updated_at = @updatedAt where tray_id = @trayId`),
  };
}

const prepared = new WeakMap<Database.Database, ReturnType<typeof prepareAll>>();
function q(db: Db) {
  const c = sqlClient(db);
  let p = prepared.get(c);
  if (!p) {
    p = prepareAll(c);
    prepared.set(c, p);
  }
  return p;
}

const json = (xs: readonly string[]) => JSON.stringify(xs);
type RawState = Omit<TrayStateRow, 'onHold'> & { onHold: number };

export const trayStatesRepository = {
  // --- tray_states ----------------------------------------------------------------------
  byTrayIds: (db: Db, ids: string[]): TrayStateRow[] =>
    ids.length ? ((q(db).statesByTrayIds.all(json(ids)) as RawState[]).map((r) => ({ ...r, onHold: !!r.onHold })) as TrayStateRow[]) : [],

  byTrayId: (db: Db, trayId: string): TrayStateRow | undefined => trayStatesRepository.byTrayIds(db, [trayId])[0],

  /** Writes a traveller's state: an update almost always (the row exists from its release), an insert otherwise. */
  put(db: Db, row: TrayStateRow) {
    const p = q(db);
    const params = { ...row, onHold: row.onHold ? 1 : 0 };
    if (p.updateState.run(params).changes === 0) p.insertState.run(params);
  },

  /** The state of a traveller just made (released, or split off another). */
  insert(db: Db, row: TrayStateRow) {
    q(db).insertState.run({ ...row, onHold: row.onHold ? 1 : 0 });
  },

  /** Changes some columns of a stored state (a split's or merge's quantities). */
  patch: (db: Db, trayId: string, patch: Partial<Omit<TrayStateRow, 'trayId'>>) => db.update(trayStates).set(patch).where(eq(trayStates.trayId, trayId)).run(),

  // --- scan_events ----------------------------------------------------------------------
  /** Which of these event ids are stored already (a resent scan is a duplicate). */
  acceptedIds: (db: Db, ids: string[]): string[] => (ids.length ? (q(db).acceptedIds.all(json(ids)) as string[]) : []),

  insertEvents(db: Db, rows: readonly ScanEventInsert[]) {
    const stmt = q(db).insertEvent;
    for (const r of rows) {
      stmt.run({
        stepSeq: null,
        stationId: null,
        stationKind: null,
        deviceId: null,
        userId: null,
        qtyIn: null,
        goodQty: null,
        scrapQty: null,
        reworkQty: null,
        scrapReason: null,
        overrideId: null,
        note: null,
        photoHash: null,
        ...r,
      });
    }
  },

  /** A traveller's events in the order they happened. */
  events: (db: Db, trayId: string) => db.select().from(scanEvents).where(eq(scanEvents.trayId, trayId)).orderBy(asc(scanEvents.occurredAt)).all(),

  /** A traveller's events with who scanned and where, for its page. */
  eventsNamed: (db: Db, trayId: string) =>
    db
      .select({ event: scanEvents, by: users.name, station: stations.name })
      .from(scanEvents)
      .leftJoin(users, eq(users.id, scanEvents.userId))
      .leftJoin(stations, eq(stations.id, scanEvents.stationId))
      .where(eq(scanEvents.trayId, trayId))
      .orderBy(asc(scanEvents.occurredAt), asc(scanEvents.receivedAt))
      .all(),

  /** For tests and the bench: event rows received since. */
  countEvents: (db: Db, sinceReceived = 0) =>
    db
      .select({ n: sql<number>`count(*)` })
      .from(scanEvents)
      .where(gte(scanEvents.receivedAt, sinceReceived))
      .get()?.n ?? 0,
};
