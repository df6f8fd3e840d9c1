import { describe, expect, it } from 'vitest';
import { createWedgeReader } from './keyboard-wedge';

function feed(reader: ReturnType<typeof createWedgeReader>, text: string, gapMs: number, start = 1000) {
  let t = start;
  let out: string | null = null;
  for (const ch of text) {
    reader.key({ key: ch, time: t });
    t += gapMs;
  }
  out = reader.key({ key: 'Enter', time: t });
  return { out, end: t };
}

describe('keyboard-wedge scanner capture', () => {
  it('takes a fast run of keys ended by Enter as a scan', () => {
    const r = createWedgeReader();
    expect(feed(r, 'T1:1042-07:2:K3J7QZ2MX4NCA5PD', 8).out).toBe('T1:1042-07:2:K3J7QZ2MX4NCA5PD');
  });

  it('ignores a person typing (150 ms between keys, from memory a quick typist)', () => {
    const r = createWedgeReader();
    expect(feed(r, '1042-07', 150).out).toBeNull();
  });

  it('ignores Shift between characters, as scanners send it for capitals', () => {
    const r = createWedgeReader();
    let t = 0;
    for (const ch of 'AB12') {
      r.key({ key: 'Shift', time: t });
      r.key({ key: ch, time: t + 2 });
      t += 10;
    }
    expect(r.key({ key: 'Enter', time: t })).toBe('AB12');
  });

  it('drops slow keys before the burst, keeps only the scan', () => {
    const r = createWedgeReader();
    r.key({ key: 'x', time: 0 });
    r.key({ key: 'y', time: 400 });
    expect(feed(r, '5555-01', 5, 2000).out).toBe('5555-01');
  });

  it('needs a minimum length and Enter soon after the last key', () => {
    const r = createWedgeReader();
    expect(feed(r, 'ab', 5).out).toBeNull();
    const slowEnter = createWedgeReader();
    slowEnter.key({ key: '1', time: 0 });
    slowEnter.key({ key: '2', time: 5 });
    slowEnter.key({ key: '3', time: 10 });
    slowEnter.key({ key: '4', time: 15 });
    expect(slowEnter.key({ key: 'Enter', time: 500 })).toBeNull();
  });

  it('tolerates a single hiccup of a busy tablet inside a scan', () => {
    const r = createWedgeReader();
    let t = 0;
    for (const [i, ch] of [...'T1:1042-07:2:K3J7QZ2M'].entries()) {
      r.key({ key: ch, time: t });
      t += i === 8 ? 90 : 6;
    }
    expect(r.key({ key: 'Enter', time: t })).toBe('T1:1042-07:2:K3J7QZ2M');
  });

  it('ignores a very fast person (90 ms a key on average)', () => {
    expect(feed(createWedgeReader(), '1042-07', 90).out).toBeNull();
  });

  it('reads two scans in a row', () => {
    const r = createWedgeReader();
    const a = feed(r, '1111-01', 5, 0);
    const b = feed(r, '2222-02', 5, a.end + 300);
    expect([a.out, b.out]).toEqual(['1111-01', '2222-02']);
  });
});
