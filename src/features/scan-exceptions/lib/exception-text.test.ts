// The refused-scans page names reasons and writes times in the factory's zone. Asia/Shanghai is
// UTC+8 all year (IANA tz database; China has kept no daylight saving time since 1991, from memory).
import { describe, expect, it } from 'vitest';
import { exceptionMessage } from './exception-text';
import { setFactoryTimeZone, formatDateTime, formatClock } from '@/lib/datetime';

// as GET /api/reason-codes lists them (the base seed's hold reasons)
const names = new Map([
  ['hold_customer', 'Customer asked to wait'],
  ['hold_quality', 'Quality question: wait for a decision'],
]);
const reasonName = (code: string) => names.get(code);

describe('refused-scan messages on the supervisors’ page', () => {
  it('a held tray names its hold reason, not the stored code', () => {
    const m = exceptionMessage({ code: 'on_hold', params: { holdReason: 'hold_customer' } }, reasonName, (iso) => formatDateTime(iso as string, 'en'));
    expect(m.detail).toContain('Customer asked to wait');
    expect(`${m.title} ${m.detail} ${m.next}`).not.toMatch(/hold_customer/);
  });

  it('an unknown code the tablet sent stays as it was typed (there is no name to give)', () => {
    const m = exceptionMessage({ code: 'scrap_reason_missing', params: { reason: 'made_up' } }, reasonName, String);
    expect(m.detail).toContain('made_up');
  });

  it('times read in the factory’s zone, not UTC', () => {
    setFactoryTimeZone('Asia/Shanghai');
    const m = exceptionMessage(
      { code: 'curing', params: { cureName: 'Cure 1', cureSeq: 4, minutesLeft: 12, readyAt: '2026-12-10T02:27:00.000Z' } },
      reasonName,
      (iso) => formatClock(iso as string, 'en'),
    );
    expect(m.detail).toContain('ready at 10:27');
    expect(m.detail).not.toMatch(/UTC|02:27/);
  });
});
