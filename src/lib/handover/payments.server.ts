// The payment provider, through its official Node SDK: checkout sessions, refunds, and the webhook's signature check.
// STRIPE_API_BASE points the same SDK at the local fake (scripts/lib/fake-payments.ts); unset, it talks to the service.
import Stripe from 'stripe';
import { STRIPE_API_BASE, STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET } from 'astro:env/server';
import { ApiError } from '@/lib/http/api';
import type { PaymentChange } from './invoice';

let client: Stripe | undefined;

/** Whether payments are set up on this server (a secret key and a webhook secret). */
export const paymentsConfigured = () => !!STRIPE_SECRET_KEY && !!STRIPE_WEBHOOK_SECRET;

/** The SDK client; 503 `payments_not_configured` when no key is set. */
export function payments(): Stripe {
  if (!paymentsConfigured()) throw new ApiError(503, 'payments_not_configured', 'Payments are not set up on this server (STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET), so no pay link can be made.');
  if (client) return client;
  const base = STRIPE_API_BASE ? new URL(STRIPE_API_BASE) : null;
  client = new Stripe(STRIPE_SECRET_KEY!, {
    maxNetworkRetries: 1,
    appInfo: { name: 'Plumbline' },
    ...(base ? { host: base.hostname, port: Number(base.port || (base.protocol === 'https:' ? 443 : 80)), protocol: base.protocol === 'https:' ? 'https' : 'http' } : {}),
  });
  return client;
}

/** The verified event, or 400 `bad_signature` (a forged, altered or replayed delivery: the SDK's 300 s tolerance). */
export function verifiedEvent(payload: Buffer, signature: string | null): Stripe.Event {
  if (!signature) throw new ApiError(400, 'bad_signature', 'The delivery carries no Stripe-Signature header.');
  try {
    return payments().webhooks.constructEvent(payload, signature, STRIPE_WEBHOOK_SECRET!);
  } catch (err) {
    if (err instanceof ApiError) throw err;
    throw new ApiError(400, 'bad_signature', 'The delivery’s signature does not match (or it is too old to be trusted); nothing was changed.');
  }
}

/** What an event means for a handover invoice, or null when it is not about one. */
export interface InvoiceEvent {
  invoiceId: string | null;
  paymentIntentId: string | null;
  sessionId: string | null;
  /** What the provider says was paid, checked against the invoice before anything unlocks. */
  paid?: { amount: number; currency: string };
  change: PaymentChange;
}

const idOf = (value: unknown): string | null => (typeof value === 'string' ? value : value && typeof value === 'object' && 'id' in value && typeof value.id === 'string' ? value.id : null);

export function invoiceEvent(event: Stripe.Event): InvoiceEvent | null {
  const at = new Date(event.created * 1000);
  switch (event.type) {
    case 'checkout.session.completed':
    case 'checkout.session.async_payment_succeeded': {
      const s = event.data.object;
      // A delayed method completes the checkout unpaid; its own "succeeded" or "failed" event follows.
      if (s.payment_status !== 'paid') return null;
      return { invoiceId: s.metadata?.invoice ?? null, paymentIntentId: idOf(s.payment_intent), sessionId: s.id, paid: { amount: s.amount_total ?? 0, currency: (s.currency ?? '').toUpperCase() }, change: { kind: 'paid', at } };
    }
    case 'checkout.session.async_payment_failed': {
      const s = event.data.object;
      return { invoiceId: s.metadata?.invoice ?? null, paymentIntentId: idOf(s.payment_intent), sessionId: s.id, change: { kind: 'failed', at, reason: 'the payment was declined' } };
    }
    case 'payment_intent.payment_failed': {
      const pi = event.data.object;
      return { invoiceId: pi.metadata?.invoice ?? null, paymentIntentId: pi.id, sessionId: null, change: { kind: 'failed', at, reason: pi.last_payment_error?.message?.slice(0, 200) || 'the payment was declined' } };
    }
    case 'charge.refunded': {
      const charge = event.data.object;
      return { invoiceId: charge.metadata?.invoice ?? null, paymentIntentId: idOf(charge.payment_intent), sessionId: null, change: { kind: 'refunded', at, reason: `refunded ${at.toISOString().slice(0, 10)}` } };
    }
    default:
      return null;
  }
}
