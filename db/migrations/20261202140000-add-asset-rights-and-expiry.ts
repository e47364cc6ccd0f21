import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  // Usage rights (the studio's record of the licence), a credit line and the calendar day the asset stops being usable.
  await qi.addColumn('assets', 'rights', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('assets', 'credit', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('assets', 'expires_on', { type: DataTypes.DATEONLY, allowNull: true });
  await qi.addIndex('assets', ['expires_on'], { name: 'assets_expires_on' });
  // Each expiry notice once per asset and expiry date: 'ahead' (some days before) and 'due' (on the day).
  await qi.createTable('asset_expiry_notices', {
    asset_id: { type: DataTypes.UUID, allowNull: false, primaryKey: true, references: { model: 'assets', key: 'id' }, onDelete: 'CASCADE' },
    notice: { type: DataTypes.STRING(8), allowNull: false, primaryKey: true },
    expires_on: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
    recipients: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    sent_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.dropTable('asset_expiry_notices');
  await qi.removeIndex('assets', 'assets_expires_on');
  await qi.removeColumn('assets', 'expires_on');
  await qi.removeColumn('assets', 'credit');
  await qi.removeColumn('assets', 'rights');
}
