// Printed travellers: one card per tray or mould, A6, or two (A5) / four (A6) per A4 sheet.
// The QR is drawn as vector modules with the full 4-module quiet zone (ISO/IEC 18004).
import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import { createRequire } from 'node:module';
import fs from 'node:fs';
import path from 'node:path';
import { woffToSfnt } from './woff';
import { faceFor, registerCjkFonts } from './pdf-fonts';
import { printWords, type PrintWords } from './print-words';
import type { RoutingStep } from '@shared/domain/vocabulary';
import type { TravellerLayoutValue } from '@shared/schemas/travellers';
import { cures } from '@shared/domain/traveller';

const require = createRequire(import.meta.url);

/** Our house font, embedded from the installed package (WOFF; pdfkit reads it through fontkit). */
export function fontFile(weight: 400 | 700): string {
  const dir = path.join(path.dirname(require.resolve('@fontsource/atkinson-hyperlegible/package.json')), 'files');
  return path.join(dir, `atkinson-hyperlegible-latin-${weight}-normal.woff`);
}
/**
 * The font unpacked from WOFF to a plain sfnt once: pdfkit's own WOFF reading inflates the
 * tables in pure JavaScript for every document, which was most of a travellers PDF's time.
 */
const sfnt = new Map<400 | 700, Buffer>();
export function fontBytes(weight: 400 | 700): Buffer {
  let b = sfnt.get(weight);
  if (!b) sfnt.set(weight, (b = woffToSfnt(fs.readFileSync(fontFile(weight)))));
  return b;
}

export type TravellerLayout = TravellerLayoutValue;

export interface TravellerCard {
  kind: 'tray' | 'mould';
  number: string;
  /** the exact text in the QR code */
  code: string;
  revision: number;
  orderNumber: string;
  customer: string;
  title: string;
  quantity: number;
  /** "Tray 3 of 11", "Front mould", "Split from 1042-03" */
  caption: string;
  process: string;
  material: string;
  sizeMm: number;
  colours: { name: string; ref?: string; hex?: string }[];
  plating: string;
  /** a two-tone badge's second finish */
  secondPlating?: string | null;
  /** ready to print, in the print language ("2 × butterfly clutch") */
  fittings: string;
  packaging: string;
  dueDate: string;
  routing: RoutingStep[];
  /** PNG or JPEG of the approved proof, when it is an image */
  artwork?: Buffer | null;
  /** a line under the artwork when there is no image (e.g. "Proof rev 2 (PDF)") */
  artworkNote?: string;
  notes?: string;
}

const MM = 72 / 25.4;
// The card is designed at A6 (105 × 148 mm) and scaled for A5.
const CARD_W = 105 * MM;
const CARD_H = 148 * MM;
/** QR block including its quiet zone, in mm on an A6 card. */
export const QR_BLOCK_MM = 30;
export const QR_QUIET_MODULES = 4;

const INK = '#111111';
const GREY = '#555555';
const RULE = '#999999';

export function humanise(value: string): string {
  const s = value.replace(/_/g, ' ');
  return s.charAt(0).toUpperCase() + s.slice(1);
}

interface Slot {
  x: number;
  y: number;
  scale: number;
}

function pageSlots(layout: TravellerLayout): { size: [number, number]; slots: Slot[] } {
  const a4: [number, number] = [210 * MM, 297 * MM];
  switch (layout) {
    case 'a6':
      return { size: [CARD_W, CARD_H], slots: [{ x: 0, y: 0, scale: 1 }] };
    case 'a4x2': {
      // A4 landscape holds two A5 portrait cards; A5 is A6 × √2
      const s = Math.SQRT2;
      return {
        size: [a4[1], a4[0]],
        slots: [
          { x: 0, y: 0, scale: s },
          { x: a4[1] / 2, y: 0, scale: s },
        ],
      };
    }
    case 'a4x4':
      return {
        size: a4,
        slots: [
          { x: 0, y: 0, scale: 1 },
          { x: a4[0] / 2, y: 0, scale: 1 },
          { x: 0, y: a4[1] / 2, scale: 1 },
          { x: a4[0] / 2, y: a4[1] / 2, scale: 1 },
        ],
      };
  }
}

type Doc = PDFKit.PDFDocument;

function drawQr(doc: Doc, code: string, x: number, y: number, size: number): void {
  const qr = QRCode.create(code, { errorCorrectionLevel: 'Q' });
  const n = qr.modules.size;
  const total = n + 2 * QR_QUIET_MODULES;
  const m = size / total;
  doc.save();
  doc.rect(x, y, size, size).fill('#ffffff');
  const ox = x + QR_QUIET_MODULES * m;
  const oy = y + QR_QUIET_MODULES * m;
  // one path for all dark modules; horizontal runs merged to keep the file small
  for (let r = 0; r < n; r++) {
    let c = 0;
    while (c < n) {
      if (!qr.modules.get(r, c)) {
        c++;
        continue;
      }
      const start = c;
      while (c < n && qr.modules.get(r, c)) c++;
      doc.rect(ox + start * m, oy + r * m, (c - start) * m, m);
    }
  }
  doc.fill('#000000');
  doc.restore();
}

function text(
  doc: Doc,
  value: string,
  x: number,
  y: number,
  opts: { size: number; bold?: boolean; width: number; color?: string; lines?: number; align?: 'left' | 'right' | 'center' },
): number {
  doc
    .font(faceFor(value, opts.bold ? 'bold' : 'regular', !!opts.bold))
    .fontSize(opts.size)
    .fillColor(opts.color ?? INK);
  const lineHeight = doc.currentLineHeight(true);
  const height = lineHeight * (opts.lines ?? 1);
  doc.text(value, x, y, { width: opts.width, height, ellipsis: true, lineBreak: (opts.lines ?? 1) > 1, align: opts.align ?? 'left' });
  return Math.min(doc.heightOfString(value, { width: opts.width }), height);
}

function drawSwatch(doc: Doc, hex: string | undefined, x: number, y: number, s: number): void {
  if (hex) {
    doc.rect(x, y, s, s).fillAndStroke(hex, INK);
  } else {
    // no swatch given: an outlined box with a diagonal, so it never looks like white
    doc.rect(x, y, s, s).lineWidth(0.5).stroke(INK);
    doc
      .moveTo(x, y + s)
      .lineTo(x + s, y)
      .stroke(GREY);
  }
}

type Images = Map<Buffer, unknown>;

function drawCard(doc: Doc, card: TravellerCard, slot: Slot, images: Images, words: PrintWords): void {
  const w = words.traveller;
  const name = <K extends string>(names: Record<K, string>, code: string) => names[code as K] ?? humanise(code);
  const plating = card.secondPlating
    ? w.twoTone(name(words.plating, card.plating), name(words.plating, card.secondPlating))
    : name(words.plating, card.plating);
  doc.save();
  doc.translate(slot.x, slot.y).scale(slot.scale);
  const pad = 5 * MM;
  const W = CARD_W - 2 * pad;

  // --- top: QR with the tray number under it, and the order on the right
  const qrSize = QR_BLOCK_MM * MM;
  drawQr(doc, card.code, pad, pad, qrSize);
  // under the QR, outside its quiet zone: the number to type when the code cannot be read
  text(doc, card.number, pad, pad + qrSize + 0.3 * MM, { size: 11, bold: true, width: qrSize, align: 'center' });

  const rx = pad + qrSize + 3 * MM;
  const rw = CARD_W - pad - rx;
  let y = pad;
  text(doc, card.kind === 'mould' ? w.mouldTraveller : w.trayTraveller, rx, y, { size: 7, width: rw - 14 * MM, color: GREY });
  // revision mark, top right
  doc
    .roundedRect(CARD_W - pad - 13 * MM, y - 1, 13 * MM, 5.5 * MM, 2)
    .lineWidth(0.8)
    .stroke(INK);
  text(doc, w.rev(card.revision), CARD_W - pad - 13 * MM, y + 0.6 * MM, { size: 8, bold: true, width: 13 * MM, align: 'center' });
  y += 5 * MM;
  text(doc, card.number, rx, y, { size: 22, bold: true, width: rw });
  y += 9 * MM;
  text(doc, card.caption, rx, y, { size: 8, width: rw, color: GREY });
  y += 4 * MM;
  text(doc, w.order(card.orderNumber, card.customer), rx, y, { size: 8, bold: true, width: rw });
  y += 4 * MM;
  y += text(doc, card.title, rx, y, { size: 8, width: rw, lines: 2 }) + 1 * MM;
  text(doc, card.kind === 'mould' ? w.mould : w.pieces(card.quantity), rx, Math.max(y, pad + 24 * MM), { size: 14, bold: true, width: rw });

  // --- spec and artwork
  y = pad + qrSize + 6 * MM;
  const artSize = 24 * MM;
  const specW = W - artSize - 3 * MM;
  const specLines: [string, string][] = [
    [w.labels.process, `${name(words.process, card.process)} · ${name(words.material, card.material)} · ${card.sizeMm} mm`],
    [w.labels.plating, plating],
    [w.labels.fittings, card.fittings],
    [w.labels.packing, name(words.packaging, card.packaging)],
    [w.labels.due, words.day(card.dueDate)],
  ];
  let sy = y;
  for (const [label, value] of specLines) {
    text(doc, label, pad, sy, { size: 7, width: 14 * MM, color: GREY });
    text(doc, value, pad + 14 * MM, sy, { size: 8, bold: label === w.labels.due, width: specW - 14 * MM });
    sy += 3.8 * MM;
  }
  const ax = CARD_W - pad - artSize;
  doc.rect(ax, y, artSize, artSize).lineWidth(0.5).stroke(RULE);
  let drawn = false;
  if (card.artwork) {
    // the artwork is a thumbnail we made at upload; should pdfkit still refuse it, the card
    // prints without a picture rather than failing the whole PDF
    try {
      let img = images.get(card.artwork);
      if (img === undefined) {
        img = (doc as unknown as { openImage(src: Buffer): unknown }).openImage(card.artwork);
        images.set(card.artwork, img);
      }
      doc.image(img as Buffer, ax + 1, y + 1, { fit: [artSize - 2, artSize - 2], align: 'center', valign: 'center' });
      drawn = true;
    } catch {
      images.set(card.artwork, null);
    }
  }
  if (!drawn) {
    text(doc, card.artworkNote ?? w.noArtwork, ax + 1 * MM, y + artSize / 2 - 3 * MM, {
      size: 6,
      width: artSize - 2 * MM,
      color: GREY,
      lines: 2,
      align: 'center',
    });
  }

  // --- colours as swatches with names
  y = Math.max(sy, y + artSize) + 2 * MM;
  if (card.colours.length > 0) {
    let cx = pad;
    const sw = 3.2 * MM;
    for (const [i, c] of card.colours.entries()) {
      const label = `${i + 1} ${c.name}${c.ref ? ` (${c.ref})` : ''}`;
      doc.font(faceFor(label, 'regular', false)).fontSize(7);
      const w = sw + 1.2 * MM + Math.min(doc.widthOfString(label), 40 * MM) + 3 * MM;
      if (cx + w > CARD_W - pad && cx > pad) {
        cx = pad;
        y += 4.2 * MM;
      }
      drawSwatch(doc, c.hex, cx, y, sw);
      text(doc, label, cx + sw + 1.2 * MM, y + 0.2 * MM, { size: 7, width: 40 * MM });
      cx += w;
    }
    y += 5 * MM;
  }

  // --- routing as a checklist, a box per step, in as many columns as it needs
  doc
    .moveTo(pad, y)
    .lineTo(CARD_W - pad, y)
    .lineWidth(0.5)
    .stroke(RULE);
  y += 1.5 * MM;
  const footerH = 6 * MM;
  const areaH = CARD_H - pad - footerH - y;
  const steps = card.routing;
  let rowH = 4.4 * MM;
  let cols = Math.max(1, Math.ceil(steps.length / Math.max(1, Math.floor(areaH / rowH))));
  if (cols > 2) {
    cols = 2;
    rowH = areaH / Math.ceil(steps.length / 2);
  }
  const perCol = Math.max(1, Math.floor(areaH / rowH));
  const colW = W / cols;
  const fontSize = Math.min(7.5, Math.max(5, (rowH / MM) * 1.75));
  const box = Math.min(3 * MM, rowH * 0.72);
  steps.forEach((s, i) => {
    const col = Math.floor(i / perCol);
    const row = i % perCol;
    const x = pad + col * colW;
    const ry = y + row * rowH;
    doc.rect(x, ry, box, box).lineWidth(0.6).stroke(INK);
    const ty = ry + (box - fontSize * 0.9) / 2;
    const cureW = 11 * MM;
    text(doc, `${s.seq}. ${s.name}`, x + box + 1.2 * MM, ty, { size: fontSize, width: colW - box - cureW - 2.5 * MM });
    if (cures(s.stationKind) && s.cureMinutes) {
      // the minimum cure time; the next step may not start before it has run out
      text(doc, w.cure(s.cureMinutes), x + colW - cureW - 1.5 * MM, ty, { size: fontSize, bold: true, width: cureW, align: 'right' });
    }
  });

  // --- footer
  const fy = CARD_H - pad - 3 * MM;
  const note = card.revision > 1 ? w.reprint(card.revision) : w.revision(card.revision);
  text(doc, note, pad, fy, { size: 6.5, width: W * 0.7, color: GREY });
  text(doc, 'Trayce', pad + W * 0.7, fy, { size: 6.5, bold: true, width: W * 0.3, align: 'right', color: GREY });

  doc.restore();
}

/** Builds the PDF of one or more travellers. */
export function renderTravellersPdf(cards: readonly TravellerCard[], layout: TravellerLayout = 'a6', words: PrintWords = printWords('en')): Promise<Buffer> {
  if (cards.length === 0) return Promise.reject(new Error('No travellers to print'));
  const { size, slots } = pageSlots(layout);
  const doc = new PDFDocument({ size, margin: 0, autoFirstPage: false, info: { Title: words.traveller.title, Creator: 'Trayce' } });
  doc.registerFont('regular', fontBytes(400));
  doc.registerFont('bold', fontBytes(700));
  registerCjkFonts(doc);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const images: Images = new Map();
  cards.forEach((card, i) => {
    const slotIndex = i % slots.length;
    if (slotIndex === 0) {
      doc.addPage({ size, margin: 0 });
      if (slots.length > 1) drawCutLines(doc, layout, size);
    }
    drawCard(doc, card, slots[slotIndex], images, words);
  });
  doc.end();
  return done;
}

function drawCutLines(doc: Doc, layout: TravellerLayout, [w, h]: [number, number]): void {
  doc.save().lineWidth(0.3).dash(3, { space: 3 }).strokeColor(RULE);
  doc
    .moveTo(w / 2, 0)
    .lineTo(w / 2, h)
    .stroke();
  if (layout === 'a4x4')
    doc
      .moveTo(0, h / 2)
      .lineTo(w, h / 2)
      .stroke();
  doc.undash().restore();
}
