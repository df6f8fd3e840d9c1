import { describe, expect, it } from 'vitest';
import { en } from './en';
import { zhCN } from './zh-CN';
import { describeRefusal } from '../lib/refusal-text';
import { REJECTION_CODES } from '@shared/domain/vocabulary';

function leaves(obj: object, prefix = ''): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(obj)) {
    if (typeof v === 'string') out[prefix + k] = v;
    else Object.assign(out, leaves(v as object, `${prefix}${k}.`));
  }
  return out;
}

const LATIN_WORD = /[A-Za-z]{3,}/;
// Words that stay as they are in Chinese text: our product name, and the language's own name in the switcher.
const KEEP = new Set(['Trayce', 'English']);

describe('tablet translations', () => {
  const e = leaves(en);
  const z = leaves(zhCN);

  it('Chinese has every English key and no other', () => {
    expect(Object.keys(z).sort()).toEqual(Object.keys(e).sort());
  });

  it('keeps the same {{placeholders}} in both languages', () => {
    for (const key of Object.keys(e)) {
      const ph = (s: string) => [...s.matchAll(/\{\{(\w+)\}\}/g)].map((m) => m[1]).sort();
      expect(ph(z[key]), key).toEqual(ph(e[key]));
    }
  });

  it('has no English words left in the Chinese strings', () => {
    for (const [key, text] of Object.entries(z)) {
      const words = text.replace(/\{\{\w+\}\}/g, '').match(/[A-Za-z]{3,}/g) ?? [];
      expect(
        words.filter((w) => !KEEP.has(w)),
        key,
      ).toEqual([]);
    }
  });

  it('says every refusal in Chinese from its code and params, without English words', () => {
    const params = {
      minutesLeft: 12,
      readyAt: '2025-06-02T10:00:00.000Z',
      good: 8,
      scrap: 1,
      quantityIn: 10,
      expectedKind: 'fill',
      stationKind: 'polish',
      expectedSeq: 6,
      currentRevision: 2,
      reason: 'future',
      occurredAt: '2025-06-02T10:00:00.000Z',
      limit: '2025-06-02T09:00:00.000Z',
    };
    for (const code of REJECTION_CODES) {
      // (a reason code the person typed would be data, not our words)
      const m = describeRefusal('zh-CN', code, code === 'scrap_reason_missing' ? { ...params, reason: null } : params, () => '10:00');
      for (const part of [m.title, m.detail, m.next]) expect(LATIN_WORD.test(part), `${code}: ${part}`).toBe(false);
      const english = describeRefusal('en', code, params, () => '10:00');
      expect(english.title).not.toBe(m.title);
    }
  });
});
