import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  // A photograph's words and focus: alt text (needed before approval), a caption, and the focal point as fractions 0–1.
  await qi.addColumn('assets', 'alt_text', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('assets', 'caption', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('assets', 'focus_x', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('assets', 'focus_y', { type: DataTypes.DOUBLE, allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  for (const column of ['focus_y', 'focus_x', 'caption', 'alt_text']) await qi.removeColumn('assets', column);
}
