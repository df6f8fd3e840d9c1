import type { DbLike as Db } from '../db/client';
import { sqlClient } from './sql-client';

const client = sqlClient;

export interface OpenOrderRow {
  id: string;
  number: string;
  title: string;
  customer: string;
  status: string;
  dueDate: string;
  releasedAt: number | null;
}

export interface TrayStateRow {
  trayId: string;
  orderId: string;
  kind: 'tray' | 'mould';
  phase: string;
  stepSeq: number | null;
  quantity: number;
  startedAt: number | null;
  waitingSince: number | null;
  cureReadyAt: number | null;
  onHold: number;
  lastEventAt: number | null;
  releasedAt: number;
}

export interface StepRow {
  orderId: string;
  kind: 'tray' | 'mould';
  seq: number;
  stationKind: string;
  trayMinutes: number;
  pieceMinutes: number;
  cureMinutes: number | null;
}

/** a step run as `runsSinceRaw` reads it */
export type RunTuple = [
  orderId: string,
  trayId: string,
  travellerKind: 'tray' | 'mould',
  stepSeq: number,
  stationKind: string,
  stationId: string | null,
  readyAt: number,
  startedAt: number,
  finishedAt: number,
  implicit: number,
  standardMinutes: number | null,
  cure: number,
];

const OPEN = `o.released_at is not null and o.shipped_at is null and o.cancelled_at is null and o.status not in ('shipped', 'cancelled')`;

export const projectionRepository = {
  /** every traveller of every open order */
  openTrays(db: Db): TrayStateRow[] {
    return client(db)
      .prepare(
        `select s.tray_id as trayId, t.order_id as orderId, t.kind, s.phase, s.step_seq as stepSeq, s.quantity, s.started_at as startedAt,
           s.waiting_since as waitingSince, s.cure_ready_at as cureReadyAt, s.on_hold as onHold, s.last_event_at as lastEventAt, s.released_at as releasedAt
         from orders o join trays t on t.order_id = o.id join tray_states s on s.tray_id = t.id where ${OPEN}`,
      )
      .all() as TrayStateRow[];
  },
  /** the routing of every open order */
  openSteps(db: Db): (StepRow & { name: string; colour: number | null })[] {
    return client(db)
      .prepare(
        `select st.order_id as orderId, st.traveller_kind as kind, st.seq, st.name, st.station_kind as stationKind, st.tray_minutes as trayMinutes,
           st.piece_minutes as pieceMinutes, st.cure_minutes as cureMinutes, st.colour
         from orders o join order_steps st on st.order_id = o.id where ${OPEN} order by st.order_id, st.traveller_kind, st.seq`,
      )
      .all() as (StepRow & { name: string; colour: number | null })[];
  },
  /**
   * Step runs started and finished since `since`, as plain arrays (no row objects), with the
   * step's standard minutes for the pieces that went in and whether it cures worked out in SQL: [orderId, trayId, travellerKind, stepSeq, stationKind,
   * stationId, readyAt, startedAt, finishedAt, implicit, standardMinutes, cure]. Iterated, so a
   * long history is never held twice.
   */
  runsSinceRaw(db: Db, since: number): IterableIterator<RunTuple> {
    return client(db)
      .prepare(
        `select r.order_id, r.tray_id, r.traveller_kind, r.step_seq, r.station_kind, r.station_id, r.ready_at, r.started_at, r.finished_at, r.implicit,
           case when st.tray_minutes is null then null
                else st.tray_minutes + coalesce(st.piece_minutes, 0) * (case when r.traveller_kind = 'mould' then 1 else r.qty_in end) end,
           coalesce(st.cure_minutes, 0) > 0
         from step_runs r left join order_steps st on st.order_id = r.order_id and st.traveller_kind = r.traveller_kind and st.seq = r.step_seq
         where r.started_at is not null and r.finished_at >= ?`,
      )
      .raw(true)
      .iterate(since) as IterableIterator<RunTuple>;
  },
  /** hold and release scans since `since`, per traveller in time order */
  holdsSince(db: Db, since: number): { trayId: string; type: 'hold' | 'release'; occurredAt: number }[] {
    return client(db)
      .prepare(
        `select tray_id as trayId, type, occurred_at as occurredAt from scan_events where type in ('hold', 'release') and occurred_at >= ? order by tray_id, occurred_at`,
      )
      .all(since) as { trayId: string; type: 'hold' | 'release'; occurredAt: number }[];
  },
  stations(db: Db): { id: string; kind: string; capacityTrays: number; active: number }[] {
    return client(db).prepare('select id, kind, capacity_trays as capacityTrays, active from stations').all() as {
      id: string;
      kind: string;
      capacityTrays: number;
      active: number;
    }[];
  },
  /** released, not shipped, not cancelled */
  openOrders(db: Db): OpenOrderRow[] {
    return client(db)
      .prepare(
        `select o.id, o.number, o.title, c.name as customer, o.status, o.due_date as dueDate, o.released_at as releasedAt
         from orders o join customers c on c.id = o.customer_id
         where o.released_at is not null and o.shipped_at is null and o.cancelled_at is null and o.status not in ('shipped', 'cancelled')`,
      )
      .all() as OpenOrderRow[];
  },
  traysOf(db: Db, orderId: string): TrayStateRow[] {
    return client(db)
      .prepare(
        `select s.tray_id as trayId, t.order_id as orderId, t.kind, s.phase, s.step_seq as stepSeq, s.quantity, s.started_at as startedAt,
           s.waiting_since as waitingSince, s.cure_ready_at as cureReadyAt, s.on_hold as onHold, s.last_event_at as lastEventAt, s.released_at as releasedAt
         from trays t join tray_states s on s.tray_id = t.id where t.order_id = ?`,
      )
      .all(orderId) as TrayStateRow[];
  },
  stepsOf(db: Db, orderId: string): StepRow[] {
    return client(db)
      .prepare(
        `select order_id as orderId, traveller_kind as kind, seq, station_kind as stationKind, tray_minutes as trayMinutes, piece_minutes as pieceMinutes, cure_minutes as cureMinutes
         from order_steps where order_id = ? order by traveller_kind, seq`,
      )
      .all(orderId) as StepRow[];
  },
  /** size and tray size of orders released since `since` (what a planner usually chooses) */
  traySizesSince(db: Db, since: number): { sizeMm: number; traySize: number }[] {
    return client(db).prepare('select size_mm as sizeMm, tray_size as traySize from orders where released_at >= ? and tray_size is not null').all(since) as {
      sizeMm: number;
      traySize: number;
    }[];
  },
  /** a cheap fingerprint of everything a projection reads */
  fingerprint(db: Db): string {
    const c = client(db);
    const e = (c.prepare('select max(rowid) as m from scan_events').get() as { m: number | null }).m ?? 0;
    const o = c.prepare('select count(*) as n, max(updated_at) as u from orders where released_at is not null').get() as { n: number; u: number | null };
    const s = (c.prepare('select count(*) as n from tray_states').get() as { n: number }).n;
    return `${e}|${o.n}|${o.u ?? 0}|${s}`;
  },
};
