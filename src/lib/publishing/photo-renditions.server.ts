// Responsive renditions of a published version's photographs: its own copy, cut around the focal point the version
// recorded, at one of the widths its page offers. Drawn through the one rendition function when the version is built.
import type { AssetFormat, RenditionParams } from '@/lib/assets/kinds';
import { aspectFromParam, CENTRE, focalCrop, srcsetWidths } from '@/lib/assets/photo';
import { cachedRendition, type Rendition } from '@/lib/assets/render.server';
import type { IdentityAsset } from '@/lib/identity/types';
import { storage } from '@/lib/storage/index.server';
import { versionSnapshot, type VersionRecord } from './versions.server';

async function versionPhotos(version: VersionRecord): Promise<Map<string, IdentityAsset>> {
  const { identity } = await versionSnapshot(version);
  return new Map((identity.assets ?? []).filter((a) => a.kind === 'photo' && a.width && a.height).map((a) => [a.id, a]));
}

/**
 * The rendition `?w=<width>&aspect=<4x3>` of a version's photograph, or null when the file is no photograph of the
 * version or the width is not one its page offers for that crop (so nobody can make us draw arbitrary sizes).
 */
export async function versionPhotoRendition(version: VersionRecord, fileId: string, fileKey: string, query: URLSearchParams): Promise<Rendition | null> {
  const aspect = aspectFromParam(query.get('aspect'));
  const width = Number(query.get('w'));
  if (!aspect || !Number.isInteger(width)) return null;
  const photo = (await versionPhotos(version)).get(fileId);
  if (!photo) return null;
  const focus = photo.focus ?? CENTRE;
  const crop = focalCrop({ width: photo.width!, height: photo.height! }, aspect, focus);
  if (!srcsetWidths(crop.width).includes(width)) return null;
  const params: RenditionParams = { format: 'jpg', width, square: false, padding: 0, background: '#ffffff', variant: 'original', color: null, colorSpace: 'rgb', sizes: null, focalCrop: { aspect, focus } };
  const brandId = fileKey.split('/')[0];
  const bytes = async () => {
    const body = await storage.get(fileKey);
    if (!body) throw new Error('version photo missing from storage');
    return body;
  };
  return cachedRendition(storage, { id: `version:${fileKey}`, brandId, format: photo.format as AssetFormat, drawnBounds: null, bytes }, params);
}
