// The unpacked font must be the same font: checked with fontkit (the font parser pdfkit uses),
// reading the original WOFF and our sfnt side by side (W3C WOFF File Format 1.0).
import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import { createRequire } from 'node:module';
import { woffToSfnt } from './woff';
import { fontFile } from './traveller-pdf';

// fontkit comes with pdfkit and ships no type declarations
const fontkit = createRequire(import.meta.url)('fontkit') as { create(buf: Buffer): unknown };

type Font = {
  numGlyphs: number;
  postscriptName: string;
  unitsPerEm: number;
  layout(s: string): { advanceWidth: number; glyphs: { id: number; path: { toSVG(): string } }[] };
};

describe('WOFF → sfnt', () => {
  for (const weight of [400, 700] as const) {
    it(`Atkinson Hyperlegible ${weight}: same glyphs, metrics and outlines as the WOFF`, () => {
      const woff = fs.readFileSync(fontFile(weight));
      const sfnt = woffToSfnt(woff);
      // sfnt version 0x00010000 (TrueType outlines) or 'OTTO'
      expect([0x00010000, 0x4f54544f]).toContain(sfnt.readUInt32BE(0));
      const a = fontkit.create(woff) as unknown as Font;
      const b = fontkit.create(sfnt) as unknown as Font;
      expect(b.postscriptName).toBe(a.postscriptName);
      expect(b.numGlyphs).toBe(a.numGlyphs);
      expect(b.unitsPerEm).toBe(a.unitsPerEm);
      const text = 'Tray 1042-07 · Colour 2 of 3: cure — Ünïcødé';
      const la = a.layout(text);
      const lb = b.layout(text);
      expect(lb.advanceWidth).toBe(la.advanceWidth);
      expect(lb.glyphs.map((g) => g.id)).toEqual(la.glyphs.map((g) => g.id));
      expect(lb.glyphs.map((g) => g.path.toSVG())).toEqual(la.glyphs.map((g) => g.path.toSVG()));
    });
  }

  it('refuses what is not WOFF', () => {
    expect(() => woffToSfnt(Buffer.from('not a font at all, just some bytes to read here....'))).toThrow(/WOFF/);
  });
});
