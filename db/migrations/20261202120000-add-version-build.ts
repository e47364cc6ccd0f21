import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

/**
 * A version is built once by a job: `building` until every file it will ever serve is in storage, then `ready`
 * with its manifest; `failed` keeps the reason and can be retried. Versions published before this start as
 * `building`, so the worker builds them on its first start and they serve from storage like any other.
 */
export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.addColumn('guideline_versions', 'state', { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'building' });
  await qi.addColumn('guideline_versions', 'build_error', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('guideline_versions', 'build_steps', { type: DataTypes.JSONB, allowNull: false, defaultValue: [] });
  await qi.addColumn('guideline_versions', 'manifest', { type: DataTypes.JSONB, allowNull: true });
  await qi.addColumn('guideline_versions', 'built_at', { type: DataTypes.DATE, allowNull: true });
  await qi.sequelize.query(`ALTER TABLE guideline_versions ADD CONSTRAINT guideline_versions_state_check CHECK (state IN ('building', 'ready', 'failed'))`);
  // A ready version always has its manifest: the database never claims files that were not written.
  await qi.sequelize.query(`ALTER TABLE guideline_versions ADD CONSTRAINT guideline_versions_ready_manifest CHECK (state <> 'ready' OR manifest IS NOT NULL)`);
  await qi.addIndex('guideline_versions', ['brand_id', 'state', 'number'], { name: 'guideline_versions_brand_state_number' });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.removeIndex('guideline_versions', 'guideline_versions_brand_state_number');
  await qi.sequelize.query('ALTER TABLE guideline_versions DROP CONSTRAINT IF EXISTS guideline_versions_ready_manifest');
  await qi.sequelize.query('ALTER TABLE guideline_versions DROP CONSTRAINT IF EXISTS guideline_versions_state_check');
  for (const column of ['built_at', 'manifest', 'build_steps', 'build_error', 'state']) await qi.removeColumn('guideline_versions', column);
}
