import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { uuidv7, uuidv7Time } from './event-id';

describe('scan event ids (UUID version 7, RFC 9562 §5.7)', () => {
  it('lays out time, version and variant as RFC 9562 says (its appendix A.6 example time)', () => {
    // RFC 9562 appendix A.6: unix_ts_ms 0x017F22E279B0 (Tuesday, February 22, 2022 2:22:22.00 PM GMT-05:00)
    const ms = 0x017f22e279b0;
    const id = uuidv7(ms, (b) => b.fill(0xff));
    expect(id.startsWith('017f22e2-79b0-7')).toBe(true);
    expect(id[19]).toMatch(/[89ab]/); // variant 10xx
    expect(uuidv7Time(id)).toBe(ms);
    expect(new Date(ms).toISOString()).toBe('2022-02-22T19:22:22.000Z');
  });

  it('is a valid v7 UUID for zod’s validator and sorts in the order made', () => {
    const ids = Array.from({ length: 2000 }, (_, i) => uuidv7(1_700_000_000_000 + Math.floor(i / 7)));
    for (const id of ids.slice(0, 50)) expect(z.uuid({ version: 'v7' }).safeParse(id).success, id).toBe(true);
    expect([...ids].sort()).toEqual(ids);
    expect(new Set(ids).size).toBe(ids.length);
  });
});
