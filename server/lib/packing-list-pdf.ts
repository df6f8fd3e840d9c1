// The packing list that travels with a shipment: A4, the order, the carrier and tracking
// number, each carton line with its pieces and weight, and the totals. Our house font embedded.
import PDFDocument from 'pdfkit';
import type { ShipmentView } from '@shared/schemas/shipping';
import { fontFile } from './traveller-pdf';
import { faceFor, registerCjkFonts } from './pdf-fonts';

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

function when(iso: string, timeZone: string): string {
  return new Intl.DateTimeFormat('en-GB', { timeZone, day: 'numeric', month: 'long', year: 'numeric', hour: '2-digit', minute: '2-digit' }).format(
    new Date(iso),
  );
}

const kg = (n: number) => `${n.toLocaleString('en-GB', { maximumFractionDigits: 3 })} kg`;

export function renderPackingList(input: PackingListInput): Promise<Buffer> {
  const { shipment: s } = input;
  const doc = new PDFDocument({
    size: 'A4',
    margin: 18 * MM,
    info: { Title: `Packing list ${input.orderNumber}-${s.number}`, Author: input.factory, Subject: input.title },
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

  doc.font('bold').fontSize(22).fillColor(INK).text('Packing list', left, doc.page.margins.top);
  doc.font(face(input.factory)).fontSize(11).fillColor(GREY).text(input.factory);
  doc.moveDown(1);

  const field = (label: string, value: string) => {
    const y = doc.y;
    doc
      .font('body')
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
  field('Order', input.orderNumber);
  field('Title', input.title);
  field('Customer', input.contactName ? `${input.customer} (${input.contactName})` : input.customer);
  field('Shipment', `${s.number}`);
  field('Shipped', when(s.shippedAt, input.timeZone));
  field('Carrier', s.carrier);
  field('Tracking number', s.trackingNumber);
  doc.moveDown(1);

  // Carton table
  const cols = [
    { title: 'Cartons', w: 30 * MM, align: 'right' as const },
    { title: 'Pieces per carton', w: 45 * MM, align: 'right' as const },
    { title: 'Pieces', w: 35 * MM, align: 'right' as const },
    { title: 'Weight per carton', w: 0, align: 'right' as const },
  ];
  cols[3].w = width - cols[0].w - cols[1].w - cols[2].w;
  const row = (cells: string[], font: 'body' | 'bold') => {
    const y = doc.y;
    let x = left;
    doc.font(font).fontSize(11).fillColor(INK);
    cells.forEach((c, i) => {
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
  row([String(s.cartonCount), 'Total', String(s.pieces), `${kg(s.weightKg)} in all`], 'bold');
  doc.moveDown(1);

  doc.font('body').fontSize(11).fillColor(INK);
  const more = input.ordered - input.shippedSoFar;
  doc.text(
    `Ordered: ${input.ordered} pieces. Shipped so far, including this shipment: ${input.shippedSoFar} pieces.${more > 0 ? ` ${more} pieces are still to come.` : ''}`,
    left,
    doc.y,
    { width },
  );
  if (s.shortAccepted) doc.moveDown(0.5).text('This order ships fewer pieces than ordered, by agreement.', { width });
  doc.moveDown(2);
  doc.font('body').fontSize(10).fillColor(GREY).text('Packed by: ____________________    Checked by: ____________________', left, doc.y, { width });
  doc.end();
  return done;
}
