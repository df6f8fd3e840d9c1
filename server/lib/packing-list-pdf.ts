// The packing list that travels with a shipment: A4, the order, the carrier and tracking
// number, each carton line with its pieces and weight, and the totals. Our house font embedded.
import PDFDocument from 'pdfkit';
import type { ShipmentView } from '@shared/schemas/shipping';
import { fontFile } from './traveller-pdf';
import { faceFor, registerCjkFonts } from './pdf-fonts';
import { printWords, type PrintWords } from './print-words';

export interface PackingListInput {
  factory: string;
  timeZone: string;
  orderNumber: string;
  title: string;
  customer: string;
  contactName: string | null;
  ordered: number;
  shipment: ShipmentView;
  /** pieces shipped up to and including this shipment */
  shippedSoFar: number;
}

const MM = 72 / 25.4;
const INK = '#111111';
const GREY = '#555555';

export function renderPackingList(input: PackingListInput, words: PrintWords = printWords('en')): Promise<Buffer> {
  const { shipment: s } = input;
  const w = words.packing;
  const kg = words.kg;
  const doc = new PDFDocument({
    size: 'A4',
    margin: 18 * MM,
    info: { Title: `${w.title} ${input.orderNumber}-${s.number}`, Author: input.factory, Subject: input.title },
  });
  doc.registerFont('body', fontFile(400));
  doc.registerFont('bold', fontFile(700));
  registerCjkFonts(doc);
  // the house face, or the Chinese one when the text has Chinese in it
  const face = (text: string, bold = false) => faceFor(text, bold ? 'bold' : 'body', bold);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;

  doc.font(face(w.title, true)).fontSize(22).fillColor(INK).text(w.title, left, doc.page.margins.top);
  doc.font(face(input.factory)).fontSize(11).fillColor(GREY).text(input.factory);
  doc.moveDown(1);

  const field = (label: string, value: string) => {
    const y = doc.y;
    doc
      .font(face(label))
      .fontSize(10)
      .fillColor(GREY)
      .text(label, left, y, { width: 45 * MM });
    doc
      .font(face(value, true))
      .fontSize(12)
      .fillColor(INK)
      .text(value, left + 46 * MM, y, { width: width - 46 * MM });
    doc.moveDown(0.35);
  };
  field(w.order, input.orderNumber);
  field(w.orderTitle, input.title);
  field(w.customer, input.contactName ? `${input.customer} (${input.contactName})` : input.customer);
  field(w.shipment, `${s.number}`);
  field(w.shipped, words.when(s.shippedAt, input.timeZone));
  field(w.carrier, s.carrier);
  field(w.tracking, s.trackingNumber);
  doc.moveDown(1);

  // Carton table
  const cols = [
    { title: w.cartons, w: 30 * MM, align: 'right' as const },
    { title: w.perCarton, w: 45 * MM, align: 'right' as const },
    { title: w.pieces, w: 35 * MM, align: 'right' as const },
    { title: w.weightPerCarton, w: 0, align: 'right' as const },
  ];
  cols[3].w = width - cols[0].w - cols[1].w - cols[2].w;
  const row = (cells: string[], font: 'body' | 'bold') => {
    const y = doc.y;
    let x = left;
    doc.fontSize(11).fillColor(INK);
    cells.forEach((c, i) => {
      doc.font(face(c, font === 'bold'));
      doc.text(c, x, y, { width: cols[i].w - 4 * MM, align: cols[i].align });
      x += cols[i].w;
    });
    doc.y = y + 18;
    doc
      .moveTo(left, doc.y - 4)
      .lineTo(left + width, doc.y - 4)
      .lineWidth(0.5)
      .strokeColor('#999999')
      .stroke();
  };
  row(
    cols.map((c) => c.title),
    'bold',
  );
  for (const c of s.cartons) {
    row([String(c.count), String(c.piecesPerCarton), String(c.count * c.piecesPerCarton), c.weightKg != null ? kg(c.weightKg) : '–'], 'body');
  }
  row([String(s.cartonCount), w.total, String(s.pieces), w.inAll(kg(s.weightKg))], 'bold');
  doc.moveDown(1);

  const more = input.ordered - input.shippedSoFar;
  const summary = w.summary(input.ordered, input.shippedSoFar, more);
  doc.font(face(summary)).fontSize(11).fillColor(INK);
  doc.text(summary, left, doc.y, { width });
  if (s.shortAccepted) doc.moveDown(0.5).font(face(w.short)).text(w.short, { width });
  doc.moveDown(2);
  doc.font(face(w.signatures)).fontSize(10).fillColor(GREY).text(w.signatures, left, doc.y, { width });
  doc.end();
  return done;
}
