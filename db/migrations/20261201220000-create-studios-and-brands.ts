import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

const uuid = { type: DataTypes.UUID, allowNull: false, defaultValue: DataTypes.UUIDV4, primaryKey: true };
const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};
const userRef = (onDelete: 'CASCADE' | 'SET NULL', allowNull: boolean) => ({
  type: DataTypes.TEXT,
  allowNull,
  references: { model: 'user', key: 'id' },
  onDelete,
});
const brandRoles = ['owner', 'editor', 'reviewer', 'partner', 'viewer'];

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.createTable('studios', { id: uuid, name: { type: DataTypes.STRING(120), allowNull: false }, ...stamps });
  await qi.createTable('studio_members', {
    id: uuid,
    studio_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
    user_id: userRef('CASCADE', false),
    role: { type: DataTypes.ENUM('admin', 'member'), allowNull: false },
    ...stamps,
  });
  await qi.addIndex('studio_members', ['studio_id', 'user_id'], { unique: true });
  await qi.addIndex('studio_members', ['user_id']);

  await qi.createTable('brands', {
    id: uuid,
    studio_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    // Public slug, unique across all studios: it names the brand's guideline site.
    slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
    created_by_id: userRef('SET NULL', true),
    ...stamps,
  });
  await qi.addIndex('brands', ['studio_id']);

  await qi.createTable('brand_members', {
    id: uuid,
    brand_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' },
    user_id: userRef('CASCADE', false),
    role: { type: DataTypes.ENUM(...brandRoles), allowNull: false },
    ...stamps,
  });
  await qi.addIndex('brand_members', ['brand_id', 'user_id'], { unique: true });
  await qi.addIndex('brand_members', ['user_id']);

  await qi.createTable('invitations', {
    id: uuid,
    brand_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.STRING(320), allowNull: false },
    role: { type: DataTypes.ENUM(...brandRoles), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    invited_by_id: userRef('SET NULL', true),
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('invitations', ['brand_id', 'email']);

  // The trail outlives what it describes: references become NULL when a brand or user goes.
  await qi.createTable('audit_events', {
    id: uuid,
    studio_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'studios', key: 'id' }, onDelete: 'SET NULL' },
    brand_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'brands', key: 'id' }, onDelete: 'SET NULL' },
    actor_id: userRef('SET NULL', true),
    action: { type: DataTypes.STRING(80), allowNull: false },
    target_type: { type: DataTypes.STRING(40), allowNull: false },
    target_id: { type: DataTypes.TEXT, allowNull: true },
    details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('audit_events', ['brand_id', 'created_at']);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  for (const table of ['audit_events', 'invitations', 'brand_members', 'brands', 'studio_members', 'studios']) {
    await qi.dropTable(table);
  }
  await qi.sequelize.query('DROP TYPE IF EXISTS "enum_studio_members_role", "enum_brand_members_role", "enum_invitations_role"');
}
