import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  // Whether a link also opens the reveal presentation; links made before this stay without it.
  await qi.addColumn('share_links', 'allow_presentation', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.removeColumn('share_links', 'allow_presentation');
}
