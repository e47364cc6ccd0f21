import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

const uuid = { type: DataTypes.UUID, allowNull: false, defaultValue: DataTypes.UUIDV4, primaryKey: true };
const brandRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' };
const userRef = { type: DataTypes.TEXT, allowNull: true, references: { model: 'user', key: 'id' }, onDelete: 'SET NULL' };

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  // An immutable snapshot of the draft and the identity; its files are copied so later edits cannot reach it.
  await qi.createTable('guideline_versions', {
    id: uuid,
    brand_id: brandRef,
    number: { type: DataTypes.INTEGER, allowNull: false },
    note: { type: DataTypes.STRING(2000), allowNull: false },
    draft_revision: { type: DataTypes.INTEGER, allowNull: false },
    snapshot: { type: DataTypes.JSONB, allowNull: false },
    files: { type: DataTypes.JSONB, allowNull: false },
    published_by_id: userRef,
    published_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('guideline_versions', ['brand_id', 'number'], { unique: true });

  await qi.createTable('share_links', {
    id: uuid,
    brand_id: brandRef,
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    label: { type: DataTypes.STRING(120), allowNull: true },
    version_number: { type: DataTypes.INTEGER, allowNull: true },
    allow_downloads: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    password_hash: { type: DataTypes.STRING(200), allowNull: true },
    expires_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    last_used_at: { type: DataTypes.DATE, allowNull: true },
    use_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_by_id: userRef,
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('share_links', ['brand_id']);

  // Counters for our own rate limits (share-link passwords): one row per key and window.
  await qi.createTable('rate_counters', {
    key: { type: DataTypes.STRING(200), primaryKey: true },
    count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    window_start: { type: DataTypes.DATE, allowNull: false },
  });

  await qi.createTable('pdf_exports', {
    id: uuid,
    version_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'guideline_versions', key: 'id' }, onDelete: 'CASCADE' },
    size: { type: DataTypes.STRING(10), allowNull: false },
    state: { type: DataTypes.STRING(12), allowNull: false },
    progress: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    storage_key: { type: DataTypes.STRING(200), allowNull: true },
    error: { type: DataTypes.STRING(500), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('pdf_exports', ['version_id', 'size'], { unique: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  for (const table of ['pdf_exports', 'rate_counters', 'share_links', 'guideline_versions']) await qi.dropTable(table);
}
