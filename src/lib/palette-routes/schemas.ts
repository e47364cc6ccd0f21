// Request bodies of the palette-route routes, shared by the API and the forms (names and notes through the safe schemas).
import { z } from 'zod';
import { COLOR_ROLES } from '@/lib/identity/types';
import { cssColorText, displayName, isOneLine, noteText, ONE_LINE_MESSAGE } from '@/lib/safe/values';

export const MIN_ROUTES = 2;
export const MAX_ROUTES = 4;
export const MIN_ROUTE_COLORS = 2;
export const MAX_ROUTE_COLORS = 12;

export const routeColorSchema = z.strictObject({
  name: displayName('colour', 80),
  value: cssColorText,
  role: z.enum(COLOR_ROLES, { error: `Choose a role: ${COLOR_ROLES.join(', ')}.` }).nullable().optional(),
});

export const routeSchema = z.strictObject({
  name: displayName('route', 80),
  rationale: noteText('rationale', 600).optional(),
  colors: z
    .array(routeColorSchema)
    .min(MIN_ROUTE_COLORS, { error: `A route needs at least ${MIN_ROUTE_COLORS} colours.` })
    .max(MAX_ROUTE_COLORS, { error: `A route holds at most ${MAX_ROUTE_COLORS} colours.` }),
});

const routes = z
  .array(routeSchema)
  .min(MIN_ROUTES, { error: `Offer at least ${MIN_ROUTES} routes, so the client has a real choice.` })
  .max(MAX_ROUTES, { error: `Offer at most ${MAX_ROUTES} routes; more makes the choice harder, not better.` });

export const createRouteSetBody = z.strictObject({
  title: displayName('set of routes', 160),
  intro: noteText('introduction', 2000).optional(),
  routes,
});

export const updateRouteSetBody = z
  .strictObject({ title: displayName('set of routes', 160).optional(), intro: noteText('introduction', 2000).optional(), routes: routes.optional() })
  .refine((b) => Object.keys(b).length > 0, 'Send at least one field to change.');

export const sendRoutesBody = z.strictObject({
  contactName: displayName('contact', 120),
  contactEmail: z.email({ error: 'Enter a valid e-mail address for the contact.' }).max(320),
  message: noteText('message', 2000).optional(),
});

export const routeDecisionBody = z
  .strictObject({
    name: z.string().trim().min(1, { error: 'Tell us your name, so the designer knows who answered.' }).max(120, { error: 'A name can be at most 120 characters.' }).refine(isOneLine, ONE_LINE_MESSAGE),
    /** The chosen route's id, or null to send comments without choosing. */
    choice: z.uuid({ error: 'That route is not part of this set.' }).nullable(),
    comment: noteText('comment', 4000).optional(),
    routes: z.array(z.strictObject({ id: z.uuid(), comment: noteText('comment on a route', 1000).optional() })).max(MAX_ROUTES).default([]),
  })
  .refine((b) => b.choice !== null || !!b.comment?.trim() || b.routes.some((r) => r.comment?.trim()), {
    error: 'Choose a route, or leave a comment so the designer knows where to go next.',
    path: ['comment'],
  });

export type NewRouteSet = z.input<typeof createRouteSetBody>;
export type RouteDecision = z.input<typeof routeDecisionBody>;
