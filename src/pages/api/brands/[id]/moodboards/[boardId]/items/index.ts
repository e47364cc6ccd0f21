import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, formFields, formFile, idParam, json, methodNotAllowed, parseWith, readForm, readJson } from '@/lib/http/api';
import { addImage, addItem, MAX_BOARD_IMAGE_BYTES } from '@/lib/moodboards/moodboards.server';
import { imageCaption, newItemSchema } from '@/lib/moodboards/schemas';

/** Add a piece: JSON for a swatch, type sample or note; multipart/form-data ("file", "caption") for an image. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const boardId = idParam(params.boardId, 'That mood board');
  if ((request.headers.get('content-type') ?? '').includes('multipart/form-data')) {
    const form = await readForm(request, MAX_BOARD_IMAGE_BYTES + 64 * 1024);
    const { caption } = parseWith(imageCaption, formFields(form), 'form');
    return json({ item: await addImage(caller, brand, boardId, formFile(form), caption ?? '') }, 201);
  }
  return json({ item: await addItem(caller, brand, boardId, await readJson(request, newItemSchema)) }, 201);
});

export const ALL = methodNotAllowed;
