import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

const uuid = { type: DataTypes.UUID, allowNull: false, defaultValue: DataTypes.UUIDV4, primaryKey: true };
const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};
const brandRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' };

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.createTable('brand_colors', {
    id: uuid,
    brand_id: brandRef,
    name: { type: DataTypes.STRING(80), allowNull: false },
    value: { type: DataTypes.STRING(200), allowNull: false },
    hex: { type: DataTypes.STRING(9), allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: true },
    cmyk_override: { type: DataTypes.JSONB, allowNull: true },
    spot: { type: DataTypes.STRING(120), allowNull: true },
    position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...stamps,
  });
  await qi.addIndex('brand_colors', ['brand_id', 'position']);

  await qi.createTable('brand_logos', {
    id: uuid,
    brand_id: brandRef,
    name: { type: DataTypes.STRING(120), allowNull: false },
    variant: { type: DataTypes.STRING(20), allowNull: false },
    format: { type: DataTypes.STRING(8), allowNull: false },
    storage_key: { type: DataTypes.STRING(200), allowNull: false },
    content_hash: { type: DataTypes.STRING(64), allowNull: false },
    byte_size: { type: DataTypes.INTEGER, allowNull: false },
    canvas: { type: DataTypes.JSONB, allowNull: false },
    bounds: { type: DataTypes.JSONB, allowNull: false },
    clear_space_unit: { type: DataTypes.DOUBLE, allowNull: false },
    clear_space_label: { type: DataTypes.STRING(120), allowNull: false },
    clear_space_multiple: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 },
    thinnest_stroke: { type: DataTypes.DOUBLE, allowNull: false },
    min_screen_px: { type: DataTypes.INTEGER, allowNull: true },
    min_print_mm: { type: DataTypes.DOUBLE, allowNull: true },
    position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...stamps,
  });
  await qi.addIndex('brand_logos', ['brand_id', 'position']);

  await qi.createTable('brand_typefaces', {
    id: uuid,
    brand_id: brandRef,
    role: { type: DataTypes.STRING(20), allowNull: false },
    family: { type: DataTypes.STRING(120), allowNull: false },
    source: { type: DataTypes.STRING(10), allowNull: false },
    shipped_key: { type: DataTypes.STRING(60), allowNull: true },
    storage_key: { type: DataTypes.STRING(200), allowNull: true },
    format: { type: DataTypes.STRING(8), allowNull: false },
    metrics: { type: DataTypes.JSONB, allowNull: false },
    fallback: { type: DataTypes.JSONB, allowNull: false },
    weights: { type: DataTypes.JSONB, allowNull: false },
    licence_confirmed_at: { type: DataTypes.DATE, allowNull: true },
    licence_confirmed_by_id: { type: DataTypes.TEXT, allowNull: true, references: { model: 'user', key: 'id' }, onDelete: 'SET NULL' },
    licence_note: { type: DataTypes.STRING(500), allowNull: true },
    ...stamps,
  });
  await qi.addIndex('brand_typefaces', ['brand_id', 'role']);

  await qi.addColumn('brands', 'type_scale', { type: DataTypes.JSONB, allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.removeColumn('brands', 'type_scale');
  for (const table of ['brand_typefaces', 'brand_logos', 'brand_colors']) await qi.dropTable(table);
}
