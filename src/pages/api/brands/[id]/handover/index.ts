import { authorizeBrand } from '@/lib/auth/access.server';
import { invoiceInputSchema } from '@/lib/handover/invoice';
import { deleteInvoice, handoverView, saveInvoice } from '@/lib/handover/invoices.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';

/** The brand's handover invoice (null when none) and whether payments are set up on this server. Owners only. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'handover.manage');
  return json(await handoverView(brand));
});

/** Set the invoice: amount in minor units, ISO 4217 currency, due date, what it releases, the client's address. */
export const PUT = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'handover.manage');
  const input = await readJson(request, invoiceInputSchema);
  return json({ invoice: await saveInvoice(caller, brand, input) });
});

/** Remove an unpaid invoice: what it held back is released. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'handover.manage');
  await deleteInvoice(caller, brand);
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
