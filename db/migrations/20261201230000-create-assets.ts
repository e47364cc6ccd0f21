import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

const uuid = { type: DataTypes.UUID, allowNull: false, defaultValue: DataTypes.UUIDV4, primaryKey: true };
const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};
const brandRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' };
const userRef = { type: DataTypes.TEXT, allowNull: true, references: { model: 'user', key: 'id' }, onDelete: 'SET NULL' };

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.createTable('assets', {
    id: uuid,
    brand_id: brandRef,
    name: { type: DataTypes.STRING(160), allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false },
    format: { type: DataTypes.STRING(8), allowNull: false },
    mime: { type: DataTypes.STRING(80), allowNull: false },
    state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'draft' },
    storage_key: { type: DataTypes.STRING(200), allowNull: false },
    content_hash: { type: DataTypes.STRING(64), allowNull: false },
    byte_size: { type: DataTypes.INTEGER, allowNull: false },
    width: { type: DataTypes.DOUBLE, allowNull: true },
    height: { type: DataTypes.DOUBLE, allowNull: true },
    drawn_bounds: { type: DataTypes.JSONB, allowNull: true },
    original_filename: { type: DataTypes.STRING(255), allowNull: false },
    tags: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    description: { type: DataTypes.TEXT, allowNull: true },
    usage_notes: { type: DataTypes.TEXT, allowNull: true },
    uploaded_by_id: userRef,
    state_changed_at: { type: DataTypes.DATE, allowNull: true },
    state_changed_by_id: userRef,
    ...stamps,
  });
  await qi.addIndex('assets', ['brand_id', 'content_hash'], { unique: true });
  await qi.addIndex('assets', ['brand_id', 'state']);

  // Where each generated rendition lives, so deleting an asset can remove them too.
  await qi.createTable('asset_renditions', {
    id: uuid,
    asset_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'assets', key: 'id' }, onDelete: 'CASCADE' },
    params_key: { type: DataTypes.STRING(64), allowNull: false },
    storage_key: { type: DataTypes.STRING(200), allowNull: false },
    content_type: { type: DataTypes.STRING(80), allowNull: false },
    byte_size: { type: DataTypes.INTEGER, allowNull: false },
    ...stamps,
  });
  await qi.addIndex('asset_renditions', ['asset_id', 'params_key'], { unique: true });

  await qi.createTable('asset_downloads', {
    id: uuid,
    brand_id: brandRef,
    asset_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'assets', key: 'id' }, onDelete: 'SET NULL' },
    kind: { type: DataTypes.STRING(10), allowNull: false },
    user_id: userRef,
    // Share links arrive later; no foreign key yet.
    share_link_id: { type: DataTypes.UUID, allowNull: true },
    details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('asset_downloads', ['brand_id', 'created_at']);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  for (const table of ['asset_downloads', 'asset_renditions', 'assets']) await qi.dropTable(table);
}
