import { checkoutFor } from '@/lib/handover/invoices.server';
import { endpoint, json, methodNotAllowed } from '@/lib/http/api';

/**
 * Start the provider's checkout for the invoice behind a pay link (no account: the link is the key). The body is
 * never read: amount and currency come from our database. A form post (the pay page) is sent on with 303; a script
 * gets `{url}`.
 */
export const POST = endpoint(async ({ params, request }) => {
  const url = await checkoutFor(params.token ?? '');
  const fromForm = (request.headers.get('content-type') ?? '').includes('application/x-www-form-urlencoded');
  return fromForm ? new Response(null, { status: 303, headers: { location: url, 'cache-control': 'no-store' } }) : json({ url });
});

export const ALL = methodNotAllowed;
