import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { sendInvoice } from '@/lib/handover/invoices.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { allowMessage } from '@/lib/mail/send-limit.server';

/** E-mail the client contact the pay link (a new link each time). */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'handover.manage');
  await readJson(request, z.strictObject({}));
  await allowMessage(caller.id);
  return json(await sendInvoice(caller, brand));
});

export const ALL = methodNotAllowed;
