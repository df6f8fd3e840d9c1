import type { DbLike as Db } from '../db/client';
import { sqlClient } from './sql-client';

// The live floor: read from tray_states (the current state, kept with every scan), never from
// the scan history. The phase/kind index keeps this to the open travellers only.

const client = sqlClient;

export interface OpenTrayRow {
  trayId: string;
  number: string;
  kind: 'tray' | 'mould';
  orderId: string;
  orderNumber: string;
  title: string;
  customer: string;
  /** the finish its current plating step plates: the second finish of a two-tone order at its second plating */
  plating: string;
  dueDate: string;
  phase: 'waiting' | 'in_process' | 'curing';
  stepSeq: number | null;
  stationKind: string | null;
  stationId: string | null;
  quantity: number;
  startedAt: number | null;
  waitingSince: number | null;
  cureReadyAt: number | null;
  onHold: number;
  holdReason: string | null;
  releasedAt: number;
  /** the step after the current one (for a tray at the oven whose cure has run out) */
  nextKind: string | null;
  nextCureMinutes: number | null;
  stepName: string | null;
  cureMinutes: number | null;
}

/** Just what the WIP counts need, per open traveller. */
export interface WipRow {
  kind: 'tray' | 'mould';
  phase: 'waiting' | 'in_process' | 'curing';
  stationKind: string | null;
  stationId: string | null;
  quantity: number;
  waitingSince: number | null;
  cureReadyAt: number | null;
  onHold: number;
  releasedAt: number;
  nextKind: string | null;
}

export const floorRepository = {
  /** The lean read behind GET /api/wip: tray_states alone, plus the next step only for trays at the oven. */
  wipRows(db: Db): WipRow[] {
    return client(db)
      .prepare(
        `select s.kind, s.phase, s.station_kind as stationKind, s.station_id as stationId, s.quantity, s.waiting_since as waitingSince,
           s.cure_ready_at as cureReadyAt, s.on_hold as onHold, s.released_at as releasedAt,
           case when s.phase = 'curing' then (
             select n.station_kind from trays t join order_steps n on n.order_id = t.order_id and n.traveller_kind = s.kind and n.seq = s.step_seq + 1
             where t.id = s.tray_id
           ) end as nextKind
         from tray_states s where s.phase in ('waiting', 'in_process', 'curing')`,
      )
      .all() as WipRow[];
  },

  openTrays(db: Db): OpenTrayRow[] {
    return client(db)
      .prepare(
        `select s.tray_id as trayId, t.number, t.kind, t.order_id as orderId, o.number as orderNumber, o.title, c.name as customer,
           case when o.second_plating is not null and cur.station_kind = 'plate' and exists (
             select 1 from order_steps p where p.order_id = t.order_id and p.traveller_kind = t.kind and p.station_kind = 'plate' and p.seq < cur.seq
           ) then o.second_plating else o.plating end as plating, o.due_date as dueDate,
           s.phase, s.step_seq as stepSeq, s.station_kind as stationKind, s.station_id as stationId, s.quantity,
           s.started_at as startedAt, s.waiting_since as waitingSince, s.cure_ready_at as cureReadyAt, s.on_hold as onHold, coalesce(hr.name, s.hold_reason) as holdReason,
           s.released_at as releasedAt,
           cur.name as stepName, cur.cure_minutes as cureMinutes,
           nxt.station_kind as nextKind, nxt.cure_minutes as nextCureMinutes
         from tray_states s
         join trays t on t.id = s.tray_id
         join orders o on o.id = t.order_id
         join customers c on c.id = o.customer_id
         left join reason_codes hr on hr.code = s.hold_reason
         left join order_steps cur on cur.order_id = t.order_id and cur.traveller_kind = t.kind and cur.seq = s.step_seq
         left join order_steps nxt on nxt.order_id = t.order_id and nxt.traveller_kind = t.kind and nxt.seq = s.step_seq + 1
         where s.phase in ('waiting', 'in_process', 'curing')`,
      )
      .all() as OpenTrayRow[];
  },

  stations(db: Db): { id: string; code: string; name: string; kind: string; capacityTrays: number; active: number }[] {
    return client(db).prepare('select id, code, name, kind, capacity_trays as capacityTrays, active from stations order by code').all() as {
      id: string;
      code: string;
      name: string;
      kind: string;
      capacityTrays: number;
      active: number;
    }[];
  },

  openRejections(db: Db, since: number, limit: number) {
    return client(db)
      .prepare(
        `select r.id, r.code, r.message, r.occurred_at as occurredAt, r.received_at as receivedAt, t.number as trayNumber, st.name as stationName, u.name as userName
         from scan_rejections r left join trays t on t.id = r.tray_id left join stations st on st.id = r.station_id left join users u on u.id = r.user_id
         where r.resolved_at is null and r.received_at >= ?
         order by r.received_at desc limit ?`,
      )
      .all(since, limit) as {
      id: string;
      code: string;
      message: string;
      occurredAt: number | null;
      receivedAt: number;
      trayNumber: string | null;
      stationName: string | null;
      userName: string | null;
    }[];
  },

  recentOverrides(db: Db, since: number, limit: number) {
    return client(db)
      .prepare(
        `select ov.id, ov.kind, ov.reason, ov.created_at as createdAt, ov.used_event_id as usedEventId, t.number as trayNumber, st.name as stationName, u.name as supervisorName
         from overrides ov join trays t on t.id = ov.tray_id left join stations st on st.id = ov.station_id left join users u on u.id = ov.supervisor_id
         where ov.created_at >= ? order by ov.created_at desc limit ?`,
      )
      .all(since, limit) as {
      id: string;
      kind: string;
      reason: string;
      createdAt: number;
      usedEventId: string | null;
      trayNumber: string;
      stationName: string | null;
      supervisorName: string | null;
    }[];
  },

  /** scan events after a rowid, for the live stream (oldest first) */
  eventsAfter(db: Db, rowid: number, limit: number) {
    return client(db)
      .prepare(
        `select e.rowid as rowid, e.id, e.type, e.tray_id as trayId, t.number as trayNumber, e.station_id as stationId, st.name as stationName, e.station_kind as stationKind,
           e.occurred_at as occurredAt, e.good_qty as goodQty, e.scrap_qty as scrapQty
         from scan_events e join trays t on t.id = e.tray_id left join stations st on st.id = e.station_id
         where e.rowid > ? order by e.rowid limit ?`,
      )
      .all(rowid, limit) as {
      rowid: number;
      id: string;
      type: string;
      trayId: string;
      trayNumber: string;
      stationId: string | null;
      stationName: string | null;
      stationKind: string | null;
      occurredAt: number;
      goodQty: number | null;
      scrapQty: number | null;
    }[];
  },

  maxRowids(db: Db): { events: number; rejections: number; states: number } {
    const c = client(db);
    return {
      events: ((c.prepare('select max(rowid) as m from scan_events').get() as { m: number | null }).m ?? 0) as number,
      rejections: ((c.prepare('select max(rowid) as m from scan_rejections').get() as { m: number | null }).m ?? 0) as number,
      states: ((c.prepare('select count(*) as n from tray_states').get() as { n: number }).n ?? 0) as number,
    };
  },
};
