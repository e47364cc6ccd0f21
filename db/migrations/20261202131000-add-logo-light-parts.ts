import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  // How the logo's light parts (under 3:1 against the ground it was drawn for) print in one colour: 'holes' or 'ink'.
  await qi.addColumn('brand_logos', 'light_parts', { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'holes' });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.removeColumn('brand_logos', 'light_parts');
}
