// A fingerprint of everything a brand holds in the database, so the role matrix can prove that a case run on the
// shared fixture left it as it was (a row marked read-only that writes, or a refused request that wrote anyway).
import { sql } from '../../support/db';

/** Logs and caches that reading writes by design: they never change what another request is answered. */
const IGNORED = new Set(['audit_events', 'asset_downloads', 'asset_renditions']);
/** Columns the build job writes in the background after publishing (a version turning ready), never a request. */
const BACKGROUND: Record<string, string[]> = { guideline_versions: ['state', 'build_steps', 'build_error', 'manifest', 'built_at'] };
const rowOf = (t: string) => ['to_jsonb(x)', ...(BACKGROUND[t] ?? []).map((c) => `'${c}'`)].join(' - ');

let query: string | undefined;

/**
 * Every table with a `brand_id`, and every table that hangs off one of those by a foreign key (board items, board
 * decisions, PDF exports), read from the catalogue so a new table is covered without a change here.
 */
async function stateQuery(): Promise<string> {
  if (query) return query;
  const owned: { table_name: string }[] = await sql(
    `SELECT table_name FROM information_schema.columns WHERE table_schema = 'public' AND column_name = 'brand_id' ORDER BY table_name`,
  );
  const ownedNames = new Set(owned.map((t) => t.table_name));
  const children: { child: string; column: string; parent: string }[] = await sql(
    `SELECT c.conrelid::regclass::text AS child, a.attname AS column, c.confrelid::regclass::text AS parent
       FROM pg_constraint c JOIN pg_attribute a ON a.attrelid = c.conrelid AND a.attnum = c.conkey[1]
      WHERE c.contype = 'f' AND array_length(c.conkey, 1) = 1 ORDER BY 1, 2`,
  );
  const parts = [`SELECT 'brands' AS t, to_jsonb(x)::text AS row FROM brands x WHERE x.id = $1`];
  for (const { table_name: t } of owned) if (!IGNORED.has(t)) parts.push(`SELECT '${t}', (${rowOf(t)})::text FROM "${t}" x WHERE x.brand_id = $1`);
  for (const { child, column, parent } of children) {
    const name = child.replace(/"/g, '');
    if (IGNORED.has(name) || ownedNames.has(name) || !ownedNames.has(parent.replace(/"/g, ''))) continue;
    parts.push(`SELECT '${name}', (${rowOf(name)})::text FROM ${child} x JOIN ${parent} p ON p.id = x."${column}" WHERE p.brand_id = $1`);
  }
  query = `SELECT t, md5(string_agg(row, E'\\n' ORDER BY row)) AS digest FROM (${parts.join(' UNION ALL ')}) s GROUP BY t ORDER BY t`;
  return query;
}

/** Per table, a digest of the brand's rows: equal before and after a request that changed nothing. */
export async function brandState(brandId: string): Promise<Record<string, string>> {
  const rows: { t: string; digest: string }[] = await sql(await stateQuery(), [brandId]);
  return Object.fromEntries(rows.map((r) => [r.t, r.digest]));
}
