import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  // A pattern tile on the shelf keeps the settings it was drawn from, so it can be drawn again (null for uploads).
  await qi.addColumn('assets', 'pattern_settings', { type: DataTypes.JSONB, allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.removeColumn('assets', 'pattern_settings');
}
