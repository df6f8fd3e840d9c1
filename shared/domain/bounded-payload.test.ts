import { describe, expect, it } from 'vitest';
import { boundedPayload } from './bounded-payload';

describe('what is kept of a refused event', () => {
  it('an event nested 50,000 levels deep is kept to a few levels and stringifies', () => {
    const depth = 50_000;
    const deep = JSON.parse(`${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`);
    // the attack: storing it as it came overflows the stack
    expect(() => JSON.stringify(deep)).toThrow(RangeError);
    const kept = boundedPayload({ id: 'e1', extra: deep }, { maxDepth: 8, maxChars: 8_000 });
    const text = JSON.stringify(kept);
    expect(text.length).toBeLessThan(8_200);
    expect(text).toContain('"id":"e1"');
    expect(text).toContain('[cut: too deep]');
  });

  it('a huge string or array is cut to the size budget', () => {
    const kept = JSON.stringify(
      boundedPayload({ note: 'x'.repeat(1_000_000), list: Array.from({ length: 10_000 }, (_, i) => i) }, { maxDepth: 8, maxChars: 8_000 }),
    );
    expect(kept.length).toBeLessThan(8_500);
  });

  it('an ordinary event is kept exactly', () => {
    const event = {
      id: '0190a0a0-0000-7000-8000-000000000000',
      code: 'T-000123',
      stationId: 's1',
      type: 'finish',
      occurredAt: '2026-12-10T02:27:00.000Z',
      goodQty: 98,
      scrapQty: 2,
      scrapReason: 'scratch',
      note: null,
      ok: true,
    };
    expect(boundedPayload(event)).toEqual(event);
    expect(boundedPayload([1, 'a', [2, [3]]])).toEqual([1, 'a', [2, [3]]]);
  });
});
