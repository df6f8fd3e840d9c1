// Renders travellers to pixels with poppler's pdftoppm and reads the QR back with jsQR, an
// independent decoder (not the library that drew it). Checks against ISO/IEC 18004:
// a version V symbol is 17 + 4V modules square, and a 4-module quiet zone surrounds it.
import { describe, expect, it, beforeAll, afterAll } from 'vitest';
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import jsQR from 'jsqr';
import { PNG } from 'pngjs';
import { renderTravellersPdf, QR_BLOCK_MM, type TravellerCard, type TravellerLayout } from './traveller-pdf';
import { DEFAULT_ROUTING_TEMPLATES, expandRouting, mouldRouting } from '@shared/domain/routing';
import { makeTravellerCode, verifyTravellerCode } from '@shared/domain/traveller-code';

const KEY = 'pdf-test-key-0123456789abcdefghij';
const DPI = 300;
let dir: string;

beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'trayce-pdf-'));
});
afterAll(() => {
  fs.rmSync(dir, { recursive: true, force: true });
});

function card(number: string, revision: number, over: Partial<TravellerCard> = {}): TravellerCard {
  const colours = [{ name: 'Navy', ref: 'C-281', hex: '#1b2a4a' }, { name: 'White', hex: '#ffffff' }, { name: 'Signal red', hex: '#c8102e' }, { name: 'Gold' }];
  return {
    kind: 'tray',
    number,
    code: makeTravellerCode({ number, revision }, KEY),
    revision,
    orderNumber: number.split('-')[0],
    customer: 'Harbour Rowing Club',
    title: 'Club crest with crossed oars',
    quantity: 100,
    caption: 'Tray 7 of 11',
    process: 'hard_enamel',
    material: 'iron',
    sizeMm: 25,
    colours,
    plating: 'gold',
    fittings: '2 × butterfly clutch',
    packaging: 'individual_bag',
    dueDate: '2026-04-30',
    routing: expandRouting(DEFAULT_ROUTING_TEMPLATES.hard_enamel, {
      process: 'hard_enamel',
      colours,
      backLogo: false,
      printing: true,
      epoxy: true,
      backing: { type: 'butterfly_clutch', count: 2 },
      plating: 'gold',
      secondPlating: null,
      sandblast: false,
    }),
    ...over,
  };
}

function rasterise(pdf: Buffer, page: number): PNG {
  const file = path.join(dir, `t${Date.now()}-${page}.pdf`);
  fs.writeFileSync(file, pdf);
  const prefix = file.replace(/\.pdf$/, '');
  execFileSync('pdftoppm', ['-r', String(DPI), '-gray', '-png', '-singlefile', '-f', String(page), '-l', String(page), file, prefix]);
  return PNG.sync.read(fs.readFileSync(`${prefix}.png`));
}

function crop(png: PNG, x0: number, y0: number, w: number, h: number): { data: Uint8ClampedArray; width: number; height: number } {
  const out = new Uint8ClampedArray(w * h * 4);
  for (let y = 0; y < h; y++) {
    png.data.copy(Buffer.from(out.buffer), y * w * 4, ((y0 + y) * png.width + x0) * 4, ((y0 + y) * png.width + x0 + w) * 4);
  }
  return { data: out, width: w, height: h };
}

interface Decoded {
  text: string;
  version: number;
  modulePx: number;
  symbolMm: number;
  quietZoneClean: boolean;
}

/** Decodes the QR of an image and measures the symbol and its quiet zone. */
function decode(img: { data: Uint8ClampedArray; width: number; height: number }): Decoded | null {
  const r = jsQR(img.data, img.width, img.height, { inversionAttempts: 'dontInvert' });
  if (!r) return null;
  const { topLeftCorner: tl, topRightCorner: tr, bottomLeftCorner: bl } = r.location;
  const widthPx = Math.hypot(tr.x - tl.x, tr.y - tl.y);
  const heightPx = Math.hypot(bl.x - tl.x, bl.y - tl.y);
  const modules = 17 + 4 * r.version; // ISO/IEC 18004: version V is 17 + 4V modules square
  const modulePx = (widthPx + heightPx) / 2 / modules;
  // every pixel of the 4-module band around the symbol must be light
  const quiet = 4 * modulePx;
  const x0 = Math.round(tl.x - quiet + 1);
  const y0 = Math.round(tl.y - quiet + 1);
  const x1 = Math.round(tl.x + widthPx + quiet - 1);
  const y1 = Math.round(tl.y + heightPx + quiet - 1);
  let clean = x0 >= 0 && y0 >= 0 && x1 < img.width && y1 < img.height;
  for (let y = Math.max(0, y0); clean && y <= Math.min(img.height - 1, y1); y++) {
    for (let x = Math.max(0, x0); x <= Math.min(img.width - 1, x1); x++) {
      const inside = x > tl.x - 1 && x < tl.x + widthPx + 1 && y > tl.y - 1 && y < tl.y + heightPx + 1;
      if (inside) continue;
      if (img.data[(y * img.width + x) * 4] < 128) {
        clean = false;
        break;
      }
    }
  }
  return { text: r.data, version: r.version, modulePx, symbolMm: (widthPx / DPI) * 25.4, quietZoneClean: clean };
}

function decodeWhole(png: PNG) {
  return decode({ data: new Uint8ClampedArray(png.data.buffer, png.data.byteOffset, png.data.length), width: png.width, height: png.height });
}

describe('traveller PDF → image → QR (independent decoder: jsQR; values: ISO/IEC 18004)', () => {
  it('A6: decodes to the tray code, version ≤ 4, a clean 4-module quiet zone, at least 20 mm', async () => {
    const c = card('1042-07', 2);
    const pdf = await renderTravellersPdf([c], 'a6');
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const png = rasterise(pdf, 1);
    const d = decodeWhole(png);
    expect(d).not.toBeNull();
    expect(d!.text).toBe(c.code);
    expect(verifyTravellerCode(d!.text, KEY, 2).status).toBe('ok');
    expect(d!.version).toBeLessThanOrEqual(4);
    expect(d!.quietZoneClean).toBe(true);
    expect(d!.symbolMm).toBeGreaterThanOrEqual(20);
    // symbol + quiet zone is the QR block drawn on the card
    const blockMm = ((d!.modulePx * (17 + 4 * d!.version + 8)) / DPI) * 25.4;
    expect(blockMm).toBeCloseTo(QR_BLOCK_MM, 0);
  });

  it('a tampered card would not verify: the decoded text carries the MAC of its revision', async () => {
    const c = card('1042-07', 3);
    const d = decodeWhole(rasterise(await renderTravellersPdf([c], 'a6'), 1));
    expect(verifyTravellerCode(d!.text, KEY, 4)).toMatchObject({ status: 'void_traveller', currentRevision: 4 });
  });

  const layouts: { layout: TravellerLayout; perPage: number; grid: [number, number] }[] = [
    { layout: 'a4x2', perPage: 2, grid: [2, 1] },
    { layout: 'a4x4', perPage: 4, grid: [2, 2] },
  ];
  for (const { layout, perPage, grid } of layouts) {
    it(`${layout}: every card on the sheet decodes to its own tray`, async () => {
      const cards = Array.from({ length: perPage }, (_, i) =>
        i === 1 ? card('1042-MF', 1, { kind: 'mould', caption: 'Front mould · new', routing: mouldRouting({ reuse: false }) }) : card(`1042-0${i + 1}`, 1),
      );
      const pdf = await renderTravellersPdf(cards, layout);
      const png = rasterise(pdf, 1);
      const w = Math.floor(png.width / grid[0]);
      const h = Math.floor(png.height / grid[1]);
      for (let i = 0; i < perPage; i++) {
        const col = i % grid[0];
        const row = Math.floor(i / grid[0]);
        const d = decode(crop(png, col * w, row * h, w, h));
        expect(d, `card ${i + 1}`).not.toBeNull();
        expect(d!.text).toBe(cards[i].code);
        expect(d!.version).toBeLessThanOrEqual(4);
        expect(d!.quietZoneClean).toBe(true);
        expect(d!.symbolMm).toBeGreaterThanOrEqual(20);
      }
    });
  }

  it('embeds our font and makes one page per card on A6', async () => {
    const pdf = await renderTravellersPdf([card('1042-01', 1), card('1042-02', 1), card('1042-03', 1)], 'a6');
    const file = path.join(dir, 'fonts.pdf');
    fs.writeFileSync(file, pdf);
    const fonts = execFileSync('pdffonts', [file]).toString();
    expect(fonts).toMatch(/AtkinsonHyperlegible-Regular/);
    expect(fonts).toMatch(/AtkinsonHyperlegible-Bold/);
    expect(fonts).not.toMatch(/Helvetica/);
    const info = execFileSync('pdfinfo', [file]).toString();
    expect(info).toMatch(/Pages:\s+3/);
    // A6 is 105 × 148 mm = 297.64 × 419.53 pt
    expect(info).toMatch(/Page size:\s+297\.6\d* x 419\.5\d* pts/);
    const text = execFileSync('pdftotext', [file, '-']).toString();
    expect(text).toContain('1042-02');
    expect(text).toContain('Colour 3 of 4: cure');
  });

  it('prints Chinese colour and customer names with an embedded CJK face, read back by pdftotext', async () => {
    const colours = [
      { name: '深蓝', ref: 'C-281', hex: '#1b2a4a' },
      { name: 'White', hex: '#ffffff' },
    ];
    const pdf = await renderTravellersPdf([card('1042-01', 1, { customer: '星河徽章俱乐部', title: '星河 crest', colours })], 'a6');
    const file = path.join(dir, 'chinese.pdf');
    fs.writeFileSync(file, pdf);
    // poppler reads the text back independently of pdfkit; without a face that has the glyphs
    // the characters would be missing from the page
    const text = execFileSync('pdftotext', [file, '-']).toString();
    expect(text).toContain('深蓝');
    expect(text).toContain('星河徽章俱乐部');
    expect(text).toContain('White');
    const fonts = execFileSync('pdffonts', [file]).toString();
    expect(fonts).toMatch(/NotoSansHans-Regular/);
    // embedded as a subset (pdffonts: emb yes, sub yes), so the file stays small
    const noto = fonts.split('\n').find((l) => l.includes('NotoSansHans-Regular'))!;
    expect(noto).toMatch(/\+NotoSansHans-Regular.*\byes\s+yes\b/);
    expect(pdf.length).toBeLessThan(400_000);
  });

  it('a card without Chinese text carries no Chinese face', async () => {
    const pdf = await renderTravellersPdf([card('1042-01', 1)], 'a6');
    const file = path.join(dir, 'latin.pdf');
    fs.writeFileSync(file, pdf);
    expect(execFileSync('pdffonts', [file]).toString()).not.toMatch(/Noto/);
  });

  it('refuses an empty batch', async () => {
    await expect(renderTravellersPdf([], 'a6')).rejects.toThrow();
  });
});
