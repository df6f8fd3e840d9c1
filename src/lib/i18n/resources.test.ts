import { describe, expect, it } from 'vitest';
import { resources } from './resources';

function leaves(obj: object, prefix = ''): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(obj)) {
    if (typeof v === 'string') out[prefix + k] = v;
    else Object.assign(out, leaves(v as object, `${prefix}${k}.`));
  }
  return out;
}

// Words that stay as they are in Chinese text: the product's name, the other language's own name
// in the switcher, the trade's abbreviations (FPY, WIP, CSV, QR, PDF, PIN, URL), the yes/no a
// CSV cell takes, and what is shown as <code> (file columns, values to type as they are).
const KEEP = new Set(['Trayce', 'English', 'FPY', 'WIP', 'CSV', 'QR', 'PDF', 'PIN', 'URL', 'TRAYCE_PUBLIC_URL', 'localhost', 'HTTPS', 'https', 'yes']);

describe('every namespace in both languages', () => {
  for (const ns of Object.keys(resources.en) as (keyof (typeof resources)['en'])[]) {
    const e = leaves(resources.en[ns]);
    const z = leaves(resources['zh-CN'][ns]);

    it(`${ns}: Chinese has every English key and no other`, () => {
      expect(Object.keys(z).sort()).toEqual(Object.keys(e).sort());
    });

    it(`${ns}: keeps the same {{placeholders}}`, () => {
      const ph = (s: string) => [...s.matchAll(/\{\{(\w+)\}\}/g)].map((m) => m[1]).sort();
      for (const key of Object.keys(e)) expect(ph(z[key]), key).toEqual(ph(e[key]));
    });

    it(`${ns}: no English words left in the Chinese strings`, () => {
      for (const [key, text] of Object.entries(z)) {
        const words =
          text
            .replace(/\{\{\w+\}\}/g, '')
            .replace(/<code>.*?<\/code>/g, '')
            .replace(/<\/?\w+>/g, '')
            .match(/[A-Za-z_]{3,}/g) ?? [];
        expect(
          words.filter((w) => !KEEP.has(w)),
          key,
        ).toEqual([]);
      }
    });
  }
});
