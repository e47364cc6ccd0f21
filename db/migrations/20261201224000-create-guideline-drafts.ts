import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  // One working draft per brand; the revision number is the optimistic lock for every save.
  await qi.createTable('guideline_drafts', {
    brand_id: { type: DataTypes.UUID, primaryKey: true, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' },
    revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    doc: { type: DataTypes.JSONB, allowNull: false },
    updated_by_id: { type: DataTypes.TEXT, allowNull: true, references: { model: 'user', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.dropTable('guideline_drafts');
}
