// A local stand-in for the payment provider: only the endpoints Plumbline calls, in the provider's documented shapes
// (POST /v1/checkout/sessions, GET /v1/checkout/sessions/:id, POST /v1/refunds), a checkout page of its own that says
// plainly it is a local test page, and webhooks signed as the provider signs them (Stripe-Signature: t=…,v1=…,
// HMAC-SHA256 over "t.payload", written by the SDK's own generateTestHeaderString). State lives in memory: a restart
// forgets open checkouts, which a tester simply starts again from the pay link. No money moves, no card is asked for.
import { randomBytes } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { escapeHtml } from '@/lib/safe/escape';

export interface FakePaymentsOptions {
  /** Where webhooks go: our server's POST /api/payments/webhook. */
  webhookUrl: string;
  /** The secret key callers must present (Authorization: Bearer …). */
  secretKey: string;
  /** The webhook signing secret (whsec_…), shared with our server. */
  webhookSecret: string;
  port?: number;
  host?: string;
  onEvent?: (event: FakeEvent, status: number | null) => void;
}

export interface FakeEvent {
  id: string;
  type: string;
  created: number;
  data: { object: Record<string, unknown> };
}

export interface FakePayments {
  /** http://host:port: the SDK's API base (STRIPE_API_BASE) and the checkout pages. */
  url: string;
  settings: { STRIPE_SECRET_KEY: string; STRIPE_WEBHOOK_SECRET: string; STRIPE_API_BASE: string };
  close(): Promise<void>;
}

interface Session {
  id: string;
  object: 'checkout.session';
  amount_total: number;
  currency: string;
  created: number;
  customer_email: string | null;
  livemode: false;
  metadata: Record<string, string>;
  mode: 'payment';
  payment_intent: string | null;
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string;
  cancel_url: string | null;
  url: string | null;
  /** Ours, not the provider's: the line's name for the checkout page, and the payment's metadata. */
  _lineName: string;
  _paymentMetadata: Record<string, string>;
}

interface Charge {
  id: string;
  paymentIntent: string;
  amount: number;
  currency: string;
  metadata: Record<string, string>;
  refunded: number;
}

const newId = (prefix: string) => `${prefix}_test_${randomBytes(12).toString('hex')}`;
const now = () => Math.floor(Date.now() / 1000);

/** Flat form fields as the SDK sends them ("metadata[invoice]=…", "line_items[0][price_data][currency]=…"). */
function bracketed(form: URLSearchParams, prefix: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of form) {
    const name = key.startsWith(prefix) && key.endsWith(']') ? key.slice(prefix.length, -1) : '';
    if (name && !/[[\]]/.test(name)) out[name] = value;
  }
  return out;
}

const apiError = (res: http.ServerResponse, status: number, message: string, param?: string) => {
  res.writeHead(status, { 'content-type': 'application/json' });
  res.end(JSON.stringify({ error: { type: 'invalid_request_error', message, ...(param ? { param } : {}) } }));
};
const sendJson = (res: http.ServerResponse, body: unknown) => {
  res.writeHead(200, { 'content-type': 'application/json' });
  res.end(JSON.stringify(body));
};

/** The session as the API answers it (our own bookkeeping fields left out). */
const publicSession = (s: Session) => Object.fromEntries(Object.entries(s).filter(([k]) => !k.startsWith('_')));

const readBody = (req: http.IncomingMessage, max = 64 * 1024): Promise<string> =>
  new Promise((resolve, reject) => {
    let size = 0;
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => {
      size += c.length;
      if (size > max) reject(new Error('body too large'));
      else chunks.push(c);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });

/** The page's frame: plainly a local test page, in no provider's look. */
function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(title)}</title>
<style>body{font-family:system-ui,sans-serif;background:#fffbe8;color:#1d1a14;margin:0}main{max-width:30rem;margin:0 auto;padding:2rem 1.25rem}
.banner{background:#1d1a14;color:#fffbe8;padding:.75rem 1.25rem;font-weight:600;text-align:center}
h1{font-size:1.5rem;margin:.5rem 0 1rem}.amount{font-size:2.25rem;font-weight:700;margin:.25rem 0 1.5rem}dl{display:grid;grid-template-columns:auto 1fr;gap:.4rem 1rem;margin:0 0 1.5rem}dt{color:#5b5446}dd{margin:0}
form{display:inline}button{font:inherit;font-weight:600;padding:.7rem 1.2rem;border-radius:.4rem;border:2px solid #1d1a14;cursor:pointer;margin-right:.5rem}
.pay{background:#1d1a14;color:#fffbe8}.decline{background:transparent;color:#1d1a14}p{line-height:1.5}a{color:#1d1a14}</style></head>
<body><div class="banner" role="note">Local test checkout: not a real payment page. No card is asked for and no money moves.</div><main>${body}</main></body></html>`;
}

export async function startFakePayments(options: FakePaymentsOptions): Promise<FakePayments> {
  const sessions = new Map<string, Session>();
  const charges = new Map<string, Charge>();
  const signer = new Stripe(options.secretKey);
  let base = '';

  /** Sign and POST one event to our webhook; resolves with the answer's status (null when unreachable). */
  async function deliver(type: string, object: Record<string, unknown>): Promise<number | null> {
    const event: FakeEvent & Record<string, unknown> = {
      id: newId('evt'),
      object: 'event',
      api_version: Stripe.API_VERSION,
      created: now(),
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
      data: { object },
    };
    const payload = JSON.stringify(event);
    const header = signer.webhooks.generateTestHeaderString({ payload, secret: options.webhookSecret, timestamp: now() });
    let status: number | null = null;
    try {
      const res = await fetch(options.webhookUrl, { method: 'POST', headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': header }, body: payload });
      status = res.status;
      await res.arrayBuffer();
    } catch {
      status = null;
    }
    options.onEvent?.(event, status);
    return status;
  }

  function createSession(form: URLSearchParams): Session | string {
    if (form.get('mode') !== 'payment') return 'mode must be payment';
    const successUrl = form.get('success_url');
    if (!successUrl) return 'success_url is required';
    const amount = Number(form.get('line_items[0][price_data][unit_amount]'));
    const quantity = Number(form.get('line_items[0][quantity]') ?? '1');
    const currency = (form.get('line_items[0][price_data][currency]') ?? '').toLowerCase();
    if (!Number.isInteger(amount) || amount < 1 || !/^[a-z]{3}$/.test(currency) || quantity !== 1) return 'line_items[0] needs price_data with currency and a positive whole unit_amount, quantity 1';
    const id = newId('cs');
    const session: Session = {
      id,
      object: 'checkout.session',
      amount_total: amount,
      currency,
      created: now(),
      customer_email: form.get('customer_email'),
      livemode: false,
      metadata: bracketed(form, 'metadata['),
      mode: 'payment',
      payment_intent: null,
      payment_status: 'unpaid',
      status: 'open',
      success_url: successUrl,
      cancel_url: form.get('cancel_url'),
      url: `${base}/checkout/${id}`,
      _lineName: form.get('line_items[0][price_data][product_data][name]') ?? 'Payment',
      _paymentMetadata: bracketed(form, 'payment_intent_data[metadata]['),
    };
    sessions.set(id, session);
    return session;
  }

  function checkoutPage(s: Session): string {
    const money = new Intl.NumberFormat('en-GB', { style: 'currency', currency: s.currency.toUpperCase() });
    const digits = money.resolvedOptions().maximumFractionDigits ?? 2;
    const shown = money.format(s.amount_total / 10 ** digits);
    if (s.status !== 'open') return page('Already settled', `<h1>This checkout is closed</h1><p>It was ${s.payment_status === 'paid' ? 'paid' : 'closed'} already.</p><p><a href="${escapeHtml(s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id))}">Back to the invoice</a></p>`);
    return page(
      `Test checkout: ${s._lineName}`,
      `<h1>${escapeHtml(s._lineName)}</h1><p class="amount">${escapeHtml(shown)}</p>
<dl><dt>Billed to</dt><dd>${escapeHtml(s.customer_email ?? 'not given')}</dd><dt>Reference</dt><dd><code>${escapeHtml(s.id)}</code></dd></dl>
<p>Choose what the payment does, as a tester:</p>
<form method="post" action="/checkout/${escapeHtml(s.id)}/pay"><button class="pay" type="submit">Pay (test)</button></form>
<form method="post" action="/checkout/${escapeHtml(s.id)}/decline"><button class="decline" type="submit">Decline (test)</button></form>`,
    );
  }

  async function pay(s: Session): Promise<void> {
    const paymentIntent = newId('pi');
    const charge: Charge = { id: newId('ch'), paymentIntent, amount: s.amount_total, currency: s.currency, metadata: s._paymentMetadata, refunded: 0 };
    charges.set(paymentIntent, charge);
    Object.assign(s, { status: 'complete', payment_status: 'paid', payment_intent: paymentIntent, url: null });
    await deliver('checkout.session.completed', publicSession(s));
  }

  async function decline(s: Session): Promise<void> {
    await deliver('checkout.session.async_payment_failed', { ...publicSession(s), payment_status: 'unpaid' });
  }

  async function refund(form: URLSearchParams): Promise<Record<string, unknown> | string> {
    const pi = form.get('payment_intent');
    const charge = pi ? charges.get(pi) : undefined;
    if (!charge) return 'No such payment_intent';
    const amount = form.has('amount') ? Number(form.get('amount')) : charge.amount - charge.refunded;
    if (!Number.isInteger(amount) || amount < 1 || amount > charge.amount - charge.refunded) return 'amount is more than what is left to refund';
    charge.refunded += amount;
    const refundObject = { id: newId('re'), object: 'refund', amount, currency: charge.currency, charge: charge.id, payment_intent: pi, created: now(), status: 'succeeded', reason: form.get('reason'), metadata: bracketed(form, 'metadata[') };
    // The provider answers at once and announces the refund by webhook afterwards.
    setTimeout(() => {
      void deliver('charge.refunded', { id: charge.id, object: 'charge', amount: charge.amount, amount_refunded: charge.refunded, currency: charge.currency, metadata: charge.metadata, payment_intent: pi, refunded: charge.refunded >= charge.amount, created: now(), livemode: false });
    }, 10);
    return refundObject;
  }

  const server = http.createServer((req, res) => {
    void (async () => {
      const url = new URL(req.url ?? '/', base);
      const parts = url.pathname.split('/').filter(Boolean);
      if (parts[0] === 'v1') {
        if (req.headers.authorization !== `Bearer ${options.secretKey}`) return apiError(res, 401, 'Invalid API Key provided.');
        const form = new URLSearchParams(req.method === 'POST' ? await readBody(req) : '');
        if (req.method === 'POST' && url.pathname === '/v1/checkout/sessions') {
          const made = createSession(form);
          return typeof made === 'string' ? apiError(res, 400, made) : sendJson(res, publicSession(made));
        }
        if (req.method === 'GET' && parts[1] === 'checkout' && parts[2] === 'sessions' && parts.length === 4) {
          const s = sessions.get(parts[3]);
          return s ? sendJson(res, publicSession(s)) : apiError(res, 404, `No such checkout.session: '${parts[3]}'`, 'id');
        }
        if (req.method === 'POST' && url.pathname === '/v1/refunds') {
          const made = await refund(form);
          return typeof made === 'string' ? apiError(res, 400, made, 'payment_intent') : sendJson(res, made);
        }
        return apiError(res, 404, `Unrecognized request URL (${req.method}: ${url.pathname}). This local fake offers only what Plumbline calls.`);
      }
      if (parts[0] === 'checkout' && parts[1]) {
        const s = sessions.get(parts[1]);
        if (!s) {
          res.writeHead(404, { 'content-type': 'text/html; charset=utf-8' });
          return res.end(page('Not found', '<h1>No such checkout</h1><p>This local test service forgets checkouts when it restarts. Open the pay link from the e-mail again.</p>'));
        }
        if (req.method === 'GET' && parts.length === 2) {
          res.writeHead(200, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' });
          return res.end(checkoutPage(s));
        }
        if (req.method === 'POST' && parts.length === 3 && s.status === 'open' && (parts[2] === 'pay' || parts[2] === 'decline')) {
          await readBody(req);
          if (parts[2] === 'pay') {
            await pay(s);
            res.writeHead(303, { location: s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id) });
            return res.end();
          }
          await decline(s);
          res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
          const back = s.cancel_url ?? s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id);
          return res.end(page('Declined (test)', `<h1>The test payment was declined</h1><p>The invoice stays unpaid. You can try again.</p><p><a href="/checkout/${escapeHtml(s.id)}">Try again</a> · <a href="${escapeHtml(back)}">Back to the invoice</a></p>`));
        }
      }
      res.writeHead(404, { 'content-type': 'text/plain' });
      res.end('Not found');
    })().catch((err: Error) => {
      if (!res.headersSent) apiError(res, 500, err.message);
    });
  });
  const host = options.host ?? '127.0.0.1';
  await new Promise<void>((resolve) => server.listen(options.port ?? 0, host, resolve));
  base = `http://${host}:${(server.address() as AddressInfo).port}`;
  return {
    url: base,
    settings: { STRIPE_SECRET_KEY: options.secretKey, STRIPE_WEBHOOK_SECRET: options.webhookSecret, STRIPE_API_BASE: base },
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

/** Fresh keys for a local run: test-shaped, useless anywhere else. */
export const localPaymentKeys = () => ({ secretKey: `sk_test_local_${randomBytes(16).toString('hex')}`, webhookSecret: `whsec_local_${randomBytes(24).toString('hex')}` });
