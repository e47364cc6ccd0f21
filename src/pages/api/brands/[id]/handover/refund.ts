import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { refundInvoice } from '@/lib/handover/invoices.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';

/** Ask the payment provider to refund the paid invoice; its refund event locks the files again (202: not yet). */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'handover.manage');
  await readJson(request, z.strictObject({}));
  return json(await refundInvoice(caller, brand), 202);
});

export const ALL = methodNotAllowed;
