import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  // One random salt per UTC day for the visitor keys; the cleanup job deletes past days, so no key can be made again.
  await qi.createTable('insight_salts', {
    day: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
    salt: { type: DataTypes.STRING(64), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  // What published sites were read: no address and no user agent, only a salted daily key per visitor.
  await qi.createTable('site_insights', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    brand_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' },
    version_number: { type: DataTypes.INTEGER, allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false },
    path: { type: DataTypes.STRING(400), allowNull: true },
    embedded: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    share_link_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'share_links', key: 'id' }, onDelete: 'SET NULL' },
    member: { type: DataTypes.BOOLEAN, allowNull: false },
    visitor_key: { type: DataTypes.STRING(64), allowNull: false },
    day: { type: DataTypes.DATEONLY, allowNull: false },
    at: { type: DataTypes.DATE, allowNull: false },
    block_id: { type: DataTypes.STRING(64), allowNull: true },
    query: { type: DataTypes.STRING(120), allowNull: true },
    results: { type: DataTypes.INTEGER, allowNull: true },
  });
  await qi.sequelize.query(
    `ALTER TABLE site_insights ADD CONSTRAINT site_insights_kind CHECK (kind IN ('page','file','pdf','presentation','tokens','section','search')),
       ADD CONSTRAINT site_insights_visitor_key CHECK (visitor_key ~ '^[0-9a-f]{64}$')`,
  );
  await qi.addIndex('site_insights', ['brand_id', 'at'], { name: 'site_insights_brand_at' });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.dropTable('site_insights');
  await qi.dropTable('insight_salts');
}
