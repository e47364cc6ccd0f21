// Names and addresses of signed-up people, read from better-auth's "user" table (never through a model).
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/lib/db.server';

export interface Person {
  id: string;
  name: string;
  email: string;
}

/** The people with these ids, by id. */
export async function peopleById(ids: (string | null | undefined)[]): Promise<Map<string, Person>> {
  const wanted = [...new Set(ids.filter((x): x is string => !!x))];
  if (!wanted.length) return new Map();
  const rows = await sequelize.query<Person>('SELECT id, name, email FROM "user" WHERE id IN (:ids)', { replacements: { ids: wanted }, type: QueryTypes.SELECT });
  return new Map(rows.map((r) => [r.id, r]));
}

/** Members of a brand holding one of `roles`, with name and address. */
export async function membersWithRoles(brandId: string, roles: string[]): Promise<(Person & { role: string })[]> {
  return sequelize.query<Person & { role: string }>(
    `SELECT u.id, u.name, u.email, m.role FROM brand_members m JOIN "user" u ON u.id = m.user_id
      WHERE m.brand_id = :brandId AND m.role::text IN (:roles) ORDER BY u.name`,
    { replacements: { brandId, roles }, type: QueryTypes.SELECT },
  );
}
