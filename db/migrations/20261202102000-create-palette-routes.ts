import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

// Palette routes: two to four candidate palettes sent to the client together by one link; one may be chosen.
export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  const stamps = {
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  };
  await qi.createTable('palette_route_sets', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    brand_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' },
    title: { type: DataTypes.STRING(160), allowNull: false },
    intro: { type: DataTypes.STRING(2000), allowNull: false, defaultValue: '' },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'draft' },
    contact_name: { type: DataTypes.STRING(120), allowNull: true },
    contact_email: { type: DataTypes.STRING(320), allowNull: true },
    token_hash: { type: DataTypes.STRING(64), allowNull: true, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    created_by_id: { type: DataTypes.TEXT, allowNull: true, references: { model: 'user', key: 'id' }, onDelete: 'SET NULL' },
    chosen_route_id: { type: DataTypes.UUID, allowNull: true },
    decided_by_name: { type: DataTypes.STRING(120), allowNull: true },
    decision_comment: { type: DataTypes.STRING(4000), allowNull: false, defaultValue: '' },
    decided_at: { type: DataTypes.DATE, allowNull: true },
    applied_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('palette_route_sets', ['brand_id', 'created_at']);
  await qi.createTable('palette_routes', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    set_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'palette_route_sets', key: 'id' }, onDelete: 'CASCADE' },
    position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    name: { type: DataTypes.STRING(80), allowNull: false },
    rationale: { type: DataTypes.STRING(600), allowNull: false, defaultValue: '' },
    colors: { type: DataTypes.JSONB, allowNull: false },
    client_comment: { type: DataTypes.STRING(1000), allowNull: true },
    ...stamps,
  });
  await qi.addIndex('palette_routes', ['set_id', 'position']);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.dropTable('palette_routes');
  await qi.dropTable('palette_route_sets');
}
