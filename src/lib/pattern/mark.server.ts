// The mark's bytes as the brand keeps them now (the working identity), for the pattern generator.
import { BrandLogo } from '@db/models';
import type { IdentityLogo } from '@/lib/identity/types';
import { storage } from '@/lib/storage/index.server';
import type { MarkFile } from './pattern.server';

/** The logo's stored file in the working identity, or null when it is gone. */
export async function draftMark(brandId: string, logo: IdentityLogo): Promise<MarkFile | null> {
  const row = await BrandLogo.findOne({ where: { id: logo.id, brandId }, attributes: ['storageKey', 'format'] });
  const bytes = row ? await storage.get(row.storageKey) : null;
  return row && bytes ? { bytes, format: row.format } : null;
}
