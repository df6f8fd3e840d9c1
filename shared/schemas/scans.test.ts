import { describe, expect, it } from 'vitest';
import { MAX_SCAN_BATCH, scanBatchEnvelopeSchema, scanBatchSchema, scanEventSchema } from './scans';

const event = {
  id: '0b7f1c8e-7a51-4d8e-9a3c-2f4e5d6c7b8a',
  code: 'T-000123',
  stationId: 'st-fill-1',
  type: 'finish',
  occurredAt: '2025-03-03T08:00:00.000Z',
  goodQty: 98,
  scrapQty: 2,
  reworkQty: 0,
  scrapReason: 'enamel_crack',
};

describe('scan wire schemas', () => {
  it('accepts an event with the contract field names', () => {
    expect(scanEventSchema.parse(event)).toEqual(event);
  });

  it('refuses a non-UUID id, an unknown type, negative counts and a time without a date', () => {
    expect(scanEventSchema.safeParse({ ...event, id: '123' }).success).toBe(false);
    expect(scanEventSchema.safeParse({ ...event, type: 'pause' }).success).toBe(false);
    expect(scanEventSchema.safeParse({ ...event, scrapQty: -1 }).success).toBe(false);
    expect(scanEventSchema.safeParse({ ...event, goodQty: 1.5 }).success).toBe(false);
    expect(scanEventSchema.safeParse({ ...event, occurredAt: '08:00' }).success).toBe(false);
  });

  it('a batch holds 1 to 500 events', () => {
    expect(scanBatchSchema.safeParse({ events: [] }).success).toBe(false);
    expect(scanBatchSchema.safeParse({ events: Array(MAX_SCAN_BATCH).fill(event) }).success).toBe(true);
    expect(scanBatchSchema.safeParse({ events: Array(MAX_SCAN_BATCH + 1).fill(event) }).success).toBe(false);
  });

  it('the envelope lets a malformed event through to be answered on its own', () => {
    const r = scanBatchEnvelopeSchema.safeParse({ events: [event, { id: 'x' }] });
    expect(r.success).toBe(true);
    expect(scanBatchEnvelopeSchema.safeParse({ events: ['x'] }).success).toBe(false);
  });
});
