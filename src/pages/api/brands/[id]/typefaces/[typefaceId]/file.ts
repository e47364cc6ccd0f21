import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, fileResponse, idParam, methodNotAllowed } from '@/lib/http/api';
import { typefaceFile } from '@/lib/identity/identity.server';

/** The font file, for previews in the identity screens (members who read drafts). */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const file = await typefaceFile(brand, idParam(params.typefaceId, 'That typeface'));
  return fileResponse(file.body, file.contentType, 'font', { inline: true });
});

export const ALL = methodNotAllowed;
