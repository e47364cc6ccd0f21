// What every published page view looks up: the brand by slug, the visitor's role and the version. Kept in memory
// until a change notice says otherwise (src/lib/live), so every process honours a change within a second.
import type { Brand, GuidelineVersion } from '@db/models';
import type { BrandRole } from '@/lib/auth/roles';
import { noticeBoard } from '@/lib/live/notices.server';

export const siteCache = {
  /** By slug; renaming, adding or deleting a brand changes them. */
  brands: noticeBoard.memory<Brand | null>('site brands', ['brand']),
  /** By `userId:brandId`; a role needs a membership and a proven address. */
  roles: noticeBoard.memory<BrandRole | null>('site roles', ['member', 'user', 'brand']),
  /** By `brandId:number|latest`; a version published, turning ready or deleted changes them. */
  versions: noticeBoard.memory<GuidelineVersion | null>('site versions', ['version', 'brand']),
  /** By brand id: the number of its newest ready version (which of a version's pages a reader gets depends on it). */
  latest: noticeBoard.memory<number | null>('site latest versions', ['version', 'brand']),
  /** This process at once, before the notice comes back (e.g. after a publish, a member change or a renamed slug). */
  forget(): void {
    siteCache.brands.forget();
    siteCache.roles.forget();
    siteCache.versions.forget();
    siteCache.latest.forget();
  },
};
