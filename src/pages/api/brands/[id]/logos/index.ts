import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, formFields, formFile, idParam, json, methodNotAllowed, parseWith, readForm } from '@/lib/http/api';
import { MAX_LOGO_BYTES, uploadLogo } from '@/lib/identity/identity.server';
import { logoFields } from '@/lib/identity/schemas';

/** Upload a logo (SVG or PNG, field "file"; optional "variant" and "name"); bounds and sizes are measured. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const form = await readForm(request, MAX_LOGO_BYTES + 64 * 1024);
  const file = formFile(form);
  const fields = parseWith(logoFields, formFields(form), 'form');
  const { logo, duplicate } = await uploadLogo(caller, brand, file, fields);
  return json({ logo, duplicate }, duplicate ? 200 : 201);
});

export const ALL = methodNotAllowed;
