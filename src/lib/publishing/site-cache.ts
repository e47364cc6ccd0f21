// Two seconds of memory for what every published page view looks up: the brand by slug, the visitor's role and
// the version. Changes made in this process clear the affected part at once; other processes catch up within
// the two seconds.
import type { Brand, GuidelineVersion } from '@db/models';
import type { BrandRole } from '@/lib/auth/roles';
import { TtlCache } from '@/lib/http/ttl-cache';

export const siteCache = {
  brands: new TtlCache<Brand | null>(2000),
  roles: new TtlCache<BrandRole | null>(2000),
  versions: new TtlCache<GuidelineVersion | null>(2000),
  /** After a publish, a member change or a renamed slug. */
  forget(): void {
    siteCache.brands.clear();
    siteCache.roles.clear();
    siteCache.versions.clear();
  },
};
