// What the published site tells the insights recorder: the shared shapes between the request paths that serve a
// version (the fast path and Astro's routes), the site's own scripts (search, section views) and the recorder.
// Nothing here touches the database; recording never waits on anything (see record.server.ts).
import { z } from 'zod';
import { isOneLine, ONE_LINE_MESSAGE } from '@/lib/safe/values';

/** One read of a published version's file, as the server answered it (only 200s are recorded). */
export interface SiteRead {
  brandId: string;
  versionNumber: number;
  /** What was read: the guideline page, one file (logo, photo, font…), a PDF, the presentation or a token file. */
  kind: 'page' | 'file' | 'pdf' | 'presentation' | 'tokens';
  /** The manifest path that was sent (see src/lib/publishing/build/contract.ts). */
  path: string;
  /** The share link the visitor came through, or null for a member. */
  shareLinkId: string | null;
  /** The signed-in member, or null. */
  userId: string | null;
  /** The TCP peer's address (never stored: only a salted, daily-rotated hash of it is). */
  ip: string;
  userAgent: string;
  /** The visitor asked not to be tracked (`DNT: 1` or `Sec-GPC: 1`): nothing is recorded. */
  doNotTrack: boolean;
  /** The request's Sec-Fetch-Dest, when sent: a file the page loads itself (image, font…) is not counted as a download. */
  fetchedAs?: string | null;
}

/** Whether a request's headers ask not to be tracked (DNT, Global Privacy Control). */
export const asksNotToTrack = (get: (name: string) => string | null | undefined) => get('dnt') === '1' || get('sec-gpc') === '1';

/**
 * What the published page's scripts send (navigator.sendBeacon, JSON body) to POST /b/:slug/v/:n/events:
 * a section scrolled into view, or a search and how many results it found (searches with none are what the owner
 * wants to see). The server decides brand, version, link and member from the request, never from the body.
 */
export const siteEventSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('section'), blockId: z.string().min(1).max(64).regex(/^[A-Za-z0-9_-]+$/) }),
  z.object({ kind: z.literal('search'), query: z.string().trim().min(1).max(120).refine(isOneLine, ONE_LINE_MESSAGE), results: z.number().int().min(0).max(10_000) }),
]);
export type SiteEvent = z.infer<typeof siteEventSchema>;

/** Address the page's scripts send events to, relative to the version ("/b/:slug/v/:n/" + this). */
export const EVENTS_PATH = 'events';
