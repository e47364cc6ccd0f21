// The demo's palette routes: two candidate palettes offered to the client, the one she chose, and that route in use.
// Added once; running again leaves them alone.
import { randomBytes, createHash } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { AuditEvent, Brand, BrandColor, PaletteRoute, PaletteRouteSet, type RouteColor } from '@db/models';

/** A stored hash of a token nobody holds: seeded links are records, not working links. */
const unusedHash = () => createHash('sha256').update(randomBytes(32)).digest('hex');
const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000);
const color = (name: string, hex: string, role: string | null): RouteColor => ({ name, value: hex, hex, role });

// Invented for the demo; the chosen route is the palette the demo identity carries.
const ROASTERY = [
  color('Roast', '#4a2c21', 'primary'),
  color('Crema', '#e9d8b8', 'secondary'),
  color('Larch green', '#2f5d50', 'accent'),
  color('Ember', '#c8553d', 'accent'),
  color('Steam', '#f6f3ee', 'background'),
  color('Char', '#1b1714', 'text'),
];
const VALLEY = [
  color('Reservoir', '#2d4a63', 'primary'),
  color('Oat', '#efe6d2', 'secondary'),
  color('Moss', '#6b7f3a', 'accent'),
  color('Kiln', '#b8643f', 'accent'),
  color('Morning mist', '#f4f5f2', 'background'),
  color('Slate ink', '#1c2126', 'text'),
];

export async function seedPaletteRoutes(sequelize: Sequelize, people: { designer: string }): Promise<void> {
  const brand = await Brand.findOne({ where: { slug: 'larchmere-coffee' } });
  if (!brand) return;
  await sequelize.transaction(async (transaction) => {
    if (await PaletteRouteSet.count({ where: { brandId: brand.id }, transaction })) return;
    const log = (action: string, targetId: string, actorId: string | null, details: Record<string, unknown>) =>
      AuditEvent.create({ action, targetType: 'paletteRoutes', targetId, actorId, brandId: brand.id, studioId: brand.studioId, details }, { transaction });
    const set = await PaletteRouteSet.create(
      {
        brandId: brand.id,
        title: 'Two ways to colour the roastery',
        intro: 'Both routes grow out of the approved mood board. One stays close to the roasting room, the other looks out over the valley.',
        status: 'chosen',
        contactName: 'Priya Raman',
        contactEmail: 'priya@larchmere.example',
        tokenHash: unusedHash(),
        expiresAt: daysAgo(-24),
        sentAt: daysAgo(6),
        createdById: people.designer,
        chosenRouteId: null,
        decidedByName: 'Priya Raman',
        decisionComment: 'The roastery route feels like us. The valley blues are lovely but read as a bank.',
        decidedAt: daysAgo(5),
        appliedAt: daysAgo(5),
      },
      { transaction },
    );
    const [roastery, valley] = await PaletteRoute.bulkCreate(
      [
        { setId: set.id, position: 0, name: 'Roastery warmth', rationale: 'Roast brown and crema carry the bags and the shop; larch green and ember are for accents and offers. Char on steam for reading.', colors: ROASTERY, clientComment: 'Yes: this is the smell of the shop.' },
        { setId: set.id, position: 1, name: 'Valley morning', rationale: 'A cooler route: reservoir blue and oat for a calmer, more wholesale-facing brand, with moss and kiln as accents.', colors: VALLEY, clientComment: null },
      ],
      { transaction },
    );
    await set.update({ chosenRouteId: roastery.id }, { transaction });
    const palette = await BrandColor.findAll({ where: { brandId: brand.id }, order: [['position', 'ASC']], transaction });
    await log('paletteRoutes.create', set.id, people.designer, { title: set.title, routes: [roastery.name, valley.name] });
    await log('paletteRoutes.send', set.id, people.designer, { contactEmail: 'priya@larchmere.example' });
    await log('paletteRoutes.decide', set.id, null, { chosenRouteId: roastery.id, chosenRoute: roastery.name, by: 'Priya Raman', email: 'priya@larchmere.example', comment: set.decisionComment, routeComments: [{ route: roastery.name, comment: roastery.clientComment }] });
    await log('palette.replace', set.id, people.designer, { routeId: roastery.id, route: roastery.name, before: palette.map((c) => ({ id: c.id, name: c.name, value: c.value, hex: c.hex, role: c.role })), after: ROASTERY });
    await sequelize.query(`UPDATE palette_route_sets SET created_at = now() - interval '7 days' WHERE id = :id`, { replacements: { id: set.id }, transaction });
  });
}
