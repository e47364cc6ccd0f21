// Schema set-up, in order: better-auth's own tables first (ours reference "user"), then our umzug migrations.
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { getMigrations } from 'better-auth/db/migration';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { authOptions, type AuthSettings } from '@/lib/auth/auth-options';

const here = dirname(fileURLToPath(import.meta.url));

/** Our migrations, read from db/migrations/*.ts and tracked in the "plumbline_migrations" table. */
export function migrator(sequelize: Sequelize): Umzug<QueryInterface> {
  return new Umzug<QueryInterface>({
    migrations: {
      glob: ['migrations/*.ts', { cwd: here }],
      resolve: ({ name, path, context }) => {
        const load = () => import(pathToFileURL(path ?? join(here, 'migrations', name)).href);
        return {
          name,
          up: async () => (await load()).up({ name, path, context }),
          down: async () => (await load()).down({ name, path, context }),
        };
      },
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'plumbline_migrations' }),
    logger: undefined,
  });
}

/** Bring the database up to date: better-auth tables, then every pending migration of ours. */
export async function migrateAll(sequelize: Sequelize, auth: AuthSettings): Promise<string[]> {
  const options = authOptions(auth);
  const { runMigrations } = await getMigrations(options);
  await runMigrations();
  await (options.database as { end?: () => Promise<void> }).end?.();
  const done = await migrator(sequelize).up();
  return done.map((m) => m.name);
}
