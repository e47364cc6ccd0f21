// The reveal presentation of a published version: who may open it, and the page its build drew.
import type { APIContext } from 'astro';
import { presentationPath } from '@/lib/publishing/build/contract';
import { notSharedPage, notFoundPage, siteAccess, type SiteAccess } from '@/lib/publishing/site-access.server';
import { sendVersionFile } from './built.server';
import { noteRead } from '@/lib/insights/site-read.server';
import { markLogo, primaryLogo } from '@/lib/guideline/identity';
import type { Identity } from '@/lib/identity/types';
import { logoTones } from '@/lib/logo/proofs.server';
import type { ToneReport } from '@/lib/logo/tones';
import { log } from '@/lib/log.server';
import type { VersionRecord } from '@/lib/publishing/versions.server';
import { storage } from '@/lib/storage/index.server';

/** The version a visitor may present at /b/:slug[/v/:n]/presentation, or the response to send instead. */
export async function presentationAccess(context: Pick<APIContext, 'locals' | 'url' | 'redirect' | 'cookies'>, slug: string, number: number | null): Promise<SiteAccess | Response> {
  const access = await siteAccess(context, slug, number);
  if (access instanceof Response) return access;
  return access.canPresent ? access : notSharedPage();
}

/** The tone check of the logos the presentation shows, from the version's own file copies; a logo without one is left out. */
export async function versionTones(version: VersionRecord, identity: Identity): Promise<Record<string, ToneReport>> {
  const shown = [primaryLogo(identity), markLogo(identity)].filter((l, i, all) => !!l && all.findIndex((o) => o?.id === l.id) === i);
  const tones: Record<string, ToneReport> = {};
  for (const logo of shown) {
    const copy = Object.hasOwn(version.files ?? {}, logo!.id) ? version.files[logo!.id] : undefined;
    const bytes = copy ? await storage.get(copy.key) : null;
    if (!bytes) continue;
    try {
      tones[logo!.id] = await logoTones({ bytes, format: logo!.format, canvas: logo!.canvas });
    } catch (err) {
      // A logo that cannot be drawn loses its slide, never the presentation.
      log.warn({ versionId: version.id, logoId: logo!.id, problem: (err as Error).message }, 'presentation: no tone check');
    }
  }
  return tones;
}

// Nothing from elsewhere: every file the slides show is the version's own.
const HEADERS = {
  'cache-control': 'private, no-cache',
  vary: 'Cookie',
  'content-security-policy': "default-src 'self'; img-src 'self' data:; font-src 'self' data:; style-src 'self' 'unsafe-inline'; script-src 'self' 'unsafe-inline'; object-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'",
};

/**
 * /b/:slug/presentation (number null: the current version, whose links lead to the current site) or
 * /b/:slug/v/:n/presentation; `?print` is the form our PDF step prints.
 */
export async function presentationResponse(context: APIContext, number: number | null): Promise<Response> {
  if (number !== null && (!Number.isInteger(number) || number < 1)) return notFoundPage();
  const access = await presentationAccess(context, context.params.slug!, number);
  if (access instanceof Response) return access;
  const form = context.url.searchParams.has('print') ? 'print' : number === null ? 'current' : 'version';
  const response = await sendVersionFile(context.request, access, presentationPath(form), HEADERS, notFoundPage);
  // The print form is our own PDF step reading the page, not a visitor.
  return form === 'print' ? response : noteRead(context, access, 'presentation', presentationPath(form), response);
}
