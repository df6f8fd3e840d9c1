// The simple projection (the stand-in when the projection service has no date for an order)
// works on the factory's own calendar when it is given, and only falls back to the default week.
import { describe, expect, it } from 'vitest';
import { compileCalendar, type Shift } from '@shared/domain/calendar';
import { SIMPLE_QUEUE_MINUTES, projectOrder, type ProjectionTraveller } from './ship-date.service';

// Friday 2026-06-19 16:30 in Shanghai (UTC+8 all year, IANA time zone database) = 08:30 UTC
const FRIDAY_1630 = Date.parse('2026-06-19T08:30:00Z');
const tray: ProjectionTraveller = {
  id: 't',
  kind: 'tray',
  phase: 'waiting',
  stepSeq: 1,
  quantity: 100,
  onHold: false,
  startedAt: null,
  waitingSince: FRIDAY_1630,
  cureReadyAt: null,
  lastEventAt: FRIDAY_1630,
};
// one step of 10 + 100 x 0.2 = 30 standard minutes, after the hour of queue allowance: 90 working minutes
const steps = [{ travellerKind: 'tray' as const, seq: 1, stationKind: 'pack', trayMinutes: 10, pieceMinutes: 0.2, cureMinutes: null }];

describe('the simple projection reads the factory calendar', () => {
  it('on a factory working 06:00-22:00 every day, 90 working minutes from Friday 16:30 end at 18:00 the same day', () => {
    const long: Shift[] = [{ start: '06:00', end: '22:00' }];
    const calendar = compileCalendar({
      timeZone: 'Asia/Shanghai',
      week: { mon: long, tue: long, wed: long, thu: long, fri: long, sat: long, sun: long },
      daysOff: [],
    });
    expect(SIMPLE_QUEUE_MINUTES).toBe(60);
    const p = projectOrder({ status: 'in_production', travellers: [tray], steps }, FRIDAY_1630, 'Asia/Shanghai', calendar);
    expect(new Date(p.expectedAt!).toISOString()).toBe('2026-06-19T10:00:00.000Z'); // 18:00 local
  });

  it('without it, the default week (Monday to Friday 08:00-17:00 with an hour at noon) carries the work over to Monday', () => {
    const p = projectOrder({ status: 'in_production', travellers: [tray], steps }, FRIDAY_1630, 'Asia/Shanghai');
    // 30 minutes on Friday (16:30-17:00), then 60 from Monday 08:00: 09:00 local on Monday 22 June
    expect(new Date(p.expectedAt!).toISOString()).toBe('2026-06-22T01:00:00.000Z');
  });
});
