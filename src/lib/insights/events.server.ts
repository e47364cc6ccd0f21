// POST /b/:slug/v/:n/events: what the published page's scripts report (a section seen, a search). Same visitors as
// the page; everyone else gets a 404 that says nothing about the site. Never slows anything: the event joins the
// recorder's buffer and the answer is a 204.
import type { APIContext } from 'astro';
import { ApiError, readBody, parseWith } from '@/lib/http/api';
import { siteAccess } from '@/lib/publishing/site-access.server';
import { asksNotToTrack, siteEventSchema } from './contract';
import { recordEvent } from './record.server';
import { siteVisitor } from './site-read.server';
import { EventLimiter } from './limiter';

/** sendBeacon bodies are a few dozen bytes; anything near this is not ours. */
export const MAX_EVENT_BYTES = 8 * 1024;
/** Events per visitor (address and agent) per minute, in this process. */
export const EVENTS_PER_MINUTE = 120;

const limiter = new EventLimiter(EVENTS_PER_MINUTE, 60_000);
const noContent = () => new Response(null, { status: 204, headers: { 'cache-control': 'no-store' } });

/** Accept one event from a visitor of version `number` of the brand at `slug`. */
export async function siteEventResponse(context: APIContext, slug: string, number: number): Promise<Response> {
  if (!Number.isInteger(number) || number < 1) throw new ApiError(404, 'not_found', 'That guideline site was not found.');
  const access = await siteAccess(context, slug, number);
  if (access instanceof Response) throw new ApiError(404, 'not_found', 'That guideline site was not found.');
  // Asked not to be tracked: the answer is the same, nothing is read or kept.
  if (asksNotToTrack((name) => context.request.headers.get(name))) return noContent();
  const who = siteVisitor(context, access);
  if (!limiter.take(`${who.ip}\n${who.userAgent}`)) throw new ApiError(429, 'rate_limited', 'Too many events from this visitor; try again in a minute.');
  const type = (context.request.headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase();
  // navigator.sendBeacon with a string sends text/plain; fetch sends JSON.
  if (type !== 'application/json' && type !== 'text/plain') {
    throw new ApiError(415, 'unsupported_media_type', 'Send the event as JSON (Content-Type: application/json or text/plain).');
  }
  const text = (await readBody(context.request, MAX_EVENT_BYTES)).toString('utf8');
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw new ApiError(400, 'malformed_json', 'The event is not valid JSON.');
  }
  recordEvent(who, parseWith(siteEventSchema, value, 'event'));
  return noContent();
}
