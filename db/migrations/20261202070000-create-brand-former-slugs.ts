import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

// A brand's earlier public addresses: links to /b/<old> keep working by redirecting to the current one.
export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.createTable('brand_former_slugs', {
    slug: { type: DataTypes.STRING(80), allowNull: false, primaryKey: true },
    brand_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('brand_former_slugs', ['brand_id']);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.dropTable('brand_former_slugs');
}
