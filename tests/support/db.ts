// Direct reads of the test database, to check what an API call left behind.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import pg from 'pg';
import { inject } from 'vitest';

let pool: pg.Pool | undefined;

/** Run one query against the test cluster. */
export async function sql<T extends pg.QueryResultRow = any>(text: string, values: unknown[] = []): Promise<T[]> {
  pool ??= new pg.Pool({ connectionString: inject('databaseUrl'), max: 2 });
  return (await pool.query<T>(text, values)).rows;
}

export async function closeDb(): Promise<void> {
  await pool?.end();
  pool = undefined;
}

/** Run one statement as the throwaway cluster's superuser (the application role may not create databases). */
export async function asSuperuser(statement: string): Promise<void> {
  const url = new URL(inject('databaseUrl'));
  const password = readFileSync(join(inject('clusterDir'), 'superuser-password'), 'utf8').trim();
  const admin = new pg.Client({ host: url.hostname, port: Number(url.port), user: 'postgres', database: 'postgres', password });
  await admin.connect();
  try {
    await admin.query(statement);
  } finally {
    await admin.end();
  }
}
