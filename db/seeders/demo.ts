// The demo: an invented studio, two invented client brands, and one person per role. Safe to run again.
import { betterAuth } from 'better-auth';
import { QueryTypes, type Sequelize } from 'sequelize';
import { authOptions, type AuthSettings } from '@/lib/auth/auth-options';
import type { BrandRole } from '@/lib/auth/roles';
import type { FileStorage } from '@/lib/storage/storage';
import { Brand, BrandMember, Studio, StudioMember } from '@db/models';
import { seedIdentity } from './identity';
import { seedCollaboration } from './collaboration';
import { seedPaletteRoutes } from './palette-routes';
import { seedInsights } from './insights';

export const DEMO_PASSWORD = 'plumbline-demo';

export const DEMO_STUDIO = 'Tidewater Studio';

export const DEMO_PEOPLE = [
  { key: 'designer', name: 'Mara Quinn', email: 'mara@tidewater.example', studioRole: 'admin', says: 'designer, studio lead (owner)' },
  { key: 'editor', name: 'Jonah Adeyemi', email: 'jonah@tidewater.example', studioRole: 'member', says: 'studio designer (editor)' },
  { key: 'reviewer', name: 'Priya Raman', email: 'priya@larchmere.example', studioRole: null, says: 'client decision maker (reviewer)' },
  { key: 'partner', name: 'Sam Okafor', email: 'sam@inkwellprint.example', studioRole: null, says: 'print partner (partner)' },
  { key: 'viewer', name: 'Lee Marsh', email: 'lee@larchmere.example', studioRole: null, says: "client's wider team (viewer)" },
] as const;

export const DEMO_BRANDS: { name: string; slug: string; roles: Partial<Record<(typeof DEMO_PEOPLE)[number]['key'], BrandRole>> }[] = [
  {
    name: 'Larchmere Coffee Roasters',
    slug: 'larchmere-coffee',
    roles: { designer: 'owner', editor: 'editor', reviewer: 'reviewer', partner: 'partner', viewer: 'viewer' },
  },
  { name: 'Pellow Street Library', slug: 'pellow-street-library', roles: { designer: 'owner', editor: 'editor' } },
];

/** Create the demo people, studio, brands and memberships that are missing; leave existing ones alone. */
/** `files`: the store the demo's files go to (a folder name means local disk there). */
export async function seedDemo(sequelize: Sequelize, settings: AuthSettings, files: FileStorage | string): Promise<{ created: boolean }> {
  const options = authOptions(settings);
  const auth = betterAuth(options);
  const ids: Record<string, string> = {};
  let created = false;
  try {
    for (const person of DEMO_PEOPLE) {
      const [row] = await sequelize.query<{ id: string }>('SELECT id FROM "user" WHERE email = :email', {
        replacements: { email: person.email },
        type: QueryTypes.SELECT,
      });
      if (row) {
        ids[person.key] = row.id;
        continue;
      }
      const result = await auth.api.signUpEmail({ body: { email: person.email, password: DEMO_PASSWORD, name: person.name } });
      ids[person.key] = result.user.id;
      created = true;
    }
  } finally {
    await (options.database as { end?: () => Promise<void> }).end?.();
  }
  // The demo people's addresses are invented and reserved (RFC 2606): nobody could open a link sent there.
  await sequelize.query('UPDATE "user" SET "emailVerified" = true WHERE email IN (:emails) AND NOT "emailVerified"', {
    replacements: { emails: DEMO_PEOPLE.map((p) => p.email) },
  });

  await sequelize.transaction(async (transaction) => {
    const [studio] = await Studio.findOrCreate({ where: { name: DEMO_STUDIO }, transaction });
    for (const person of DEMO_PEOPLE) {
      if (!person.studioRole) continue;
      await StudioMember.findOrCreate({
        where: { studioId: studio.id, userId: ids[person.key] },
        defaults: { studioId: studio.id, userId: ids[person.key], role: person.studioRole },
        transaction,
      });
    }
    for (const spec of DEMO_BRANDS) {
      const [brand, made] = await Brand.findOrCreate({
        where: { slug: spec.slug },
        defaults: { studioId: studio.id, name: spec.name, slug: spec.slug, createdById: ids.designer },
        transaction,
      });
      created ||= made;
      for (const [key, role] of Object.entries(spec.roles)) {
        await BrandMember.findOrCreate({
          where: { brandId: brand.id, userId: ids[key] },
          defaults: { brandId: brand.id, userId: ids[key], role },
          transaction,
        });
      }
      await seedIdentity(brand, files, transaction);
    }
  });
  await seedCollaboration(sequelize, { designer: ids.designer, editor: ids.editor, reviewer: ids.reviewer });
  await seedPaletteRoutes(sequelize, { designer: ids.designer });
  await seedInsights(sequelize, DEMO_BRANDS[0].slug);
  return { created };
}
