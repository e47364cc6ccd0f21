import { siteEventResponse } from '@/lib/insights/events.server';
import { endpoint, methodNotAllowed } from '@/lib/http/api';

/** What the published page's scripts report: a section seen, a search and its result count (see EVENTS_PATH). */
export const POST = endpoint((context) => siteEventResponse(context, context.params.slug!, Number(context.params.number)));

export const ALL = methodNotAllowed;
