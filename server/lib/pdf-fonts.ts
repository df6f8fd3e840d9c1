// The faces our PDFs print with: Atkinson Hyperlegible (the house font, Latin) and Noto Sans
// Hans (Simplified Chinese, from the @embedpdf/fonts-sc package) for any text with Chinese,
// Japanese or Korean characters in it, so a colour named 深蓝 or a customer named 星河徽章俱乐部
// prints instead of vanishing. pdfkit embeds only the glyphs a document uses (a subset), and only
// the faces it draws with: a document without Chinese text carries no Chinese font.
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { fonts as cjkFonts } from '@embedpdf/fonts-sc';

const require = createRequire(import.meta.url);

/** Han ideographs (with extensions), CJK punctuation, kana, bopomofo, Hangul and full-width forms. */
const CJK_TEXT =
  /[\u2E80-\u2FDF\u3000-\u30FF\u3100-\u312F\u3190-\u31FF\u3200-\u9FFF\uA960-\uA97F\uAC00-\uD7AF\uF900-\uFAFF\uFE30-\uFE4F\uFF00-\uFFEF\u{20000}-\u{3134F}]/u;

export function needsCjkFont(text: string): boolean {
  return CJK_TEXT.test(text);
}

/** The installed Noto Sans Hans file of that weight. */
export function cjkFontFile(weight: 400 | 700): string {
  const entry = cjkFonts.find((f) => f.weight === weight);
  if (!entry) throw new Error(`No CJK font of weight ${weight} in @embedpdf/fonts-sc`);
  // the package's entry point sits in dist/, its fonts in fonts/
  return path.join(path.dirname(require.resolve('@embedpdf/fonts-sc')), '..', 'fonts', entry.file);
}

const cache = new Map<400 | 700, Buffer>();
/** Read once: the files are large (about 8 MB each) and the same for every document. */
export function cjkFontBytes(weight: 400 | 700): Buffer {
  let b = cache.get(weight);
  if (!b) cache.set(weight, (b = fs.readFileSync(cjkFontFile(weight))));
  return b;
}

/** The names every document registers its CJK faces under. */
export const CJK_REGULAR = 'cjk-regular';
export const CJK_BOLD = 'cjk-bold';

interface FontRegistry {
  registerFont(name: string, src: Buffer): unknown;
}

/** Registers the CJK faces (pdfkit opens a face only when text is drawn with it). */
export function registerCjkFonts(doc: FontRegistry): void {
  doc.registerFont(CJK_REGULAR, cjkFontBytes(400));
  doc.registerFont(CJK_BOLD, cjkFontBytes(700));
}

/** The face to draw `text` with: the Latin one given, or the CJK face of the same weight. */
export function faceFor(text: string, latin: string, bold: boolean): string {
  return needsCjkFont(text) ? (bold ? CJK_BOLD : CJK_REGULAR) : latin;
}
