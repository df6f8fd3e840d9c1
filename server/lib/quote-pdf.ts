// The quote as a PDF for the customer: A4, the factory's name, the spec, a line per quantity
// with unit price and total, the one-off mould charge, valid-until and notes; every label in
// English and Simplified Chinese. No costs and no breakdown: those are for the factory.
import fs from 'node:fs';
import PDFDocument from 'pdfkit';
import type { QuoteView } from '@shared/schemas/quotes';
import { fontBytes } from './traveller-pdf';
import { formatInstant } from '@shared/domain/time-format';

/** Noto Sans CJK from Debian's fonts-noto-cjk, the face for Simplified Chinese inside the collection. */
export const CJK_FONT = { file: '/usr/share/fonts/opentype/noto/NotoSansCJK-Regular.ttc', face: 'NotoSansCJKsc-Regular' };

const MM = 72 / 25.4;
const INK = '#111111';
const GREY = '#555555';

export interface QuotePdfInput {
  factory: string;
  timeZone: string;
  quote: QuoteView;
}

const PROCESS_NAMES: Record<string, [string, string]> = {
  hard_enamel: ['Hard enamel', '硬珐琅'],
  soft_enamel: ['Soft enamel', '软珐琅'],
  die_struck: ['Die-struck', '冲压'],
  printed: ['Printed', '印刷'],
  die_cast_3d: ['3D die-cast', '立体压铸'],
};

const money = (n: number, currency: string) =>
  new Intl.NumberFormat('en-GB', { style: 'currency', currency, minimumFractionDigits: 2, maximumFractionDigits: 3 }).format(n);
/** a projected ship date on the quote: the one formatter's English, in the factory's zone */
const day = (iso: string | null, tz: string) => (iso ? formatInstant(iso, { locale: 'en', timeZone: tz }, 'date') : '–');

export function quotePdf(input: QuotePdfInput): Promise<Buffer> {
  const { quote: q } = input;
  const doc = new PDFDocument({ size: 'A4', margin: 18 * MM, info: { Title: `Quote ${q.number}`, Author: input.factory, Subject: q.spec.title } });
  doc.registerFont('body', fontBytes(400));
  doc.registerFont('bold', fontBytes(700));
  const cjk = fs.existsSync(CJK_FONT.file);
  if (cjk) doc.registerFont('zh', CJK_FONT.file, CJK_FONT.face);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  /** an English label with its Chinese beside it */
  const label = (en: string, zh: string, x: number, y: number, w: number) => {
    doc.font('body').fontSize(9).fillColor(GREY).text(en, x, y, { width: w, continued: false });
    if (cjk) doc.font('zh').fontSize(8).fillColor(GREY).text(zh, x, doc.y, { width: w });
  };

  doc.font('bold').fontSize(20).fillColor(INK).text(input.factory, left, doc.page.margins.top);
  doc.moveDown(0.2);
  doc.font('bold').fontSize(14).text(`Quote ${q.number}`, { continued: cjk });
  if (cjk) doc.font('zh').fontSize(12).text('  报价单');
  doc.font('body').fontSize(10).fillColor(GREY).text(`Version ${q.version}`);
  doc.moveDown(0.8);

  const field = (en: string, zh: string, value: string) => {
    const y = doc.y;
    label(en, zh, left, y, 50 * MM);
    const after = doc.y;
    doc
      .font('bold')
      .fontSize(11)
      .fillColor(INK)
      .text(value, left + 52 * MM, y, { width: width - 52 * MM });
    doc.y = Math.max(after, doc.y) + 3;
  };
  const s = q.spec;
  field('For', '客户', q.contactName ? `${q.customer.name} (${q.contactName})` : q.customer.name);
  field('Design', '设计', s.title);
  field('Process', '工艺', PROCESS_NAMES[s.process]?.[0] ?? s.process);
  field('Size', '尺寸', `${s.sizeMm} × ${s.heightMm} mm, ${s.thicknessMm} mm thick`);
  field('Metal', '材料', s.material.replace('_', ' '));
  field('Colours', '颜色', s.colours.length ? s.colours.map((c) => c.name + (c.ref ? ` (${c.ref})` : '')).join(', ') : 'none');
  field('Plating', '电镀', s.plating.replace(/_/g, ' ') + (s.secondPlating ? ` and ${s.secondPlating.replace(/_/g, ' ')}` : ''));
  field('Fittings', '配件', s.backing.type === 'none' || s.backing.count === 0 ? 'none' : `${s.backing.count} × ${s.backing.type.replace(/_/g, ' ')}`);
  field('Packaging', '包装', s.packaging.replace(/_/g, ' '));
  field('Valid until', '有效期至', q.validUntil);
  doc.moveDown(0.8);

  const cols = [
    { en: 'Quantity', zh: '数量', w: 28 * MM },
    { en: 'Unit price', zh: '单价', w: 30 * MM },
    { en: 'Pins', zh: '徽章金额', w: 32 * MM },
    { en: 'Total with moulds', zh: '含模具总价', w: 38 * MM },
    { en: 'Ships by (85 %)', zh: '预计发货', w: 0 },
  ];
  cols[4].w = width - cols.slice(0, 4).reduce((a, c) => a + c.w, 0);
  let y = doc.y;
  let x = left;
  let bottom = y;
  for (const c of cols) {
    label(c.en, c.zh, x, y, c.w - 4);
    bottom = Math.max(bottom, doc.y);
    x += c.w;
  }
  doc
    .moveTo(left, bottom + 2)
    .lineTo(left + width, bottom + 2)
    .strokeColor('#999999')
    .lineWidth(0.5)
    .stroke();
  y = bottom + 6;
  for (const l of q.lines) {
    const cells = [
      l.quantity.toLocaleString('en-GB'),
      money(l.unitPrice, q.currency),
      money(l.goodsTotal, q.currency),
      money(l.total, q.currency),
      day(l.shipDates.p85At, input.timeZone),
    ];
    x = left;
    cells.forEach((c, i) => {
      doc
        .font(i === 3 ? 'bold' : 'body')
        .fontSize(11)
        .fillColor(INK)
        .text(c, x, y, { width: cols[i].w - 4 });
      x += cols[i].w;
    });
    y += 18;
  }
  doc.y = y + 6;
  doc.x = left;
  field('Moulds (once)', '模具费（一次）', q.mouldCharge > 0 ? money(q.mouldCharge, q.currency) : 'none: we reuse your stored moulds');
  field('Overrun', '备品', `up to ${s.overrunPct} % extra pieces made, no charge beyond the prices above`);
  if (q.notes) {
    doc.moveDown(0.5);
    label('Notes', '备注', left, doc.y, width);
    doc.font('body').fontSize(11).fillColor(INK).text(q.notes, left, doc.y, { width });
  }
  doc.moveDown(1);
  doc
    .font('body')
    .fontSize(9)
    .fillColor(GREY)
    .text(
      'Production starts after payment and your approval of the artwork proof. Ship dates are projections from our floor and are confirmed when the order is released.',
      left,
      doc.y,
      { width },
    );
  if (cjk) doc.font('zh').fontSize(8).text('付款并确认设计稿后开始生产。发货日期为预估，订单投产时确认。', { width });
  doc.end();
  return done;
}
