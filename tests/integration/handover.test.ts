// Final files released on payment, end to end through the built server and the local payment fake: the invoice, the
// lock as each role and through a share link, paying and declining on the fake's checkout page, a tampered amount,
// duplicate, out-of-order, forged and replayed webhooks, and a refund that locks again.
// Reference for the signatures: the provider's own Node SDK (stripe, `webhooks.generateTestHeaderString` to sign and
// `webhooks.constructEvent` on our side), i.e. the verification the real service's deliveries must pass.
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import { FIXTURE_SVG } from './fixtures';
import { baseUrl, Client, joinBrand, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { lastMailTo, linkIn, mailTo } from '../support/mailbox';
import { publishAndWait } from '../support/publish';

const payments = () => inject('payments');
/** The SDK pointed at the local fake, as our server's is. */
const sdk = () => {
  const { url, secretKey } = payments();
  const u = new URL(url);
  return new Stripe(secretKey, { host: u.hostname, port: Number(u.port), protocol: 'http' });
};

let owner: Client;
let ownerEmail: string;
const people: Record<'editor' | 'reviewer' | 'partner' | 'viewer', Client> = {} as never;
let linkVisitor: Client;
let brandId: string;
let slug: string;
let logoId: string;
let invoiceId: string;
let payToken: string;
const clientEmail = `client-${Date.now()}@handover.example`;

const logoFile = () => `/api/assets/${logoId}/file?format=original`;
const tokensFile = () => `/b/${slug}/tokens?format=css`;
const invoiceState = async () => (await owner.get(`/api/brands/${brandId}/handover`)).body.invoice;

/** A checkout for the pay link, as the pay page's button asks for it (the body is hostile and never read). */
async function startCheckout(body: unknown = {}): Promise<string> {
  const r = await new Client().post(`/api/pay/${payToken}/checkout`, body);
  expect(r.status).toBe(200);
  return new URL(r.body.url).pathname.split('/').pop()!;
}

/** A tester's click on the fake's checkout page. */
async function clickOnCheckout(sessionId: string, choice: 'pay' | 'decline'): Promise<Response> {
  return fetch(`${payments().url}/checkout/${sessionId}/${choice}`, { method: 'POST', redirect: 'manual' });
}

/** Deliver an event to our webhook signed with `secret` at `timestamp` (seconds), as the provider does. */
async function deliver(event: Record<string, unknown>, opts: { secret?: string; timestamp?: number } = {}) {
  const payload = JSON.stringify(event);
  const header = sdk().webhooks.generateTestHeaderString({ payload, secret: opts.secret ?? payments().webhookSecret, timestamp: opts.timestamp ?? Math.floor(Date.now() / 1000) });
  const res = await fetch(`${baseUrl()}/api/payments/webhook`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': header }, body: payload });
  return { status: res.status, body: await res.json() };
}

const event = (id: string, type: string, created: number, object: Record<string, unknown>) => ({ id, object: 'event', type, created, livemode: false, api_version: Stripe.API_VERSION, pending_webhooks: 1, request: { id: null, idempotency_key: null }, data: { object } });

async function until<T>(what: string, read: () => Promise<T>, ok: (v: T) => boolean, ms = 10_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await read();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`${what}: still ${JSON.stringify(v)}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

beforeAll(async () => {
  ({ client: owner, email: ownerEmail } = await signUpFresh('handover-owner'));
  const brand = (await owner.post('/api/brands', { name: 'Handover Test Co' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  const up = await owner.upload(`/api/brands/${brandId}/assets`, 'mark.svg', FIXTURE_SVG, 'image/svg+xml', { kind: 'logo' });
  logoId = up.body.assets[0].id;
  await owner.patch(`/api/brands/${brandId}/assets/${logoId}`, { state: 'approved' });
  for (const role of ['editor', 'reviewer', 'partner', 'viewer'] as const) {
    const person = await signUpFresh(`handover-${role}`);
    await joinBrand(owner, brandId, person, role);
    people[role] = person.client;
  }
  await owner.request('PUT', `/api/brands/${brandId}/guideline`, {
    baseRevision: 0,
    doc: { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'dl', title: 'Files', eyebrow: '', intro: '' } }, { type: 'downloads', attrs: { id: 'files', title: 'Files to download', assetIds: [], note: '' } }] },
  });
  await publishAndWait(owner, brandId, 'Handover version');
  const { url } = (await owner.post(`/api/brands/${brandId}/share-links`, { allowDownloads: true })).body.shareLink;
  linkVisitor = new Client();
  expect((await linkVisitor.get(new URL(url).pathname)).status).toBe(303);
});
afterAll(closeDb);

describe('the handover invoice', () => {
  test('before any invoice, a partner and a link visitor download as before', async () => {
    expect((await people.partner.get(logoFile())).status).toBe(200);
    expect((await linkVisitor.get(tokensFile())).status).toBe(200);
  });

  test('bad input is refused with the field named and nothing saved', async () => {
    const cases = [
      { amount: 12.5, currency: 'EUR', dueOn: '2027-01-31', releases: 'final-files', clientEmail },
      { amount: 1000, currency: 'EURO', dueOn: '2027-01-31', releases: 'final-files', clientEmail },
      { amount: 1000, currency: 'EUR', dueOn: '2027-02-30', releases: 'final-files', clientEmail },
      { amount: 1000, currency: 'EUR', dueOn: '2027-01-31', releases: 'everything', clientEmail },
      { amount: 1000, currency: 'EUR', dueOn: '2027-01-31', releases: 'final-files', clientEmail: 'not-an-address' },
    ];
    for (const body of cases) {
      const r = await owner.request('PUT', `/api/brands/${brandId}/handover`, body);
      expect(r.status).toBe(400);
      expect(r.body.error.code).toBe('invalid_input');
    }
    expect((await invoiceState())).toBeNull();
    // Only the owner sets it.
    expect((await people.editor.request('PUT', `/api/brands/${brandId}/handover`, cases[0])).status).toBe(403);
  });

  test('the owner sets it and sends it: the client gets a pay link, the trail says who', async () => {
    const r = await owner.request('PUT', `/api/brands/${brandId}/handover`, { amount: 125000, currency: 'eur', dueOn: '2027-01-31', releases: 'final-files', clientEmail });
    expect(r.status).toBe(200);
    expect(r.body.invoice).toMatchObject({ amount: 125000, currency: 'EUR', state: 'draft' });
    // ISO 4217: EUR has two minor digits, so 125000 cents read €1,250.00 (en-GB, as the e-mail writes it).
    expect(r.body.invoice.amountText).toBe('€1,250.00');
    invoiceId = r.body.invoice.id;
    const sent = await owner.post(`/api/brands/${brandId}/handover/send`, {});
    expect(sent.status).toBe(200);
    expect(sent.body.mail.sent).toBe(true);
    expect(sent.body.invoice.state).toBe('sent');
    const mail = lastMailTo(clientEmail);
    expect(mail.subject).toContain('€1,250.00');
    payToken = linkIn(mail, '/pay/').token;
    const actions = (await sql('SELECT action FROM audit_events WHERE target_id = $1 ORDER BY created_at', [invoiceId])).map((a) => a.action);
    expect(actions).toEqual(['handover.invoice.create', 'handover.invoice.send']);
    const page = await new Client().get(`/pay/${payToken}`);
    expect(page.status).toBe(200);
    expect(page.body).toContain('€1,250.00');
  });
});

describe('the lock while unpaid (releases: final files)', () => {
  test.each([
    ['owner', 200],
    ['editor', 200],
    ['reviewer', 402],
    ['partner', 402],
  ] as const)('a logo file for the %s answers %i', async (role, status) => {
    const client = role === 'owner' ? owner : people[role];
    const r = await client.get(logoFile());
    expect(r.status).toBe(status);
    if (status === 402) {
      expect(r.body.error.code).toBe('payment_required');
      expect(r.body.error.message).toContain('handover invoice is paid');
    }
  });

  test('a viewer never downloads (policy), and the published tokens tell the viewer why they are held', async () => {
    expect((await people.viewer.get(logoFile())).status).toBe(403);
    const tokens = await people.viewer.get(tokensFile());
    expect(tokens.status).toBe(402);
    expect(tokens.headers.get('content-type')).toContain('text/html');
    expect(tokens.body).toContain('Released once the handover invoice is paid');
  });

  test('share-link visitors: files and the zip are held with a note, the guidelines and previews stay open', async () => {
    expect((await linkVisitor.get(logoFile())).status).toBe(402);
    expect((await linkVisitor.get(tokensFile())).status).toBe(402);
    expect((await linkVisitor.post(`/api/brands/${brandId}/bundles`, { allLogos: true })).status).toBe(402);
    expect((await linkVisitor.get(`/b/${slug}`)).status).toBe(200);
    expect((await linkVisitor.get(`/api/assets/${logoId}/file?format=png&width=256`)).status).toBe(200);
    const page = await linkVisitor.get(`/b/${slug}/downloads`);
    expect(page.body).toContain('data-handover-lock');
    expect(page.body).toContain('held until paid');
  });

  test('owner and editor still reach the published tokens and the zip', async () => {
    expect((await owner.get(tokensFile())).status).toBe(200);
    expect((await people.editor.post(`/api/brands/${brandId}/bundles`, { allLogos: true })).status).toBe(200);
  });
});

describe('paying through the fake checkout', () => {
  test('an amount tampered in the browser has no effect: the session carries the amount from our database', async () => {
    const sessionId = await startCheckout({ amount: 1, currency: 'usd', unit_amount: 1 });
    const session = await sdk().checkout.sessions.retrieve(sessionId);
    expect(session.amount_total).toBe(125000);
    expect(session.currency).toBe('eur');
    expect(session.metadata?.invoice).toBe(invoiceId);
  });

  test('a decline keeps the files locked and says why', async () => {
    const sessionId = await startCheckout();
    const res = await clickOnCheckout(sessionId, 'decline');
    expect(res.status).toBe(200);
    const invoice = await invoiceState();
    expect(invoice.state).toBe('failed');
    expect(invoice.stateReason).toContain('declined');
    const r = await people.partner.get(logoFile());
    expect(r.status).toBe(402);
    expect(r.body.error.message).toContain('did not go through');
  });

  test('paying unlocks for every role and the link, sends both receipts and writes the trail', async () => {
    const clientMails = mailTo(clientEmail).length;
    const ownerMails = mailTo(ownerEmail).length;
    const sessionId = await startCheckout();
    const res = await clickOnCheckout(sessionId, 'pay');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toContain(`/pay/${payToken}`);
    expect((await invoiceState()).state).toBe('paid');
    await until('partner file', async () => (await people.partner.get(logoFile())).status, (s) => s === 200);
    expect((await people.reviewer.get(logoFile())).status).toBe(200);
    expect((await linkVisitor.get(tokensFile())).status).toBe(200);
    expect((await people.viewer.get(tokensFile())).status).toBe(200);
    expect(mailTo(clientEmail).length).toBe(clientMails + 1);
    expect(mailTo(ownerEmail).length).toBe(ownerMails + 1);
    expect(lastMailTo(clientEmail).subject).toContain('paid');
    expect(lastMailTo(ownerEmail).text).toContain('The client paid');
    const actions = (await sql('SELECT action FROM audit_events WHERE target_id = $1', [invoiceId])).map((a) => a.action);
    expect(actions).toContain('handover.payment.paid');
    expect(actions).toContain('handover.payment.failed');
    // A paid invoice is a record.
    expect((await owner.request('PUT', `/api/brands/${brandId}/handover`, { amount: 1, currency: 'EUR', dueOn: '2027-01-31', releases: 'shelf', clientEmail })).status).toBe(409);
  });
});

describe('webhooks', () => {
  test('a forged signature is refused with 400 and changes nothing', async () => {
    const before = (await sql('SELECT count(*)::int AS n FROM payment_events'))[0].n;
    const forged = event('evt_forged_1', 'charge.refunded', Math.floor(Date.now() / 1000), { id: 'ch_x', object: 'charge', metadata: { invoice: invoiceId }, payment_intent: 'pi_x' });
    const r = await deliver(forged, { secret: 'whsec_someone_else' });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('bad_signature');
    const unsigned = await fetch(`${baseUrl()}/api/payments/webhook`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(forged) });
    expect(unsigned.status).toBe(400);
    expect((await sql('SELECT count(*)::int AS n FROM payment_events'))[0].n).toBe(before);
    expect((await invoiceState()).state).toBe('paid');
  });

  test('a replayed delivery outside the SDK’s tolerance (300 s) is refused', async () => {
    const old = Math.floor(Date.now() / 1000) - 3600;
    const r = await deliver(event('evt_replayed_1', 'charge.refunded', old, { id: 'ch_x', object: 'charge', metadata: { invoice: invoiceId }, payment_intent: 'pi_x' }), { timestamp: old });
    expect(r.status).toBe(400);
    expect((await invoiceState()).state).toBe('paid');
  });

  test('the same event twice is taken once', async () => {
    const now = Math.floor(Date.now() / 1000);
    const late = event(`evt_dup_${now}`, 'checkout.session.completed', now - 5, { id: 'cs_dup', object: 'checkout.session', payment_status: 'paid', amount_total: 125000, currency: 'eur', metadata: { invoice: invoiceId }, payment_intent: 'pi_dup' });
    const first = await deliver(late);
    const second = await deliver(late);
    expect(first.status).toBe(200);
    expect(second.body.outcome).toBe('duplicate');
    expect((await sql('SELECT count(*)::int AS n FROM payment_events WHERE id = $1', [late.id]))[0].n).toBe(1);
  });

  test('a refund locks again and says why; a late "completed" older than the refund does not unlock', async () => {
    const held = mailTo(clientEmail).length;
    const r = await owner.post(`/api/brands/${brandId}/handover/refund`, {});
    expect(r.status).toBe(202);
    const invoice = await until('refund', invoiceState, (i) => i.state === 'refunded');
    expect(invoice.stateReason).toContain('refunded');
    const file = await people.partner.get(logoFile());
    expect(file.status).toBe(402);
    expect(file.body.error.message).toContain('refunded');
    await until('held-back mail', async () => mailTo(clientEmail).length, (n) => n > held);
    // The provider retries a completed event that it sent before the refund: it arrives now, dated earlier.
    const earlier = Math.floor(Date.now() / 1000) - 60;
    const late = await deliver(event(`evt_late_${earlier}`, 'checkout.session.completed', earlier, { id: 'cs_late', object: 'checkout.session', payment_status: 'paid', amount_total: 125000, currency: 'eur', metadata: { invoice: invoiceId }, payment_intent: 'pi_late' }));
    expect(late.body.outcome).toBe('stale');
    expect((await invoiceState()).state).toBe('refunded');
    expect((await linkVisitor.get(tokensFile())).status).toBe(402);
  });

  test('a paid event whose amount differs from the invoice never unlocks', async () => {
    const { body } = await owner.get(`/api/brands/${brandId}/handover`);
    expect(body.invoice.state).toBe('refunded');
    // A fresh invoice on a second brand of the same owner, sent, then a "paid" event for 1 cent.
    const other = (await owner.post('/api/brands', { name: 'Handover Mismatch Co' })).body.brand;
    const made = await owner.request('PUT', `/api/brands/${other.id}/handover`, { amount: 5000, currency: 'GBP', dueOn: '2027-03-01', releases: 'shelf', clientEmail });
    await owner.post(`/api/brands/${other.id}/handover/send`, {});
    const now = Math.floor(Date.now() / 1000);
    const r = await deliver(event(`evt_cheap_${now}`, 'checkout.session.completed', now, { id: 'cs_cheap', object: 'checkout.session', payment_status: 'paid', amount_total: 1, currency: 'gbp', metadata: { invoice: made.body.invoice.id }, payment_intent: 'pi_cheap' }));
    expect(r.body.outcome).toBe('amount-mismatch');
    expect((await owner.get(`/api/brands/${other.id}/handover`)).body.invoice.state).toBe('sent');
  });
});
