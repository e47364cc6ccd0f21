import { authorizeAssetRead } from '@/lib/assets/access.server';
import { bundle } from '@/lib/assets/assets.server';
import { bundleSchema } from '@/lib/assets/schemas';
import { assertShelfReleased } from '@/lib/handover/gate.server';
import { endpoint, idParam, methodNotAllowed, readJson } from '@/lib/http/api';

/** A zip of chosen approved assets (or all approved logos) with renditions and USAGE.txt, streamed as it is packed. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const reader = await authorizeAssetRead(locals, idParam(params.id));
  const body = await readJson(request, bundleSchema);
  await assertShelfReleased(reader.brand.id, reader.role, { kind: 'bundle' });
  const plan = await bundle(reader, body);
  return new Response(plan.stream, {
    headers: {
      'content-type': 'application/zip',
      'content-disposition': `attachment; filename="${plan.filename.replace(/[^\w.-]+/g, '-')}"`,
      'cache-control': 'private, no-store',
      'x-content-type-options': 'nosniff',
      // No length is known while packing; this lets the shelf show progress.
      'x-bundle-entries': String(plan.entries),
      'x-bundle-estimate-bytes': String(plan.estimateBytes),
      'access-control-expose-headers': 'x-bundle-entries, x-bundle-estimate-bytes',
    },
  });
});

export const ALL = methodNotAllowed;
