// Palette routes: two to four candidate palettes sent to a client contact by link; the chosen one becomes the palette.
import type { z } from 'zod';
import { Brand, BrandColor, PaletteRoute, PaletteRouteSet, type RouteColor } from '@db/models';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { parseColor } from '@/lib/color';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import type { ColorRole } from '@/lib/identity/types';
import { peopleById } from '@/lib/invitations/people.server';
import { hashToken, longDate, newToken } from '@/lib/invitations/tokens';
import { sendTemplate, siteLink, type MailOutcome } from '@/lib/mail/mail.server';
import { storedHex } from '@/lib/safe/values';
import { routeContrast } from './contrast';
import { matchRows } from './replace';
import type { createRouteSetBody, routeDecisionBody, routeSchema, sendRoutesBody, updateRouteSetBody } from './schemas';
import type { PublicRouteSet, RouteSetView, RouteView } from './views';

export type { PublicRouteSet, RouteSetView, RouteView } from './views';

/** How long a sent link works, in days (as the mood boards). */
export const ROUTE_LINK_DAYS = 30;

const routeView = (r: PaletteRoute): RouteView => {
  const colors = r.colors.map((c, i) => ({ id: `${r.id}:${i}`, name: c.name, value: c.value, hex: storedHex(c.hex, '#000000'), role: c.role }));
  return { id: r.id, position: r.position, name: r.name, rationale: r.rationale, colors, contrast: routeContrast(colors), clientComment: r.clientComment };
};

async function views(sets: PaletteRouteSet[]): Promise<RouteSetView[]> {
  if (!sets.length) return [];
  const [routes, people] = await Promise.all([
    PaletteRoute.findAll({ where: { setId: sets.map((s) => s.id) }, order: [['position', 'ASC']] }),
    peopleById(sets.map((s) => s.createdById)),
  ]);
  return sets.map((s) => ({
    id: s.id,
    title: s.title,
    intro: s.intro,
    status: s.status,
    contactName: s.contactName,
    contactEmail: s.contactEmail,
    sentAt: s.sentAt?.toISOString() ?? null,
    expiresAt: s.expiresAt?.toISOString() ?? null,
    appliedAt: s.appliedAt?.toISOString() ?? null,
    createdBy: people.get(s.createdById ?? '')?.name ?? null,
    routes: routes.filter((r) => r.setId === s.id).map(routeView),
    decision: s.decidedAt ? { by: s.decidedByName ?? '', at: s.decidedAt.toISOString(), chosenRouteId: s.chosenRouteId, comment: s.decisionComment } : null,
  }));
}

/** The brand's sets of routes, newest first. */
export async function listRouteSets(brand: Brand): Promise<RouteSetView[]> {
  return views(await PaletteRouteSet.findAll({ where: { brandId: brand.id }, order: [['createdAt', 'DESC']] }));
}

async function setOf(brand: Brand, setId: string): Promise<PaletteRouteSet> {
  const set = await PaletteRouteSet.findOne({ where: { id: setId, brandId: brand.id } });
  if (!set) throw new ApiError(404, 'not_found', 'That set of palette routes was not found on this brand.');
  return set;
}

export async function routeSetView(brand: Brand, setId: string): Promise<RouteSetView> {
  return (await views([await setOf(brand, setId)]))[0];
}

const auditOf = (caller: Caller | null, brand: Brand, action: string, targetId: string, details: Record<string, unknown> = {}) =>
  ({ actorId: caller?.id ?? null, action, targetType: 'paletteRoutes', targetId, brandId: brand.id, studioId: brand.studioId, details });

/** Stored colours of a route: each value parsed once more by the one colour parser, which gives the hex we keep. */
function routeColors(route: z.output<typeof routeSchema>): RouteColor[] {
  return route.colors.map((c, i) => {
    const parsed = parseColor(c.value);
    if (!parsed.ok) throw new ApiError(400, 'invalid_color', parsed.error.message, { path: `colors.${i}.value` });
    return { name: c.name, value: c.value, hex: parsed.color.hex, role: c.role ?? null };
  });
}

function refuseChosen(set: PaletteRouteSet) {
  if (set.status === 'chosen') throw new ApiError(409, 'route_chosen', 'The client has chosen a route from this set; start a new set for further ideas.');
}

/** Prepare a set of two to four routes. */
export async function createRouteSet(caller: Caller, brand: Brand, body: z.output<typeof createRouteSetBody>): Promise<RouteSetView> {
  const colors = body.routes.map(routeColors);
  const set = await sequelize.transaction(async (t) => {
    const row = await PaletteRouteSet.create(
      { brandId: brand.id, title: body.title, intro: body.intro ?? '', contactName: null, contactEmail: null, tokenHash: null, expiresAt: null, sentAt: null, createdById: caller.id, chosenRouteId: null, decidedByName: null, decidedAt: null, appliedAt: null },
      { transaction: t },
    );
    await PaletteRoute.bulkCreate(body.routes.map((r, i) => ({ setId: row.id, position: i, name: r.name, rationale: r.rationale ?? '', colors: colors[i], clientComment: null })), { transaction: t });
    await audit(auditOf(caller, brand, 'paletteRoutes.create', row.id, { title: body.title, routes: body.routes.map((r) => r.name) }), t);
    return row;
  });
  return routeSetView(brand, set.id);
}

/** Change the title, introduction or the routes (the routes are replaced as a whole); not once a route is chosen. */
export async function updateRouteSet(caller: Caller, brand: Brand, setId: string, body: z.output<typeof updateRouteSetBody>): Promise<RouteSetView> {
  const set = await setOf(brand, setId);
  refuseChosen(set);
  const colors = body.routes?.map(routeColors);
  await sequelize.transaction(async (t) => {
    await set.update({ ...(body.title !== undefined ? { title: body.title } : {}), ...(body.intro !== undefined ? { intro: body.intro } : {}) }, { transaction: t });
    if (body.routes) {
      // Routes are changed in place by position, so a client's note on a route stays with it.
      const existing = await PaletteRoute.findAll({ where: { setId: set.id }, order: [['position', 'ASC']], transaction: t });
      for (const [i, r] of body.routes.entries()) {
        const fields = { position: i, name: r.name, rationale: r.rationale ?? '', colors: colors![i] };
        if (existing[i]) await existing[i].update(fields, { transaction: t });
        else await PaletteRoute.create({ ...fields, setId: set.id, clientComment: null }, { transaction: t });
      }
      for (const extra of existing.slice(body.routes.length)) await extra.destroy({ transaction: t });
    }
    await audit(auditOf(caller, brand, 'paletteRoutes.update', set.id, { title: body.title, routes: body.routes?.map((r) => r.name) }), t);
  });
  return routeSetView(brand, set.id);
}

export async function deleteRouteSet(caller: Caller, brand: Brand, setId: string): Promise<void> {
  const set = await setOf(brand, setId);
  await sequelize.transaction(async (t) => {
    await audit(auditOf(caller, brand, 'paletteRoutes.delete', set.id, { title: set.title }), t);
    await set.destroy({ transaction: t });
  });
}

/**
 * E-mail the routes to a client contact; a new link replaces any earlier one and reopens a set sent back with comments
 * (the earlier answer stays in the audit trail and the designer's mail; notes on routes stay on the routes).
 */
export async function sendRouteSet(caller: Caller, brand: Brand, setId: string, body: z.output<typeof sendRoutesBody>): Promise<{ set: RouteSetView; mail: MailOutcome }> {
  const set = await setOf(brand, setId);
  refuseChosen(set);
  const routes = await PaletteRoute.findAll({ where: { setId: set.id }, order: [['position', 'ASC']] });
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + ROUTE_LINK_DAYS * 86_400_000);
  await sequelize.transaction(async (t) => {
    await set.update({ status: 'sent', contactName: body.contactName, contactEmail: body.contactEmail, tokenHash: hash, expiresAt, sentAt: new Date(), decidedAt: null, decidedByName: null, decisionComment: '', chosenRouteId: null }, { transaction: t });
    await audit(auditOf(caller, brand, 'paletteRoutes.send', set.id, { contactEmail: body.contactEmail }), t);
  });
  const mail = await sendTemplate(
    body.contactEmail,
    'palette-routes-request',
    {
      contactName: body.contactName,
      senderName: caller.name || caller.email,
      setTitle: set.title,
      brandName: brand.name,
      routeCount: routes.length,
      routeNames: routes.map((r) => r.name),
      message: body.message ?? '',
      expiresOn: longDate(expiresAt),
      link: siteLink(`/palette/${token}`),
    },
    brand.id,
  );
  return { set: await routeSetView(brand, set.id), mail };
}

// ---------------------------------------------------------------- the client's side, by token

async function setByToken(token: string): Promise<{ set: PaletteRouteSet; brand: Brand }> {
  const set = await PaletteRouteSet.findOne({ where: { tokenHash: hashToken(token) } });
  if (!set) throw new ApiError(404, 'not_found', 'This palette link is not valid. Check that the whole link was copied from the e-mail, or ask your designer for the newest one.');
  if (!set.decidedAt && set.expiresAt && set.expiresAt.getTime() <= Date.now()) {
    throw new ApiError(410, 'routes_expired', `This palette link has expired (links work for ${ROUTE_LINK_DAYS} days). Ask your designer to send it again.`);
  }
  return { set, brand: (await Brand.findByPk(set.brandId))! };
}

export async function openRouteSet(token: string): Promise<PublicRouteSet> {
  const { set, brand } = await setByToken(token);
  const [v] = await views([set]);
  return { brandName: brand.name, title: v.title, intro: v.intro, status: v.status, contactName: v.contactName, expiresAt: v.expiresAt, routes: v.routes, decision: v.decision };
}

/**
 * Record the client's answer once: a chosen route (the set is closed) or comments only (the designer revises and
 * sends again, which makes a new link). A second answer on the same link is refused with 409.
 */
export async function decideRouteSet(token: string, input: z.output<typeof routeDecisionBody>): Promise<PublicRouteSet> {
  const { set, brand } = await setByToken(token);
  if (set.status !== 'sent') throw new ApiError(409, 'already_decided', 'An answer was already recorded on this link. Your designer will be in touch; they can send a new link if more is needed.');
  const routes = await PaletteRoute.findAll({ where: { setId: set.id }, order: [['position', 'ASC']] });
  const known = new Map(routes.map((r) => [r.id, r]));
  const unknown = [input.choice, ...input.routes.map((r) => r.id)].filter((id): id is string => !!id && !known.has(id));
  if (unknown.length) throw new ApiError(400, 'unknown_route', 'The routes changed while you were looking. Reload the page to see the current ones.', unknown.map((id) => ({ path: id, message: 'not in this set' })));
  const comments = input.routes.map((r) => ({ id: r.id, comment: r.comment?.trim() ?? '' })).filter((r) => r.comment);
  const chosen = input.choice ? known.get(input.choice)! : null;
  const decided = await sequelize.transaction(async (t) => {
    // Only one answer wins even when two arrive together: the update is conditional on the set still waiting.
    const [changed] = await PaletteRouteSet.update(
      { status: chosen ? 'chosen' : 'comments', chosenRouteId: chosen?.id ?? null, decidedByName: input.name, decisionComment: input.comment?.trim() ?? '', decidedAt: new Date() },
      { where: { id: set.id, status: 'sent' }, transaction: t },
    );
    if (!changed) return false;
    for (const c of comments) await PaletteRoute.update({ clientComment: c.comment }, { where: { id: c.id }, transaction: t });
    await audit(auditOf(null, brand, 'paletteRoutes.decide', set.id, { chosenRouteId: chosen?.id ?? null, chosenRoute: chosen?.name ?? null, by: input.name, email: set.contactEmail, comment: input.comment?.trim() ?? '', routeComments: comments.map((c) => ({ route: known.get(c.id)!.name, comment: c.comment })) }), t);
    return true;
  });
  if (!decided) throw new ApiError(409, 'already_decided', 'An answer was already recorded on this link. Your designer will be in touch; they can send a new link if more is needed.');
  const creator = (await peopleById([set.createdById])).get(set.createdById ?? '');
  if (creator) {
    await sendTemplate(
      creator.email,
      'palette-routes-decision',
      {
        contactName: input.name,
        setTitle: set.title,
        brandName: brand.name,
        chosenName: chosen?.name ?? '',
        comment: input.comment?.trim() ?? '',
        routeComments: comments.map((c) => `${known.get(c.id)!.name}: ${c.comment}`),
        link: siteLink(`/app/brands/${brand.id}/client#routes-${set.id}`),
      },
      brand.id,
    );
  }
  return openRouteSet(token);
}

// ---------------------------------------------------------------- "use this route"

/** A stored colour as the audit keeps it, so the palette before a replacement can be typed back in. */
const snapshot = (c: BrandColor) => ({ id: c.id, name: c.name, value: c.value, hex: c.hex, role: c.role, cmykOverride: c.cmykOverride, spot: c.spot, position: c.position });

/**
 * Replace the brand's colours with the chosen route's, in one transaction: nothing changes unless everything does.
 * The audit row keeps the previous palette in full, so it can be restored by hand.
 */
export async function adoptChosenRoute(caller: Caller, brand: Brand, setId: string): Promise<RouteSetView> {
  const set = await setOf(brand, setId);
  if (set.status !== 'chosen' || !set.chosenRouteId) throw new ApiError(409, 'no_route_chosen', 'The client has not chosen a route from this set yet.');
  const route = await PaletteRoute.findOne({ where: { id: set.chosenRouteId, setId: set.id } });
  if (!route) throw new ApiError(409, 'no_route_chosen', 'The chosen route is no longer in this set.');
  await sequelize.transaction(async (t) => {
    const before = await BrandColor.findAll({ where: { brandId: brand.id }, order: [['position', 'ASC']], transaction: t, lock: t.LOCK.UPDATE });
    const previous = before.map(snapshot);
    const rows = matchRows(before, route.colors);
    const kept = new Set(rows.filter((r): r is BrandColor => !!r).map((r) => r.id));
    for (const old of before) if (!kept.has(old.id)) await old.destroy({ transaction: t });
    for (const [i, c] of route.colors.entries()) {
      const fields = { name: c.name, value: c.value, hex: c.hex, role: (c.role as ColorRole | null) ?? null, cmykOverride: null, spot: null, position: i };
      const row = rows[i];
      if (row) await row.update(fields, { transaction: t });
      else await BrandColor.create({ brandId: brand.id, ...fields }, { transaction: t });
    }
    await set.update({ appliedAt: new Date() }, { transaction: t });
    await audit(
      auditOf(caller, brand, 'palette.replace', set.id, { routeId: route.id, route: route.name, before: previous, after: route.colors }),
      t,
    );
  });
  return routeSetView(brand, set.id);
}
