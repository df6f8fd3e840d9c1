// The local hosted-checkout stand-in: when no STRIPE_SECRET_KEY is set, this small HTTP server on
// a loopback port answers the few API calls the app makes (create and read a Checkout Session),
// serves a plain test checkout page, and, when its Pay form is posted, sends the signed
// `checkout.session.completed` event to the app's webhook. It signs the way the real service
// does (`Stripe-Signature: t=<unix seconds>,v1=<HMAC-SHA256(secret, "<t>.<body>")>`, made with the
// SDK's own `webhooks.generateTestHeaderString`), so the app verifies it with the real SDK's
// `webhooks.constructEvent`, exactly as it verifies the real service. No money moves here.
import crypto from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import Stripe from 'stripe';

export interface CheckoutFake {
  protocol: 'http';
  host: string;
  port: number;
  /** the secret key the fake accepts (the app's SDK client uses it) */
  secretKey: string;
  /** the signing secret of the events it sends */
  webhookSecret: string;
  /** every event sent so far, as sent (body and signature header): tests replay them */
  sent: { id: string; type: string; payload: string; signature: string; status: number | null }[];
  close(): Promise<void>;
}

interface FakeSession {
  id: string;
  object: 'checkout.session';
  amount_total: number;
  amount_subtotal: number;
  currency: string;
  mode: string;
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  payment_intent: string | null;
  client_reference_id: string | null;
  metadata: Record<string, string>;
  success_url: string | null;
  cancel_url: string | null;
  url: string | null;
  created: number;
  expires_at: number;
  livemode: false;
  description: string;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
const rid = (prefix: string) => `${prefix}_${crypto.randomBytes(12).toString('base64url')}`;

/** Largest line-item count and text the fake takes; it only ever sees the app's own requests. */
const MAX_LINE_ITEMS = 20;

function apiError(res: express.Response, status: number, message: string, param?: string) {
  res.status(status).json({ error: { type: 'invalid_request_error', message, ...(param ? { param } : {}) } });
}

function pageFor(s: FakeSession): string {
  const amount = new Intl.NumberFormat('en', { style: 'currency', currency: s.currency.toUpperCase() }).format(
    s.amount_total /
      10 ** (new Intl.NumberFormat('en', { style: 'currency', currency: s.currency.toUpperCase() }).resolvedOptions().maximumFractionDigits ?? 2),
  );
  const body =
    s.status === 'open'
      ? `<form method="post"><button type="submit">Pay</button></form>
         ${s.cancel_url ? `<p><a href="${escapeHtml(s.cancel_url)}">Cancel and go back</a></p>` : ''}`
      : `<p>This checkout is ${s.status === 'complete' ? 'paid' : 'expired'}.</p>${s.success_url ? `<p><a href="${escapeHtml(s.success_url)}">Back to the order</a></p>` : ''}`;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex"><title>Test checkout</title>
<style>body{font:18px/1.5 system-ui,sans-serif;max-width:28rem;margin:2rem auto;padding:0 1rem;color:#1b2430}
.note{background:#fff4d6;border:1px solid #d9b44a;padding:.75rem;border-radius:.5rem}
button{font:inherit;font-weight:700;min-height:48px;min-width:10rem;padding:.5rem 1.5rem;border-radius:.5rem;border:0;background:#1d4e6b;color:#fff}
a{color:#1d4e6b}</style></head>
<body><main>
<h1>Test checkout</h1>
<p class="note">Local test payment page: no card is asked for and no money moves. With a real payment account set up, customers see the payment service's own page here.</p>
<p>${escapeHtml(s.description)}</p>
<p style="font-size:1.6rem;font-weight:700" data-testid="amount">${escapeHtml(amount)}</p>
${body}
</main></body></html>`;
}

/**
 * Starts the fake on 127.0.0.1 (port 0: any free port). `webhookUrl` is asked for at each
 * delivery, so the app may start listening after the fake.
 */
export function startCheckoutFake(options: { webhookUrl: () => string; port?: number; log?: (msg: string) => void }): Promise<CheckoutFake> {
  const secretKey = `sk_test_local_${crypto.randomBytes(18).toString('base64url')}`;
  const webhookSecret = `whsec_local_${crypto.randomBytes(24).toString('base64url')}`;
  const sessions = new Map<string, FakeSession>();
  const sent: CheckoutFake['sent'] = [];
  const log = options.log ?? (() => {});
  let base = '';

  const app = express();
  app.disable('x-powered-by');

  const authorised: express.RequestHandler = (req, res, next) => {
    if (req.get('authorization') !== `Bearer ${secretKey}`) return apiError(res, 401, 'Invalid API Key provided.');
    next();
  };

  // The SDK sends form-encoded bodies with bracketed keys (line_items[0][price_data][currency]).
  app.post('/v1/checkout/sessions', authorised, express.urlencoded({ extended: true, limit: '64kb' }), (req, res) => {
    const b = (req.body ?? {}) as Record<string, unknown>;
    const items = Array.isArray(b.line_items) ? (b.line_items as Record<string, unknown>[]) : [];
    if (b.mode !== 'payment') return apiError(res, 400, 'Only mode=payment is supported by the local fake.', 'mode');
    if (items.length === 0 || items.length > MAX_LINE_ITEMS) return apiError(res, 400, 'line_items is required.', 'line_items');
    let total = 0;
    let currency = '';
    const names: string[] = [];
    for (const [i, item] of items.entries()) {
      const pd = (item.price_data ?? {}) as Record<string, unknown>;
      const unit = Number(pd.unit_amount);
      const qty = Number(item.quantity ?? 1);
      const cur = String(pd.currency ?? '').toLowerCase();
      if (!Number.isInteger(unit) || unit < 1 || !Number.isInteger(qty) || qty < 1)
        return apiError(res, 400, 'unit_amount and quantity must be positive integers.', `line_items[${i}]`);
      if (!/^[a-z]{3}$/.test(cur) || (currency && cur !== currency))
        return apiError(res, 400, 'One three-letter currency for every line item.', `line_items[${i}][price_data][currency]`);
      currency = cur;
      total += unit * qty;
      names.push(String((pd.product_data as Record<string, unknown> | undefined)?.name ?? 'Item'));
    }
    const id = rid('cs_test');
    const created = Math.floor(Date.now() / 1000);
    const session: FakeSession = {
      id,
      object: 'checkout.session',
      amount_total: total,
      amount_subtotal: total,
      currency,
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      payment_intent: null,
      client_reference_id: typeof b.client_reference_id === 'string' ? b.client_reference_id : null,
      metadata: (b.metadata && typeof b.metadata === 'object' ? b.metadata : {}) as Record<string, string>,
      success_url: typeof b.success_url === 'string' ? b.success_url : null,
      cancel_url: typeof b.cancel_url === 'string' ? b.cancel_url : null,
      url: `${base}/pay/${id}`,
      created,
      // sessions of the real service expire after 24 hours unless told otherwise
      expires_at: Number(b.expires_at) || created + 24 * 3600,
      livemode: false,
      description: names.join(', '),
    };
    sessions.set(id, session);
    res.json(session);
  });

  app.get('/v1/checkout/sessions/:id', authorised, (req, res) => {
    const s = sessions.get(String(req.params.id));
    if (!s) return apiError(res, 404, `No such checkout.session: '${req.params.id}'`, 'id');
    res.json(s);
  });

  app.get('/pay/:id', (req, res) => {
    const s = sessions.get(String(req.params.id));
    if (!s) return res.status(404).type('text/plain').send('No such checkout.');
    res.set('Cache-Control', 'no-store').type('html').send(pageFor(s));
  });

  app.post('/pay/:id', async (req, res) => {
    const s = sessions.get(String(req.params.id));
    if (!s) return res.status(404).type('text/plain').send('No such checkout.');
    if (s.status === 'open' && s.expires_at * 1000 < Date.now()) s.status = 'expired';
    if (s.status === 'open') {
      s.status = 'complete';
      s.payment_status = 'paid';
      s.payment_intent = rid('pi_test');
      s.url = null;
      const event = {
        id: rid('evt_test'),
        object: 'event',
        api_version: Stripe.API_VERSION,
        created: Math.floor(Date.now() / 1000),
        type: 'checkout.session.completed',
        livemode: false,
        pending_webhooks: 1,
        request: { id: null, idempotency_key: null },
        data: { object: { ...s } },
      };
      const payload = JSON.stringify(event, null, 2);
      const signature = Stripe.webhooks.generateTestHeaderString({ payload, secret: webhookSecret });
      const record = { id: event.id, type: event.type, payload, signature, status: null as number | null };
      sent.push(record);
      record.status = await deliver(options.webhookUrl(), payload, signature, log);
    }
    if (s.status === 'complete' && s.success_url) return res.redirect(303, s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id));
    res.type('html').send(pageFor(s));
  });

  const server = http.createServer(app);
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, '127.0.0.1', () => {
      server.off('error', reject);
      const port = (server.address() as AddressInfo).port;
      base = `http://127.0.0.1:${port}`;
      resolve({
        protocol: 'http',
        host: '127.0.0.1',
        port,
        secretKey,
        webhookSecret,
        sent,
        close: () =>
          new Promise<void>((r) => {
            server.close(() => r());
            server.closeAllConnections();
          }),
      });
    });
  });
}

/** Posts one event; a failed delivery is tried again a few times, as the real service retries. */
async function deliver(url: string, payload: string, signature: string, log: (msg: string) => void): Promise<number | null> {
  for (let attempt = 1; attempt <= 3; attempt += 1) {
    try {
      const r = await fetch(url, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json; charset=utf-8', 'Stripe-Signature': signature, 'User-Agent': 'Trayce-checkout-fake/1.0' },
        body: payload,
        signal: AbortSignal.timeout(15_000),
      });
      await r.arrayBuffer();
      if (r.status < 500) return r.status;
      log(`checkout fake: webhook answered ${r.status} (attempt ${attempt})`);
    } catch (err) {
      log(`checkout fake: webhook delivery failed (attempt ${attempt}): ${(err as Error).message}`);
    }
    await new Promise((r) => setTimeout(r, 200 * attempt));
  }
  return null;
}
