// A version's identity carries no file URLs of its own: they are made at view time from the site's address,
// so a renamed brand slug never breaks an old version.
import type { Identity } from '@/lib/identity/types';

/** Base path of one published version. */
export const versionPath = (slug: string, number: number) => `/b/${slug}/v/${number}`;

/** The identity with file URLs pointing at the version's own copies; unlicensed fonts get no URL. */
export function withVersionUrls(identity: Identity, slug: string, number: number, files: Record<string, unknown> = {}): Identity {
  const base = `${versionPath(slug, number)}/files`;
  return {
    ...identity,
    // Shelf images the version copied are served from the version; the rest keep their download-gated address.
    assets: identity.assets?.map((a) => (files[a.id] ? { ...a, url: `${base}/${a.id}`, ...(a.kind === 'photo' ? { renditions: `${base}/${a.id}` } : {}) } : a)),
    logos: identity.logos.map((l) => {
      const url = `${base}/${l.id}`;
      return { ...l, files: { original: url, black: `${url}?variant=black`, white: `${url}?variant=white`, reversed: `${url}?variant=reversed`, onDark: `${url}?variant=on-dark` } };
    }),
    typefaces: identity.typefaces.map((f) => ({ ...f, fileUrl: f.licence.confirmed ? `${base}/${f.id}` : '' })),
  };
}
