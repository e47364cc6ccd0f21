import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, formFile, idParam, json, methodNotAllowed, parseWith, readForm } from '@/lib/http/api';
import { deleteLogoVariant, MAX_LOGO_BYTES, uploadLogoVariant } from '@/lib/identity/identity.server';
import { LOGO_VARIANT_SLOTS } from '@/lib/identity/types';

const slotParam = z.enum(LOGO_VARIANT_SLOTS, { error: `The version must be one of: ${LOGO_VARIANT_SLOTS.join(', ')}.` });

/** Upload the designer's own file for one version of a logo (field "file", SVG or PNG); it wins over the computed one. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const slot = parseWith(slotParam, params.slot, 'path');
  const form = await readForm(request, MAX_LOGO_BYTES + 64 * 1024);
  const logo = await uploadLogoVariant(caller, brand, idParam(params.logoId, 'That logo'), slot, formFile(form));
  return json({ logo });
});

/** Remove the designer's own file for that version: the computed knockout is used again. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const slot = parseWith(slotParam, params.slot, 'path');
  const logo = await deleteLogoVariant(caller, brand, idParam(params.logoId, 'That logo'), slot);
  return json({ logo });
});

export const ALL = methodNotAllowed;
