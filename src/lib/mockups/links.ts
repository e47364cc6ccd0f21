// Where a reader downloads a mock-up: the draft route in the editor, the published version's own address on the site.
import type { Identity } from '@/lib/identity/types';

/** The version's base path, read from the logo addresses the site gave the identity (see snapshot-urls.ts). */
function versionBase(identity: Identity): string | null {
  const match = /^(\/b\/[a-z0-9-]+\/v\/\d+)\/files\//.exec(identity.logos[0]?.files.original ?? '');
  return match ? match[1] : null;
}

/** The download address of one mock-up, or null where none is offered (a draft outside the editor, the print edition). */
export function mockupDownloadHref(identity: Identity, key: string, format: 'png' | 'pdf', choice: { logoId: string | null; photoIds: readonly string[] }, editing: boolean): string | null {
  const q = new URLSearchParams({ format });
  if (editing) {
    if (choice.logoId) q.set('logoId', choice.logoId);
    if (choice.photoIds.length) q.set('photos', choice.photoIds.join(','));
    return `/api/brands/${encodeURIComponent(identity.brand.id)}/mockups/${encodeURIComponent(key)}?${q}`;
  }
  const base = versionBase(identity);
  // The version reads the logo and photographs from its own block, so only the format travels.
  return base ? `${base}/mockups/${encodeURIComponent(key)}?${q}` : null;
}
