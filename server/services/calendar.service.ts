import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { calendarRepository } from '../repositories/calendar.repository';
import { auditRepository } from '../repositories/audit.repository';
import { reportFactsRepository } from '../repositories/report-facts.repository';
import { badInput } from '../errors';
import {
  WEEKDAYS,
  compileCalendar,
  defaultCalendarConfig,
  parseHm,
  type CalendarConfig,
  type StationCalendar,
  type WeekSchedule,
  type WorkingCalendar,
} from '@shared/domain/calendar';
import { DEFAULT_TIME_ZONE } from '@shared/domain/time-zone';
import type { CalendarBody, CalendarView, WeekBody } from '@shared/schemas/calendar';

// Stored rows use weekday 0 = Sunday (as JavaScript does); the domain names days mon..sun.
const DB_WEEKDAY: Record<(typeof WEEKDAYS)[number], number> = { sun: 0, mon: 1, tue: 2, wed: 3, thu: 4, fri: 5, sat: 6 };
const hm = (m: number) => `${String(Math.floor(m / 60) % 24).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
const emptyWeek = (): WeekSchedule => ({ mon: [], tue: [], wed: [], thu: [], fri: [], sat: [], sun: [] });

function readView(deps: AppDeps): CalendarView {
  const db = deps.db;
  const tz = calendarRepository.factorySettings(db)?.timeZone ?? DEFAULT_TIME_ZONE;
  const shifts = calendarRepository.shifts(db);
  const days = calendarRepository.daysOff(db);
  const weeks = new Map<string | null, WeekSchedule>();
  for (const s of shifts) {
    let w = weeks.get(s.stationId);
    if (!w) weeks.set(s.stationId, (w = emptyWeek()));
    const day = WEEKDAYS.find((d) => DB_WEEKDAY[d] === s.weekday);
    if (day) w[day].push({ start: hm(s.startMinute), end: hm(s.endMinute) });
  }
  const factoryWeek = weeks.get(null);
  const fallback = defaultCalendarConfig(tz).week;
  return {
    timeZone: tz,
    week: factoryWeek ?? fallback,
    isDefault: !factoryWeek,
    daysOff: days.filter((d) => !d.stationId).map((d) => ({ date: d.date, name: d.name })),
    stations: calendarRepository.stations(db).map((st) => ({
      stationId: st.id,
      code: st.code,
      name: st.name,
      kind: st.kind,
      continuous: st.continuous,
      week: weeks.get(st.id) ?? null,
      daysOff: days.filter((d) => d.stationId === st.id).map((d) => ({ date: d.date, name: d.name })),
    })),
  };
}

/**
 * The domain config: exceptions keyed by station id, and by station kind when every active
 * station of that kind shares the same exception (a projection knows the kind of a future step,
 * not yet the station).
 */
export function toConfig(view: CalendarView): CalendarConfig {
  const stations: Record<string, StationCalendar> = {};
  const byKind = new Map<string, string[]>();
  for (const st of view.stations) {
    const own: StationCalendar | null = st.continuous
      ? { continuous: true }
      : st.week || st.daysOff.length
        ? { week: st.week ?? undefined, daysOff: st.daysOff.map((d) => d.date) }
        : null;
    if (own) stations[st.stationId] = own;
    const key = JSON.stringify(own);
    byKind.set(st.kind, [...(byKind.get(st.kind) ?? []), key]);
  }
  for (const [kind, keys] of byKind) {
    if (keys.every((k) => k === keys[0]) && keys[0] !== 'null') stations[kind] = JSON.parse(keys[0]) as StationCalendar;
  }
  return { timeZone: view.timeZone, week: view.week, daysOff: view.daysOff.map((d) => d.date), stations };
}

interface Cached {
  calendar: WorkingCalendar;
  loadedAt: number;
}
const cache = new WeakMap<object, Cached>();
const CACHE_MS = 60_000;

export const calendarService = {
  view: (deps: AppDeps): CalendarView => readView(deps),

  /** The compiled working calendar, cached briefly (its timelines keep their own tables). */
  calendar(deps: AppDeps): WorkingCalendar {
    const hit = cache.get(deps.db);
    const now = deps.now();
    if (hit && now >= hit.loadedAt && now - hit.loadedAt < CACHE_MS) return hit.calendar;
    const calendar = compileCalendar(toConfig(readView(deps)));
    cache.set(deps.db, { calendar, loadedAt: now });
    return calendar;
  },

  timeZone: (deps: AppDeps): string => calendarRepository.factorySettings(deps.db)?.timeZone ?? DEFAULT_TIME_ZONE,

  /**
   * Call after every write to the calendar tables or the factory's time zone: the next question
   * compiles the calendar again, and the report facts (kept in working minutes of this calendar)
   * are derived again on their next catch-up.
   */
  forget(deps: AppDeps) {
    cache.delete(deps.db);
    reportFactsRepository.setCursor(deps.db, 'step_runs', 0, deps.now());
  },

  save(deps: AppDeps, body: CalendarBody, actorId: string): CalendarView {
    const known = new Set(calendarRepository.stations(deps.db).map((s) => s.id));
    for (const [i, st] of body.stations.entries()) {
      if (!known.has(st.stationId)) throw badInput('That station does not exist.', [{ path: ['stations', i, 'stationId'], message: 'Unknown station' }]);
    }
    const config = toConfig({
      timeZone: body.timeZone,
      week: body.week,
      daysOff: body.daysOff.map((d) => ({ date: d.date, name: d.name ?? '' })),
      stations: [],
      isDefault: false,
    });
    if (!Object.values(body.week).some((shifts) => shifts.length > 0)) {
      throw badInput('The factory needs at least one shift in the week.', [{ path: ['week'], message: 'No shift' }]);
    }
    compileCalendar(config); // throws on anything the domain cannot use
    const shifts: { id: string; stationId: string | null; weekday: number; startMinute: number; endMinute: number }[] = [];
    const addWeek = (week: WeekBody, stationId: string | null) => {
      for (const d of WEEKDAYS)
        for (const s of week[d])
          shifts.push({ id: crypto.randomUUID(), stationId, weekday: DB_WEEKDAY[d], startMinute: parseHm(s.start), endMinute: parseHm(s.end) });
    };
    addWeek(body.week, null);
    const days = body.daysOff.map((d) => ({ id: crypto.randomUUID(), date: d.date, stationId: null as string | null, name: d.name ?? '' }));
    for (const st of body.stations) {
      if (st.week) addWeek(st.week, st.stationId);
      for (const d of st.daysOff) days.push({ id: crypto.randomUUID(), date: d.date, stationId: st.stationId, name: d.name ?? '' });
    }
    const now = deps.now();
    deps.db.transaction((tx) => {
      calendarRepository.replaceAll(tx, shifts, days);
      const current = calendarRepository.factorySettings(tx) ?? {};
      calendarRepository.saveFactorySettings(tx, { ...current, timeZone: body.timeZone });
      auditRepository.record(tx, now, {
        userId: actorId,
        action: 'calendar.save',
        entity: 'calendar',
        entityId: null,
        detail: { timeZone: body.timeZone, shifts: shifts.length, daysOff: days.length },
      });
    });
    calendarService.forget(deps);
    return readView(deps);
  },
};
