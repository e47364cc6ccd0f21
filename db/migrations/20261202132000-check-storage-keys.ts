import type { QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

/**
 * What the database holds for a stored file is an object key (`<brand id>/<kind>/<uuid>.<ext>`, or a built file's
 * `<brand id>/build/<version id>/<sha256>.<ext>`), never a path on one machine: a key names the same object on local
 * disk and in an S3-compatible store. The same shape as SAFE_KEY in src/lib/storage/storage.ts, written out here so
 * the migration never changes after it ran. NOT VALID: new and changed rows are checked; rows written before stay.
 */
const KEY = '^[0-9a-f-]{36}/([a-z-]+/[0-9a-f-]{36}|build/[0-9a-f-]{36}/[0-9a-f]{64})([.][a-z0-9]{1,8})?$';

const COLUMNS: [table: string, column: string][] = [
  ['assets', 'storage_key'],
  ['asset_renditions', 'storage_key'],
  ['brand_logos', 'storage_key'],
  ['brand_typefaces', 'storage_key'],
  ['mood_board_items', 'storage_key'],
  ['pdf_exports', 'storage_key'],
];

/** JSONB columns that hold keys inside: every `key` the path reaches must be one. */
const JSON_KEYS: [table: string, column: string, path: string][] = [
  ['brand_logos', 'variant_files', '$.*.key'],
  ['guideline_versions', 'files', '$.*.key'],
  ['guideline_versions', 'manifest', '$.entries.*.key'],
];

const name = (table: string, column: string) => `${table}_${column}_is_object_key`;

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  for (const [table, column] of COLUMNS) {
    await qi.sequelize.query(`ALTER TABLE ${table} ADD CONSTRAINT ${name(table, column)} CHECK (${column} ~ '${KEY}') NOT VALID`);
  }
  for (const [table, column, path] of JSON_KEYS) {
    const jsonPath = `${path} ? (!(@ like_regex "${KEY}"))`;
    await qi.sequelize.query(`ALTER TABLE ${table} ADD CONSTRAINT ${name(table, column)} CHECK (NOT jsonb_path_exists(${column}, '${jsonPath}')) NOT VALID`);
  }
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  for (const [table, column] of [...COLUMNS, ...JSON_KEYS]) await qi.sequelize.query(`ALTER TABLE ${table} DROP CONSTRAINT IF EXISTS ${name(table, column)}`);
}
