// The demo factory: a seeded database must look like a real floor and never hold a history the
// product would refuse. Every check here replays the stored history through the product's own
// scan guard (shared/domain/guards.ts) and compares with what was stored; none of the expected
// values come from the seed itself.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../support/test-app';
import { seedDemo } from '../../server/seed/demo';
import { evaluateScan, type GuardInput, type OverrideKind, type ValidOverride } from '@shared/domain/guards';
import { compileCalendar, WEEKDAYS, type WeekSchedule } from '@shared/domain/calendar';
import {
  ORDER_STATUSES,
  PROCESSES,
  REJECTION_CODES,
  initialTrayState,
  type Role,
  type RoutingStep,
  type StationKind,
  type TrayState,
} from '@shared/domain/vocabulary';
import { replayTravellers, stepRunYieldCounts, trayFlowOf, type ReplayEvent, type ReplayTraveller, type StepRun } from '@shared/domain/traveller';
import { reportFactsService } from '../../server/services/report-facts.service';
import { reportsService } from '../../server/services/reports.service';
import { calendarService } from '../../server/services/calendar.service';

// A fixed "now" (a Wednesday morning in the factory's time zone) so the run is repeatable.
const NOW = Date.parse('2026-06-17T02:30:00Z');
const WEEK = 7 * 86_400_000;

interface EventRow {
  id: string;
  tray_id: string;
  type: 'start' | 'finish' | 'hold' | 'release';
  step_seq: number | null;
  station_id: string;
  device_id: string | null;
  user_id: string | null;
  occurred_at: number;
  received_at: number;
  qty_in: number | null;
  good_qty: number | null;
  scrap_qty: number | null;
  rework_qty: number | null;
  scrap_reason: string | null;
  override_id: string | null;
  note: string | null;
}

let a: TestApp;
let b: TestApp;
beforeAll(async () => {
  a = makeTestApp();
  a.setNow(NOW);
  await seedDemo(a.deps);
  b = makeTestApp();
  b.setNow(NOW);
  await seedDemo(b.deps);
}, 400_000);
afterAll(() => {
  a?.close();
  b?.close();
});

const q = <T>(t: TestApp, sql: string, ...params: unknown[]) => t.deps.db.$client.prepare(sql).all(...params) as T[];
const iso = (ms: number | null) => (ms == null ? null : new Date(ms).toISOString());

describe('demo factory seed', () => {
  it('has at least 40 orders over every lifecycle status and every process', () => {
    const orders = q<{ status: string; process: string }>(a, 'select status, process from orders');
    expect(orders.length).toBeGreaterThanOrEqual(40);
    expect(new Set(orders.map((o) => o.status))).toEqual(new Set(ORDER_STATUSES));
    expect(new Set(orders.map((o) => o.process))).toEqual(new Set(PROCESSES));
    const customers = q<{ n: number }>(a, 'select count(*) n from customers')[0].n;
    expect(customers).toBeGreaterThanOrEqual(10);
    expect(q<{ e: string }>(a, 'select contact_email e from customers').every((c) => c.e.endsWith('.test'))).toBe(true);
  });

  it('keeps at least eight weeks of scans, ending no later than now', () => {
    const [r] = q<{ first: number; last: number; n: number }>(a, 'select min(occurred_at) first, max(occurred_at) last, count(*) n from scan_events');
    expect(r.n).toBeGreaterThan(5000);
    expect(r.last - r.first).toBeGreaterThanOrEqual(8 * WEEK);
    expect(r.last).toBeLessThanOrEqual(NOW);
  });

  it('released orders have a payment (or a manager exception) and an approved proof stored as a PDF', () => {
    const released = q<{ id: string }>(a, 'select id from orders where released_at is not null');
    expect(released.length).toBeGreaterThan(30);
    for (const o of released) {
      const pay = q<{ is_exception: number; recorded_by_role: Role }>(
        a,
        'select p.is_exception, u.role recorded_by_role from payments p join users u on u.id = p.recorded_by where order_id = ?',
        o.id,
      );
      expect(pay.length).toBeGreaterThan(0);
      for (const p of pay) if (p.is_exception) expect(p.recorded_by_role).toBe('manager');
      const proofs = q<{ approved_at: number | null; mime: string; file_hash: string }>(
        a,
        'select approved_at, mime, file_hash from proofs where order_id = ?',
        o.id,
      );
      expect(proofs.some((p) => p.approved_at != null)).toBe(true);
      expect(proofs.every((p) => p.mime === 'application/pdf' && /^[0-9a-f]{64}$/.test(p.file_hash))).toBe(true);
    }
  });

  it('every traveller replays through the scan guard to its stored state, with pieces conserved', () => {
    const stations = new Map(q<{ id: string; kind: StationKind; name: string }>(a, 'select id, kind, name from stations').map((s) => [s.id, s]));
    const devices = new Map(q<{ id: string; station_id: string }>(a, 'select id, station_id from devices').map((d) => [d.id, d.station_id]));
    const roles = new Map(q<{ id: string; role: Role }>(a, 'select id, role from users').map((u) => [u.id, u.role]));
    const reasonCodes = q<{ code: string }>(a, 'select code from reason_codes').map((r) => r.code);
    const overrides = new Map(
      q<{ id: string; tray_id: string; station_id: string; kind: OverrideKind; supervisor_id: string; reason: string; used_event_id: string | null }>(
        a,
        'select * from overrides',
      ).map((o) => [o.id, o]),
    );
    const steps = q<
      RoutingStep & {
        order_id: string;
        traveller_kind: string;
        station_kind: StationKind;
        tray_minutes: number;
        piece_minutes: number;
        cure_minutes: number | null;
      }
    >(a, 'select order_id, traveller_kind, seq, name, station_kind, tray_minutes, piece_minutes, cure_minutes, colour from order_steps order by seq');
    const routing = (orderId: string, kind: string): RoutingStep[] =>
      steps
        .filter((s) => s.order_id === orderId && s.traveller_kind === kind)
        .map((s) => ({
          seq: s.seq,
          name: s.name,
          stationKind: s.station_kind,
          trayMinutes: s.tray_minutes,
          pieceMinutes: s.piece_minutes,
          cureMinutes: s.cure_minutes,
          colour: s.colour,
        }));
    const travellers = q<{ id: string; kind: 'tray' | 'mould'; order_id: string; quantity: number; released_at: number; order_released_at: number }>(
      a,
      'select t.id, t.kind, t.order_id, t.quantity, t.released_at, o.released_at order_released_at from trays t join orders o on o.id = t.order_id',
    );
    const events = q<EventRow>(a, 'select * from scan_events order by occurred_at, rowid');
    const byTray = new Map<string, EventRow[]>();
    for (const e of events) byTray.set(e.tray_id, [...(byTray.get(e.tray_id) ?? []), e]);
    const stored = new Map(q<Record<string, unknown> & { tray_id: string }>(a, 'select * from tray_states').map((s) => [s.tray_id, s]));

    // Moulds first: a tray may strike or cast only once all of its order's mould travellers are done.
    const mouldDoneAt = new Map<string, number>();
    const ordered = [...travellers].sort((x, y) => (x.kind === y.kind ? 0 : x.kind === 'mould' ? -1 : 1));
    const mouldsOf = new Map<string, string[]>();
    for (const t of travellers) if (t.kind === 'mould') mouldsOf.set(t.order_id, [...(mouldsOf.get(t.order_id) ?? []), t.id]);
    let replayed = 0;
    let scrapTotal = 0;

    for (const t of ordered) {
      const route = routing(t.order_id, t.kind);
      expect(route.length, `routing of ${t.id}`).toBeGreaterThan(0);
      // the release writes the first state; a reused mould's check-only routing starts at 1 too
      let state: TrayState = initialTrayState({ trayId: t.id, kind: t.kind, quantity: t.quantity, releasedAt: new Date(t.released_at).toISOString() });
      let scrapped = 0;
      for (const e of byTray.get(t.id) ?? []) {
        expect(e.occurred_at, 'no event before its traveller’s release').toBeGreaterThanOrEqual(t.released_at);
        expect(e.occurred_at).toBeGreaterThanOrEqual(t.order_released_at);
        expect(e.received_at).toBeGreaterThanOrEqual(e.occurred_at);
        expect(e.device_id && devices.get(e.device_id), 'a tablet of that station').toBe(e.station_id);
        expect(e.user_id).toBeTruthy();
        const station = stations.get(e.station_id)!;
        let override: ValidOverride | null = null;
        if (e.override_id) {
          const o = overrides.get(e.override_id)!;
          expect(o.tray_id).toBe(t.id);
          expect(o.used_event_id).toBe(e.id);
          expect(o.station_id, 'an override names the station it was used at').toBe(e.station_id);
          override = { id: o.id, supervisorId: o.supervisor_id, reason: o.reason, kind: o.kind };
        }
        const moulds = mouldsOf.get(t.order_id) ?? [];
        const input: GuardInput = {
          state,
          routing: route,
          station: { id: station.id, kind: station.kind, name: station.name },
          event: {
            type: e.type,
            occurredAt: new Date(e.occurred_at).toISOString(),
            goodQty: e.good_qty,
            scrapQty: e.scrap_qty,
            reworkQty: e.rework_qty,
            scrapReason: e.scrap_reason,
            note: e.note,
          },
          now: e.occurred_at,
          mouldReady: moulds.every((m) => (mouldDoneAt.get(m) ?? Infinity) <= e.occurred_at),
          override,
          actorRole: roles.get(e.user_id!) ?? null,
          reasonCodes,
        };
        const r = evaluateScan(input);
        expect(r.ok ? 'accepted' : `${r.code} ${JSON.stringify(r.params)}`, `${t.id} ${e.type} at ${iso(e.occurred_at)}`).toBe('accepted');
        if (!r.ok) break;
        if (e.type === 'finish') {
          // pieces in = good + scrap at every finished step
          expect(e.qty_in).toBe(state.quantity);
          expect(e.good_qty! + e.scrap_qty!).toBe(e.qty_in);
          expect(e.rework_qty!).toBeLessThanOrEqual(e.good_qty!);
          if (e.scrap_qty! > 0) expect(reasonCodes).toContain(e.scrap_reason);
          scrapped += e.scrap_qty!;
        }
        for (const c of r.facts.completed) expect(c.good + c.scrap).toBe(c.quantityIn);
        state = r.next;
        replayed += 1;
        if (t.kind === 'mould' && state.phase === 'done') mouldDoneAt.set(t.id, e.occurred_at);
      }
      // nothing vanished: the released pieces are the ones left plus the recorded scrap
      if (t.kind === 'tray') expect(state.quantity + scrapped, `pieces of ${t.id}`).toBe(t.quantity);
      scrapTotal += scrapped;
      const row = stored.get(t.id)!;
      expect(
        {
          phase: row.phase,
          stepSeq: row.step_seq,
          quantity: row.quantity,
          stationId: row.station_id,
          startedAt: iso(row.started_at as number | null),
          waitingSince: iso(row.waiting_since as number | null),
          cureReadyAt: iso(row.cure_ready_at as number | null),
          onHold: !!row.on_hold,
          holdReason: row.hold_reason,
          lastEventAt: iso(row.last_event_at as number | null),
        },
        `state of ${t.id}`,
      ).toEqual({
        phase: state.phase,
        stepSeq: state.stepSeq,
        quantity: state.quantity,
        stationId: state.stationId,
        startedAt: state.startedAt,
        waitingSince: state.waitingSince,
        cureReadyAt: state.cureReadyAt,
        onHold: state.onHold,
        holdReason: state.holdReason,
        lastEventAt: state.lastEventAt ?? null,
      });
    }
    expect(replayed).toBe(events.length);
    expect(scrapTotal).toBeGreaterThan(0);
  });

  it('replays the whole history through the traveller core to the stored tray states and the report facts, exactly', () => {
    // The core (shared/domain/traveller/replay.ts) reads every order's events back through the scan
    // guards. Its states must be the stored tray_states field for field, and its step runs and tray
    // flows the rows the server derived for the reports (step_runs, tray_flows).
    const steps = q<
      RoutingStep & {
        order_id: string;
        traveller_kind: string;
        station_kind: StationKind;
        tray_minutes: number;
        piece_minutes: number;
        cure_minutes: number | null;
      }
    >(a, 'select order_id, traveller_kind, seq, name, station_kind, tray_minutes, piece_minutes, cure_minutes, colour from order_steps order by seq');
    const routing = new Map<string, RoutingStep[]>();
    for (const s of steps) {
      const key = `${s.order_id}|${s.traveller_kind}`;
      routing.set(key, [
        ...(routing.get(key) ?? []),
        {
          seq: s.seq,
          name: s.name,
          stationKind: s.station_kind,
          trayMinutes: s.tray_minutes,
          pieceMinutes: s.piece_minutes,
          cureMinutes: s.cure_minutes,
          colour: s.colour,
        },
      ]);
    }
    const travellers: ReplayTraveller[] = q<{
      id: string;
      order_id: string;
      kind: 'tray' | 'mould';
      quantity: number;
      released_at: number;
      parent_tray_id: string | null;
      merged_into_id: string | null;
    }>(a, 'select id, order_id, kind, quantity, released_at, parent_tray_id, merged_into_id from trays').map((t) => ({
      id: t.id,
      orderId: t.order_id,
      kind: t.kind,
      quantity: t.quantity,
      releasedAt: t.released_at,
      parentId: t.parent_tray_id,
      mergedIntoId: t.merged_into_id,
      routing: routing.get(`${t.order_id}|${t.kind}`) ?? [],
    }));
    const events = q<ReplayEvent>(
      a,
      `select e.tray_id trayId, e.type, e.step_seq stepSeq, e.station_id stationId, e.station_kind stationKind, e.occurred_at occurredAt, e.qty_in qtyIn,
         e.good_qty goodQty, e.scrap_qty scrapQty, e.rework_qty reworkQty, e.scrap_reason scrapReason, e.note, o.kind overrideKind, u.role actorRole
       from scan_events e left join overrides o on o.id = e.override_id left join users u on u.id = e.user_id order by e.occurred_at, e.rowid`,
    );
    const replay = replayTravellers(travellers, events);
    expect(replay.refused).toEqual([]);

    // the stored states, every field
    const stored = q<Record<string, number | string | null>>(a, 'select * from tray_states');
    expect(stored.length).toBe(travellers.length);
    for (const row of stored) {
      const s = replay.states.get(row.tray_id as string)!;
      expect(
        {
          phase: row.phase,
          stepSeq: row.step_seq,
          quantity: row.quantity,
          stationId: row.station_id,
          startedAt: iso(row.started_at as number | null),
          waitingSince: iso(row.waiting_since as number | null),
          cureReadyAt: iso(row.cure_ready_at as number | null),
          onHold: !!row.on_hold,
          holdReason: row.hold_reason,
          releasedAt: iso(row.released_at as number),
          lastEventAt: iso(row.last_event_at as number | null),
        },
        `state of ${row.tray_id}`,
      ).toEqual({
        phase: s.phase,
        stepSeq: s.stepSeq,
        quantity: s.quantity,
        stationId: s.stationId,
        startedAt: s.startedAt,
        waitingSince: s.waitingSince,
        cureReadyAt: s.cureReadyAt,
        onHold: s.onHold,
        holdReason: s.holdReason,
        releasedAt: s.releasedAt,
        lastEventAt: s.lastEventAt ?? null,
      });
    }

    // the report facts the server derives, row for row
    a.setNow(NOW);
    reportFactsService.catchUp(a.deps, { full: true });
    const cal = calendarService.calendar(a.deps);
    const runs: StepRun[] = [...replay.runs.values()].flat();
    const key = (r: { trayId: string; stepSeq: number; finishedAt: number }) => `${r.trayId}|${r.stepSeq}|${r.finishedAt}`;
    const storedRuns = new Map(
      q<Record<string, number | string | null>>(a, 'select * from step_runs').map((r) => [
        key({ trayId: r.tray_id as string, stepSeq: r.step_seq as number, finishedAt: r.finished_at as number }),
        r,
      ]),
    );
    expect(storedRuns.size).toBe(runs.length);
    expect(runs.length).toBeGreaterThan(5000);
    for (const r of runs) {
      const row = storedRuns.get(key(r));
      expect(row, key(r)).toBeDefined();
      const timeline = cal.forStation(r.stationId, r.stationKind);
      expect(row, key(r)).toMatchObject({
        order_id: r.orderId,
        traveller_kind: r.travellerKind,
        station_kind: r.stationKind,
        station_id: r.stationId,
        ready_at: r.readyAt,
        started_at: r.startedAt,
        queue_minutes: r.queueMinutes,
        process_minutes: r.processMinutes,
        cure_minutes: r.cureMinutes,
        qty_in: r.qtyIn,
        good_qty: r.goodQty,
        scrap_qty: r.scrapQty,
        rework_qty: r.reworkQty,
        scrap_reason: r.scrapReason,
        implicit: r.implicit ? 1 : 0,
        pass: r.pass,
        queue_working_minutes: timeline.workingMinutesBetween(r.readyAt, r.startedAt!),
        process_working_minutes: timeline.workingMinutesBetween(r.startedAt!, r.finishedAt),
      });
      // pieces conserved at every step
      expect(r.goodQty + r.scrapQty, key(r)).toBe(r.qtyIn);
    }
    const flows = new Map(q<Record<string, number | null>>(a, 'select * from tray_flows').map((f) => [f.tray_id as unknown as string, f]));
    for (const t of travellers.filter((x) => x.kind === 'tray' && replay.runs.get(x.id)!.length > 0)) {
      const f = trayFlowOf(t, replay.runs.get(t.id)!, (from, to) => cal.factory.workingMinutesBetween(from, to));
      expect(flows.get(t.id), t.id).toMatchObject({
        released_at: f.releasedAt,
        started_at: f.startedAt,
        inspected_at: f.inspectedAt,
        packed_at: f.packedAt,
        shipped_at: f.shippedAt,
        shipped_qty: f.shippedQty,
        last_finish_at: f.lastFinishAt,
        process_minutes: expect.closeTo(f.processMinutes, 9),
        cure_minutes: expect.closeTo(f.cureMinutes, 9),
        process_working_minutes: expect.closeTo(f.processWorkingMinutes, 9),
        cure_working_minutes: expect.closeTo(f.cureWorkingMinutes, 9),
      });
    }

    // and the yield report is the core's runs summed per station kind
    const report = reportsService.yield(a.deps, { from: new Date(NOW - 400 * 86_400_000).toISOString(), to: new Date(NOW).toISOString() } as never);
    const byKind = new Map<string, { inQty: number; goodQty: number; scrapQty: number; reworkQty: number }>();
    for (const r of runs.filter((x) => x.travellerKind === 'tray')) {
      const c = stepRunYieldCounts(r);
      const sum = byKind.get(r.stationKind) ?? { inQty: 0, goodQty: 0, scrapQty: 0, reworkQty: 0 };
      byKind.set(r.stationKind, {
        inQty: sum.inQty + c.inQty,
        goodQty: sum.goodQty + c.goodQty,
        scrapQty: sum.scrapQty + c.scrapQty,
        reworkQty: sum.reworkQty + c.reworkQty,
      });
    }
    expect(new Map(report.steps.map((s) => [s.stationKind, { inQty: s.inQty, goodQty: s.goodQty, scrapQty: s.scrapQty, reworkQty: s.reworkQty }]))).toEqual(
      byKind,
    );
  });

  it('leaves travellers on the floor in every phase, some on hold, and shipped orders with tracking numbers', () => {
    const phases = new Set(q<{ phase: string }>(a, "select distinct phase from tray_states where kind = 'tray'").map((r) => r.phase));
    for (const p of ['waiting', 'in_process', 'curing', 'done']) expect(phases).toContain(p);
    expect(q<{ n: number }>(a, 'select count(*) n from tray_states where on_hold = 1')[0].n).toBeGreaterThan(0);
    const shipped = q<{ id: string; shipped_at: number; released_at: number; packed_at: number | null }>(
      a,
      "select id, shipped_at, released_at, packed_at from orders where status = 'shipped'",
    );
    expect(shipped.length).toBeGreaterThan(10);
    for (const o of shipped) {
      const [s] = q<{ carrier: string; tracking_number: string; shipped_at: number }>(
        a,
        'select carrier, tracking_number, shipped_at from shipments where order_id = ?',
        o.id,
      );
      expect(s.tracking_number).toMatch(/^[A-Z]{2}\d{10}$/);
      // shipped when the dispatch of its last tray finished
      const [d] = q<{ last: number }>(
        a,
        "select max(e.occurred_at) last from scan_events e join trays t on t.id = e.tray_id where t.order_id = ? and e.type = 'finish' and e.station_id in (select id from stations where kind = 'dispatch')",
        o.id,
      );
      expect(o.shipped_at).toBe(d.last);
      expect(s.shipped_at).toBe(o.shipped_at);
      expect(o.packed_at).not.toBeNull();
      expect(o.packed_at!).toBeLessThanOrEqual(o.shipped_at);
    }
    // a few late: due date (factory local day) before the day it shipped
    const late = q<{ n: number }>(
      a,
      "select count(*) n from orders where status = 'shipped' and due_date < date((shipped_at + 8*3600000)/1000, 'unixepoch')",
    )[0].n;
    expect(late).toBeGreaterThan(0);
    expect(late).toBeLessThan(shipped.length / 2);
  });

  it('starts work only in the stored shifts and never puts more trays on a station than it holds', () => {
    // the oracle: the product's working calendar, built from the calendar rows the seed stored
    const [factory] = q<{ value: string }>(a, "select value from settings where key = 'factory'");
    const timeZone = (JSON.parse(factory.value) as { timeZone: string }).timeZone;
    const week = Object.fromEntries(WEEKDAYS.map((d) => [d, []])) as unknown as WeekSchedule;
    const hm = (m: number) => `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
    const dbDay = ['sun', 'mon', 'tue', 'wed', 'thu', 'fri', 'sat'] as const;
    for (const r of q<{ weekday: number; start_minute: number; end_minute: number }>(
      a,
      'select weekday, start_minute, end_minute from calendar_shifts where station_id is null',
    )) {
      week[dbDay[r.weekday]].push({ start: hm(r.start_minute), end: hm(r.end_minute) });
    }
    expect(week.sun).toEqual([]);
    const calendar = compileCalendar({ timeZone, week, daysOff: [] });
    const starts = q<{ occurred_at: number }>(a, "select occurred_at from scan_events where type = 'start'");
    const outside = starts.filter((e) => !calendar.factory.isWorking(e.occurred_at));
    expect(outside.length).toBe(0);

    // capacity: trays in process at a station at once (a cure holds its oven place until it is ready)
    const cap = new Map(q<{ id: string; capacity_trays: number; kind: string }>(a, 'select id, capacity_trays, kind from stations').map((s) => [s.id, s]));
    const rows = q<{ tray_id: string; type: string; step_seq: number; station_id: string; occurred_at: number }>(
      a,
      "select e.tray_id, e.type, e.step_seq, e.station_id, e.occurred_at from scan_events e where e.type in ('start', 'finish') order by e.occurred_at, e.rowid",
    );
    const cureMinutes = new Map(
      q<{ tray_id: string; seq: number; cure_minutes: number | null }>(
        a,
        'select t.id tray_id, s.seq, s.cure_minutes from trays t join order_steps s on s.order_id = t.order_id and s.traveller_kind = t.kind',
      ).map((r) => [`${r.tray_id}:${r.seq}`, r.cure_minutes]),
    );
    const open = new Map<string, number>();
    const intervals: { station: string; from: number; to: number }[] = [];
    for (const r of rows) {
      const key = `${r.tray_id}:${r.step_seq}`;
      if (r.type === 'start') {
        const cure = cap.get(r.station_id)!.kind === 'cure' ? cureMinutes.get(key) : null;
        if (cure != null) intervals.push({ station: r.station_id, from: r.occurred_at, to: r.occurred_at + cure * 60_000 });
        else open.set(key, r.occurred_at);
      } else if (open.has(key)) {
        intervals.push({ station: r.station_id, from: open.get(key)!, to: r.occurred_at });
        open.delete(key);
      }
    }
    for (const [key, from] of open) intervals.push({ station: rows.find((r) => `${r.tray_id}:${r.step_seq}` === key)!.station_id, from, to: Infinity });
    const points = intervals.flatMap((i) => [
      { station: i.station, t: i.from, d: 1 },
      { station: i.station, t: i.to, d: -1 },
    ]);
    points.sort((x, y) => x.t - y.t || x.d - y.d);
    const level = new Map<string, number>();
    const peak = new Map<string, number>();
    for (const p of points) {
      const n = (level.get(p.station) ?? 0) + p.d;
      level.set(p.station, n);
      peak.set(p.station, Math.max(peak.get(p.station) ?? 0, n));
    }
    for (const [station, n] of peak) expect(n, cap.get(station)!.kind).toBeLessThanOrEqual(cap.get(station)!.capacity_trays);
    // and the oven and the plating bath did fill up at times (queues form there)
    const kindPeak = (kind: string) => Math.max(...[...peak].filter(([id]) => cap.get(id)!.kind === kind).map(([, n]) => n));
    expect(kindPeak('cure')).toBeGreaterThan(4);
    expect(kindPeak('plate')).toBeGreaterThan(2);
  });

  it('keeps a few refused scans open for the supervisor and recorded overrides', () => {
    const rejections = q<{ code: string; message: string; resolved_at: number | null; occurred_at: number }>(
      a,
      'select code, message, resolved_at, occurred_at from scan_rejections',
    );
    expect(rejections.length).toBeGreaterThanOrEqual(3);
    for (const r of rejections) {
      expect(REJECTION_CODES).toContain(r.code);
      expect(r.message.length).toBeGreaterThan(5);
      expect(r.resolved_at).toBeNull();
      expect(r.occurred_at).toBeLessThanOrEqual(NOW);
    }
    const overrides = q<{ used_event_id: string | null; role: Role }>(
      a,
      'select o.used_event_id, u.role from overrides o join users u on u.id = o.supervisor_id',
    );
    expect(overrides.length).toBeGreaterThanOrEqual(1);
    for (const o of overrides) {
      expect(o.role).toBe('supervisor');
      expect(q<{ n: number }>(a, 'select count(*) n from scan_events where id = ? and override_id is not null', o.used_event_id)[0].n).toBe(1);
    }
  });

  it('reuses a stored mould for a reorder', () => {
    const reused = q<{ n: number }>(a, 'select count(*) n from order_moulds om join moulds m on m.id = om.mould_id where m.first_order_id <> om.order_id')[0].n;
    expect(reused).toBeGreaterThan(0);
  });

  it('gives the same factory for the same seed and the same now', () => {
    const summary = (t: TestApp) => ({
      orders: q(t, 'select number, quantity, status, process, due_date from orders order by number'),
      trays: q(t, 'select number, quantity from trays order by number'),
      events: q(t, 'select type, count(*) n, sum(good_qty) good, sum(scrap_qty) scrap from scan_events group by type order by type'),
      rejections: q(t, 'select code, count(*) n from scan_rejections group by code order by code'),
    });
    expect(summary(b)).toEqual(summary(a));
  });
});
