import { describe, expect, it } from 'vitest';
import { addWorking, COURIER_PICKUP, factoryDate, nextFixed, nextWorking, PLATING_LOADS } from './demo-clock';

// Hand-worked on the demo shifts (Mon–Sat 08:00–12:00 and 13:00–17:30) in Asia/Shanghai, which
// keeps UTC+8 all year with no daylight saving since 1991 (IANA time zone database).
// 2026-06-15 is a Monday; 2026-06-20 a Saturday, 2026-06-21 a Sunday.
const local = (s: string) => Date.parse(`${s}+08:00`);
const at = (ms: number) => new Date(ms + 8 * 3_600_000).toISOString().slice(0, 16);

describe('the demo floor works its shifts on the factory calendar', () => {
  it('starts at the next shift: lunch break, night and Sunday', () => {
    expect(at(nextWorking(local('2026-06-15T09:10')))).toBe('2026-06-15T09:10');
    expect(at(nextWorking(local('2026-06-15T12:20')))).toBe('2026-06-15T13:00');
    expect(at(nextWorking(local('2026-06-15T17:30')))).toBe('2026-06-16T08:00');
    expect(at(nextWorking(local('2026-06-20T18:00')))).toBe('2026-06-22T08:00');
  });

  it('carries work over breaks: Mon 11:00 + 90 min = 13:30; Sat 17:00 + 60 min = Mon 08:30', () => {
    expect(at(addWorking(local('2026-06-15T11:00'), 90))).toBe('2026-06-15T13:30');
    expect(at(addWorking(local('2026-06-20T17:00'), 60))).toBe('2026-06-22T08:30');
    // no minutes: the first working moment
    expect(at(addWorking(local('2026-06-15T12:30'), 0))).toBe('2026-06-15T13:00');
  });

  it('waits for the next plating load and for the courier on a working day', () => {
    expect(PLATING_LOADS).toEqual([8 * 60 + 30, 10 * 60 + 30, 14 * 60, 16 * 60]);
    expect(at(nextFixed(local('2026-06-15T10:31'), PLATING_LOADS))).toBe('2026-06-15T14:00');
    expect(at(nextFixed(local('2026-06-15T16:10'), PLATING_LOADS))).toBe('2026-06-16T08:30');
    expect(at(nextFixed(local('2026-06-20T16:40'), [COURIER_PICKUP]))).toBe('2026-06-22T16:30');
  });

  it('dates on the factory clock, not in UTC', () => {
    expect(factoryDate(Date.parse('2026-06-15T16:30:00Z'))).toBe('2026-06-16');
    expect(factoryDate(Date.parse('2026-06-15T15:59:00Z'))).toBe('2026-06-15');
  });
});
