// The sent-mail page's data: captured messages the caller may read (their own, and their brands' as owner).
import { BrandMember } from '../../../db/models';
import type { Caller } from '../auth/access.server';
import { ApiError } from '../http/api';
import { listCaptured, type CapturedMail } from './captured';
import { captureDir } from './mail.server';

/** Whether the local fake is in use (the page and its API exist only then). */
export const sentMailAvailable = () => captureDir() !== null;

/** Messages to the caller or about a brand they own, newest first (at most `limit`). */
export async function visibleMail(caller: Caller, limit = 200): Promise<CapturedMail[]> {
  const dir = captureDir();
  if (!dir) throw new ApiError(404, 'not_found', 'This server sends real e-mail; there is no local sent-mail folder to show.');
  const owned = new Set((await BrandMember.findAll({ where: { userId: caller.id, role: 'owner' }, attributes: ['brandId'] })).map((m) => m.brandId));
  const me = caller.email.toLowerCase();
  return listCaptured(dir)
    .filter((m) => (m.brandId && owned.has(m.brandId)) || m.envelope.to.some((t) => t.toLowerCase() === me))
    .slice(0, limit);
}
