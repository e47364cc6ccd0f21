// Which shelf files a mock-up may use as the brand's photographs: approved images (and photos, once the shelf has them).
import type { Identity, IdentityAsset } from '@/lib/identity/types';
import { safeAssetUrl } from '@/lib/guideline/links';

export const PHOTO_KINDS = ['image', 'photo'] as const;
const PHOTO_FORMATS = new Set(['jpg', 'jpeg', 'png', 'webp', 'avif']);

/** The identity's approved shelf files that can stand as photographs. */
export const shelfPhotos = (identity: Identity): IdentityAsset[] =>
  (identity.assets ?? []).filter((a) => (PHOTO_KINDS as readonly string[]).includes(a.kind) && PHOTO_FORMATS.has(a.format.toLowerCase()));

/** Addresses of the chosen photographs that are still on the shelf, in the chosen order. */
export function photoAddresses(identity: Identity, ids: readonly string[]): string[] {
  const shelf = shelfPhotos(identity);
  return ids.flatMap((id) => {
    const url = safeAssetUrl(shelf.find((a) => a.id === id)?.url);
    return url ? [url] : [];
  });
}
