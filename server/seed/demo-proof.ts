// A small artwork proof for a demo order: a PDF drawn with pdfkit (a badge outline filled with
// the order's colours, the spec beside it). Invented artwork; the creation date is fixed so
// the same order always gives the same file (and the same content hash).
import PDFDocument from 'pdfkit';
import type { ColourSpec } from '../db/schema/orders';

export interface ProofSpec {
  number: string;
  customer: string;
  title: string;
  process: string;
  sizeMm: number;
  plating: string;
  colours: ColourSpec[];
  backLogo: boolean;
  revision: number;
  createdAt: number;
}

const words = (s: string) => s.replace(/_/g, ' ');

export function demoProofPdf(spec: ProofSpec): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A6',
    layout: 'landscape',
    margin: 18,
    compress: true,
    info: { Title: `Proof ${spec.number} rev ${spec.revision}`, Creator: 'Trayce demo', CreationDate: new Date(spec.createdAt) },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  doc.font('Helvetica-Bold').fontSize(12).text(`Artwork proof · order ${spec.number} · revision ${spec.revision}`, 18, 16);
  doc.font('Helvetica').fontSize(8).fillColor('#333333').text(`${spec.customer} — ${spec.title}`, 18, 32);

  // the badge: a plated rim, then one ring per colour
  const cx = 90;
  const cy = 150;
  const r = 62;
  const plateHex: Record<string, string> = { gold: '#C9A227', silver: '#B8BCC2', black_nickel: '#3B3F45', nickel: '#A7ABB0', copper: '#B06A3B' };
  doc.circle(cx, cy, r).fill(plateHex[spec.plating] ?? '#9C8A5A');
  const colours = spec.colours.length ? spec.colours : [{ name: words(spec.plating), hex: plateHex[spec.plating] ?? '#9C8A5A' }];
  colours.forEach((c, i) => {
    const rr = (r - 5) * (1 - i / (colours.length + 1));
    doc.circle(cx, cy, rr).fill(c.hex ?? '#CCCCCC');
  });
  doc.circle(cx, cy, r).lineWidth(1).stroke('#222222');

  let y = 62;
  const line = (label: string, value: string) => {
    doc.font('Helvetica-Bold').fontSize(8).fillColor('#111111').text(label, 175, y, { continued: true });
    doc.font('Helvetica').text(`  ${value}`);
    y += 13;
  };
  line('Process', words(spec.process));
  line('Size', `${spec.sizeMm} mm`);
  line('Plating', words(spec.plating));
  line('Back logo', spec.backLogo ? 'yes' : 'no');
  y += 4;
  for (const c of spec.colours.slice(0, 8)) {
    doc.rect(175, y, 10, 8).fillAndStroke(c.hex ?? '#CCCCCC', '#444444');
    doc
      .font('Helvetica')
      .fontSize(7.5)
      .fillColor('#111111')
      .text(`${c.name}${c.ref ? ` (${c.ref})` : ''}  ${c.hex ?? ''}`, 190, y);
    y += 11;
  }
  doc.fontSize(6.5).fillColor('#555555').text('Demo artwork: colours on screen and paper differ from enamel; check swatches.', 18, 262);
  doc.end();
  return done;
}
