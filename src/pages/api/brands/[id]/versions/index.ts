import { z } from 'zod';
import { isCleanNote, NOTE_MESSAGE } from '@/lib/safe/values';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { listVersions, publishVersion } from '@/lib/publishing/versions.server';
import { preflightBrand } from '@/lib/publishing/preflight.server';
import { audit } from '@/lib/audit.server';

const publishBody = z.strictObject({
  note: z.string({ error: 'Say in a line what this version changes.' }).trim().min(1, 'Say in a line what this version changes.').max(2000)
    .refine(isCleanNote, NOTE_MESSAGE),
});

/** Every published version, newest first, with its author and note. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'version.read');
  return json({ versions: await listVersions(brand) });
});

/** Publish the working draft and the identity as the next numbered version. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'version.publish');
  const { note } = await readJson(request, publishBody);
  // Publishing past the check is the designer's call; the trail records what was still open when they made it.
  const findings = await preflightBrand(brand);
  const version = await publishVersion(caller, brand, note);
  if (findings.length) {
    await audit({ actorId: caller.id, action: 'version.preflight', targetType: 'version', targetId: String(version.number), brandId: brand.id, studioId: brand.studioId, details: { open: findings.map((f) => ({ code: f.code, where: f.where })) } });
  }
  return json({ version }, 201);
});

export const ALL = methodNotAllowed;
