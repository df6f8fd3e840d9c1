// The messages Trayce sends, each as plain text and HTML. Short, factual, no tracking pixels,
// no remote images.
import { formatInstant } from '@shared/domain/time-format';

export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function page(title: string, body: string, factory: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title></head>
<body style="font-family:Arial,Helvetica,sans-serif;color:#1b2428;background:#f6f4ef;margin:0;padding:24px">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #d5e6e6;border-radius:8px;padding:24px">
${body}
<p style="color:#555;font-size:13px;margin-top:24px">${escapeHtml(factory)}</p>
</div></body></html>`;
}

/** A date in a mail: the one formatter's English, in the factory's zone. */
function formatDate(ms: number, timeZone: string): string {
  return formatInstant(ms, { locale: 'en', timeZone }, 'date');
}

export interface ShippedMailInput {
  factory: string;
  timeZone: string;
  orderNumber: string;
  title: string;
  contactName: string | null;
  carrier: string;
  trackingNumber: string;
  shipmentNumber: number;
  cartons: number;
  pieces: number;
  /** pieces still to follow in later shipments (0 when this completes the order) */
  piecesToFollow: number;
  shippedAt: number;
  statusUrl: string;
  /** the internal copy for the sales owner */
  forSales?: { customer: string };
}

export function shippedMail(m: ShippedMailInput): RenderedMail {
  const when = formatDate(m.shippedAt, m.timeZone);
  const partial = m.piecesToFollow > 0 ? ` This is shipment ${m.shipmentNumber}; ${m.piecesToFollow} more pieces will follow.` : '';
  const subject = m.forSales
    ? `Shipped: order ${m.orderNumber} for ${m.forSales.customer} (${m.carrier} ${m.trackingNumber})`
    : `Your order ${m.orderNumber} has shipped: ${m.title}`;
  const greeting = m.forSales ? 'Hello,' : `Hello${m.contactName ? ` ${m.contactName}` : ''},`;
  const lead = m.forSales
    ? `Order ${m.orderNumber} (${m.title}) for ${m.forSales.customer} left ${m.factory} on ${when}.${partial}`
    : `your order "${m.title}" (${m.orderNumber}) left ${m.factory} on ${when}.${partial}`;
  const text = [
    greeting,
    '',
    m.forSales ? lead : `${lead.charAt(0).toUpperCase()}${lead.slice(1)}`,
    '',
    `Carrier: ${m.carrier}`,
    `Tracking number: ${m.trackingNumber}`,
    `Cartons: ${m.cartons}, pieces: ${m.pieces}`,
    '',
    `Order status: ${m.statusUrl}`,
    '',
    m.factory,
  ].join('\n');
  const html = page(
    subject,
    `<p>${escapeHtml(greeting)}</p>
<p>${escapeHtml(m.forSales ? lead : `${lead.charAt(0).toUpperCase()}${lead.slice(1)}`)}</p>
<table style="border-collapse:collapse;margin:16px 0">
<tr><td style="padding:4px 12px 4px 0;color:#555">Carrier</td><td style="padding:4px 0;font-weight:bold">${escapeHtml(m.carrier)}</td></tr>
<tr><td style="padding:4px 12px 4px 0;color:#555">Tracking number</td><td style="padding:4px 0;font-weight:bold;font-family:monospace;font-size:16px">${escapeHtml(m.trackingNumber)}</td></tr>
<tr><td style="padding:4px 12px 4px 0;color:#555">Cartons</td><td style="padding:4px 0">${m.cartons}</td></tr>
<tr><td style="padding:4px 12px 4px 0;color:#555">Pieces</td><td style="padding:4px 0">${m.pieces}</td></tr>
</table>
<p><a href="${escapeHtml(m.statusUrl)}" style="display:inline-block;background:#14323a;color:#ffffff;padding:10px 16px;border-radius:6px;text-decoration:none;font-weight:bold">See the order status</a></p>
<p style="font-size:13px;color:#555">Or copy this address: ${escapeHtml(m.statusUrl)}</p>`,
    m.factory,
  );
  return { subject, text, html };
}

export interface DigestOrder {
  number: string;
  customer: string;
  title: string;
  dueDate: string;
  projectedAt: number | null;
  stage: string;
}

export function lateDigestMail(input: { factory: string; timeZone: string; date: string; name: string; orders: DigestOrder[]; appUrl: string }): RenderedMail {
  const n = input.orders.length;
  const subject = `Late risk on ${input.date}: ${n} ${n === 1 ? 'order' : 'orders'} projected after their due date`;
  const line = (o: DigestOrder) =>
    `${o.number}  ${o.customer}: ${o.title}. Due ${o.dueDate}, projected ${o.projectedAt != null ? formatDate(o.projectedAt, input.timeZone) : 'unknown'}. ${o.stage}.`;
  const text = [
    `Hello ${input.name},`,
    '',
    `These open orders are projected to ship after their due date:`,
    '',
    ...input.orders.map(line),
    '',
    `Details: ${input.appUrl}/sales`,
    '',
    input.factory,
  ].join('\n');
  const rows = input.orders
    .map(
      (o) =>
        `<tr><td style="padding:6px 8px;border-top:1px solid #d5e6e6;font-weight:bold">${escapeHtml(o.number)}</td><td style="padding:6px 8px;border-top:1px solid #d5e6e6">${escapeHtml(o.customer)}<br>${escapeHtml(o.title)}</td><td style="padding:6px 8px;border-top:1px solid #d5e6e6">${escapeHtml(o.dueDate)}</td><td style="padding:6px 8px;border-top:1px solid #d5e6e6;font-weight:bold">${o.projectedAt != null ? escapeHtml(formatDate(o.projectedAt, input.timeZone)) : 'unknown'}</td><td style="padding:6px 8px;border-top:1px solid #d5e6e6">${escapeHtml(o.stage)}</td></tr>`,
    )
    .join('');
  const html = page(
    subject,
    `<p>Hello ${escapeHtml(input.name)},</p><p>These open orders are projected to ship after their due date:</p>
<table style="border-collapse:collapse;width:100%;font-size:14px"><thead><tr><th align="left" style="padding:6px 8px">Order</th><th align="left" style="padding:6px 8px">Customer and title</th><th align="left" style="padding:6px 8px">Due</th><th align="left" style="padding:6px 8px">Projected</th><th align="left" style="padding:6px 8px">Stage</th></tr></thead><tbody>${rows}</tbody></table>
<p><a href="${escapeHtml(input.appUrl)}/sales">Open the order status page</a></p>`,
    input.factory,
  );
  return { subject, text, html };
}

export function proofReadyMail(input: {
  factory: string;
  orderNumber: string;
  title: string;
  revision: number;
  contactName: string | null;
  filename: string;
}): RenderedMail {
  const subject = `Proof ${input.revision} for your order ${input.orderNumber} is ready for approval`;
  const greeting = `Hello${input.contactName ? ` ${input.contactName}` : ''},`;
  const body = `The artwork proof (revision ${input.revision}) for "${input.title}" (${input.orderNumber}) is attached as ${input.filename}. Please check the artwork, colours, size and fittings, and reply to approve it or to ask for changes. Production starts once the proof is approved.`;
  const text = [greeting, '', body, '', input.factory].join('\n');
  const html = page(subject, `<p>${escapeHtml(greeting)}</p><p>${escapeHtml(body)}</p>`, input.factory);
  return { subject, text, html };
}

/** To the planners: the customer sent a proof back from her order page. */
export function proofChangesMail(input: {
  factory: string;
  orderNumber: string;
  title: string;
  customer: string;
  revision: number;
  comment: string;
  orderUrl: string;
}): RenderedMail {
  const subject = `Changes asked for proof ${input.revision} of order ${input.orderNumber}`;
  const body = `${input.customer} asked for changes to proof revision ${input.revision} of "${input.title}" (${input.orderNumber}) on the order page. The proof gate stays shut until a new revision is approved.`;
  const text = [body, '', 'Their comment:', input.comment, '', `Open the order: ${input.orderUrl}`, '', input.factory].join('\n');
  const html = page(
    subject,
    `<p>${escapeHtml(body)}</p><p><strong>Their comment:</strong></p><blockquote>${escapeHtml(input.comment)}</blockquote><p><a href="${escapeHtml(input.orderUrl)}">Open the order</a></p>`,
    input.factory,
  );
  return { subject, text, html };
}

export interface QuoteSentMailInput {
  factory: string;
  number: string;
  title: string;
  contactName: string | null;
  validUntil: string;
  url: string;
}

/** The quote to the customer: the link to read and accept it, the PDF attached. */
export function quoteSentMail(m: QuoteSentMailInput): RenderedMail {
  const hello = m.contactName ? `Dear ${m.contactName},` : 'Hello,';
  const subject = `Quote ${m.number}: ${m.title}`;
  const text = [
    hello,
    '',
    `Here is our quote ${m.number} for ${m.title}. It is valid until ${m.validUntil}.`,
    'Read it and accept the quantity you want here (no sign-in needed):',
    m.url,
    '',
    'The quote is also attached as a PDF. 报价单已附上 (PDF)。',
    '',
    m.factory,
  ].join('\n');
  const html = page(
    subject,
    `<p>${escapeHtml(hello)}</p>
<p>Here is our quote <b>${escapeHtml(m.number)}</b> for ${escapeHtml(m.title)}. It is valid until <b>${escapeHtml(m.validUntil)}</b>.</p>
<p><a href="${escapeHtml(m.url)}" style="display:inline-block;background:#14323a;color:#ffffff;padding:10px 16px;border-radius:6px;text-decoration:none;font-weight:bold">Read and accept the quote</a></p>
<p style="font-size:13px;color:#555">Or copy this address: ${escapeHtml(m.url)}</p>
<p style="font-size:13px;color:#555">The quote is also attached as a PDF. 报价单已附上 (PDF)。</p>`,
    m.factory,
  );
  return { subject, text, html };
}
