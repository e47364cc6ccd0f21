// Direct reads of the test database, to check what an API call left behind.
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
