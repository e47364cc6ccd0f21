import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, formFields, formFile, idParam, json, methodNotAllowed, parseWith, readForm, readJson } from '@/lib/http/api';
import { addShippedTypeface, MAX_FONT_BYTES, uploadTypeface } from '@/lib/identity/identity.server';
import { shippedTypefaceBody, typefaceUploadFields } from '@/lib/identity/schemas';

/** Add a typeface: JSON to pick a shipped open font, or multipart to upload a font file (field "file"). */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  if ((request.headers.get('content-type') ?? '').includes('application/json')) {
    const body = await readJson(request, shippedTypefaceBody);
    return json({ typeface: await addShippedTypeface(caller, brand, body.shipped, body.role, body.fallback) }, 201);
  }
  const form = await readForm(request, MAX_FONT_BYTES + 64 * 1024);
  const file = formFile(form);
  const fields = parseWith(typefaceUploadFields, formFields(form), 'form');
  return json({ typeface: await uploadTypeface(caller, brand, file, fields.role, fields.family) }, 201);
});

export const ALL = methodNotAllowed;
