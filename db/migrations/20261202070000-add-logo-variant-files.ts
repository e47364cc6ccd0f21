import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  // The designer's own one-colour and dark-ground files per logo, by slot: { "white": { key, format, byteSize } }.
  await qi.addColumn('brand_logos', 'variant_files', { type: DataTypes.JSONB, allowNull: false, defaultValue: {} });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.removeColumn('brand_logos', 'variant_files');
}
