// Who may read a published guideline site: members by role, or a visitor holding that brand's share link.
import type { APIContext } from 'astro';
import { Brand, BrandFormerSlug, type GuidelineVersion } from '@db/models';
import { roleOn } from '@/lib/auth/access.server';
import { can } from '@/lib/auth/policy';
import type { BrandRole } from '@/lib/auth/roles';
import { versionFromPass, PRINT_COOKIE } from './print-grant.server';
import { findVersion } from './versions.server';
import { siteCache } from './site-cache';
import { escapeHtml } from '@/lib/safe/escape';

export interface SiteAccess {
  brand: Brand;
  version: GuidelineVersion;
  /** The member's role, or null for a share-link visitor. */
  role: BrandRole | null;
  viaShareLink: string | null;
  canDownload: boolean;
  /** Members may open the reveal presentation; a share link only when it says so. */
  canPresent: boolean;
  /** Editors see notes meant for them (e.g. a font shown in its fallback for want of a licence). */
  isEditor: boolean;
}

/** The HTML of a small plain page; title and message are text (escaped here), never HTML. */
export const plainPageHtml = (title: string, message: string) =>
  `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(title)}</title>` +
  `<style>body{font-family:system-ui,sans-serif;background:#f8f6f2;color:#211e1a;display:grid;place-items:center;min-height:100vh;margin:0}main{max-width:32rem;padding:2rem}h1{font-size:1.6rem}p{color:#57514a;line-height:1.5}a{color:#4b3a8c}</style></head>` +
  `<body><main><h1>${escapeHtml(title)}</h1><p>${escapeHtml(message)}</p></main></body></html>`;

/** A small plain page as a response; title and message are text (escaped), never HTML. */
const page = (status: number, title: string, message: string) =>
  new Response(plainPageHtml(title, message), { status, headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' } });

/** The page for a share link that opens the guidelines but not the presentation. */
export const notSharedPage = () =>
  page(403, 'The presentation is not part of this link', 'This link opens the published guidelines only. Ask the brand team for a link that includes the presentation.');

export const notFoundPage = () => page(404, 'Nothing here', 'This guideline site does not exist, or you do not have access to it.');

/** The brand's current slug when `slug` is one of its former addresses. */
async function formerAddress(slug: string): Promise<string | null> {
  const former = await BrandFormerSlug.findByPk(slug, { attributes: ['brandId'] });
  if (!former) return null;
  return (await Brand.findByPk(former.brandId, { attributes: ['slug'] }))?.slug ?? null;
}

/** A permanent redirect from /b/<old>/… to /b/<new>/…, path and query kept. */
function movedTo(url: URL, from: string, to: string): Response {
  const rest = url.pathname.slice(`/b/${from}`.length);
  return new Response(null, { status: 301, headers: { location: `/b/${encodeURIComponent(to)}${rest}${url.search}`, 'cache-control': 'no-store' } });
}

type Reader = Pick<App.Locals, 'user' | 'shareGrant'>;

/** Which version a reader asks for: a link pinned to one version opens that version only (-1: not this one). */
const wantedVersion = (role: BrandRole | null, share: App.Locals['shareGrant'], number: number | null): number | null =>
  !role && share?.version != null ? (number === null || number === share.version ? share.version : -1) : number;

/** The access these looked-up values give, or null (no membership or link, a role that may not read, no version). */
function readerFrom(brand: Brand, role: BrandRole | null, share: App.Locals['shareGrant'], version: GuidelineVersion | null): SiteAccess | null {
  if (!version) return null;
  return {
    brand,
    version,
    role,
    viaShareLink: role ? null : share!.linkId,
    canDownload: role ? can(role, 'asset.download') : share!.allowDownloads,
    canPresent: role ? true : share!.allowPresentation,
    isEditor: role ? can(role, 'draft.edit') : false,
  };
}

/** Whether a role or a link opens the site at all (a role must be allowed to read versions). */
const opens = (role: BrandRole | null, share: App.Locals['shareGrant']): boolean => (role ? can(role, 'version.read') : share !== null);
const shareFor = (brand: Brand, grant: App.Locals['shareGrant']) => (grant?.brandId === brand.id ? grant : null);

/**
 * The version a member or a share-link holder reads at /b/:slug[/v/:number], from notice-kept memory; null for every
 * other case (no such brand, a former slug, a print pass, a refusal, no such version), which siteAccess answers.
 */
export async function readerAccess({ user, shareGrant }: Reader, slug: string, number: number | null): Promise<SiteAccess | null> {
  const brand = await siteCache.brands.remember(slug, () => Brand.findOne({ where: { slug } }));
  if (!brand) return null;
  const role = user ? await siteCache.roles.remember(`${user.id}:${brand.id}`, () => roleOn(user.id, brand)) : null;
  const share = shareFor(brand, shareGrant);
  if (!opens(role, share)) return null;
  const wanted = wantedVersion(role, share, number);
  if (wanted === -1) return null;
  return readerFrom(brand, role, share, await siteCache.versions.remember(`${brand.id}:${wanted ?? 'latest'}`, () => findVersion(brand.id, wanted)));
}

/** readerAccess without waiting: its answer when every lookup is kept in memory now, undefined when one is not. */
export function keptReaderAccess({ user, shareGrant }: Reader, slug: string, number: number | null): SiteAccess | null | undefined {
  const brand = siteCache.brands.get(slug);
  if (brand === undefined) return undefined;
  if (!brand) return null;
  const role = user ? siteCache.roles.get(`${user.id}:${brand.id}`) : null;
  if (role === undefined) return undefined;
  const share = shareFor(brand, shareGrant);
  if (!opens(role, share)) return null;
  const wanted = wantedVersion(role, share, number);
  if (wanted === -1) return null;
  const version = siteCache.versions.get(`${brand.id}:${wanted ?? 'latest'}`);
  return version === undefined ? undefined : readerFrom(brand, role, share, version);
}

/** The version a visitor may read at /b/:slug[/v/:number], or the response to send instead. */
export async function siteAccess(Astro: Pick<APIContext, 'locals' | 'url' | 'redirect' | 'cookies'>, slug: string, number: number | null): Promise<SiteAccess | Response> {
  const open = await readerAccess(Astro.locals, slug, number);
  if (open) return open;
  // What is left: a former slug, a print pass, a refusal, or no such version (every lookup below is kept in memory).
  const { user, shareGrant } = Astro.locals;
  const brand = await siteCache.brands.remember(slug, () => Brand.findOne({ where: { slug } }));
  if (!brand) {
    // A former address of a renamed brand: send the visitor on to the current one, which checks access as usual.
    const moved = await formerAddress(slug);
    if (moved) return movedTo(Astro.url, slug, moved);
  }
  const role = brand && user ? await siteCache.roles.remember(`${user.id}:${brand.id}`, () => roleOn(user.id, brand)) : null;
  const share = brand ? shareFor(brand, shareGrant) : null;

  // Our PDF renderer reads the print page with a signed pass for exactly one version.
  const passVersion = brand && !role && !share ? versionFromPass(Astro.cookies.get(PRINT_COOKIE)?.value) : null;
  if (passVersion) {
    const version = await findVersion(brand!.id, number);
    if (version && version.id === passVersion) return { brand: brand!, version, role: null, viaShareLink: null, canDownload: false, canPresent: true, isEditor: false };
  }
  if (!brand || (!role && !share)) {
    if (!user && !share) return Astro.redirect(`/sign-in?next=${encodeURIComponent(Astro.url.pathname)}`);
    return notFoundPage();
  }
  if (!opens(role, share)) return notFoundPage();
  const wanted = wantedVersion(role, share, number);
  if (wanted === -1) return notFoundPage();
  const version = await siteCache.versions.remember(`${brand.id}:${wanted ?? 'latest'}`, () => findVersion(brand.id, wanted));
  return (
    readerFrom(brand, role, share, version) ??
    page(404, 'Not published yet', number === null ? 'This brand has no published guidelines yet. The studio will share a link once the first version is out.' : `Version ${number} does not exist.`)
  );
}

/** The clear page for a link that no longer works. */
export const goneLinkPage = (state: 'expired' | 'revoked') =>
  page(410, 'This link no longer works', state === 'expired' ? 'The share link has expired. Ask the brand team for a new one.' : 'The share link was withdrawn by the brand team. Ask them for a new one.');

export const simplePage = page;
