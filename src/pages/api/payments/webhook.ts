import { takePaymentEvent } from '@/lib/handover/invoices.server';
import { verifiedEvent } from '@/lib/handover/payments.server';
import { endpoint, json, methodNotAllowed, readBody } from '@/lib/http/api';

/** The payment provider's events: the signature is checked on the raw bytes (SDK constructEvent) before anything is read. */
export const POST = endpoint(async ({ request }) => {
  const payload = await readBody(request, 256 * 1024);
  const event = verifiedEvent(payload, request.headers.get('stripe-signature'));
  const outcome = await takePaymentEvent(event);
  return json({ received: true, outcome });
});

export const ALL = methodNotAllowed;
