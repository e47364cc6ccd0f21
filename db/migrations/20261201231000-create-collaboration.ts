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
const brandRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' };

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  // A questionnaire sent to a client contact; answers are kept as JSON keyed by question id.
  await qi.createTable('briefs', {
    id: uuid,
    brand_id: brandRef,
    template: { type: DataTypes.STRING(60), allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    questions: { type: DataTypes.JSONB, allowNull: false },
    contact_name: { type: DataTypes.STRING(120), allowNull: false },
    contact_email: { type: DataTypes.STRING(320), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    answers: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    sent_by_id: userRef('SET NULL', true),
    expires_at: { type: DataTypes.DATE, allowNull: false },
    answered_at: { type: DataTypes.DATE, allowNull: true },
    submitted_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('briefs', ['brand_id', 'created_at']);

  await qi.createTable('mood_boards', {
    id: uuid,
    brand_id: brandRef,
    title: { type: DataTypes.STRING(160), allowNull: false },
    intro: { type: DataTypes.STRING(2000), allowNull: false, defaultValue: '' },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'draft' },
    contact_name: { type: DataTypes.STRING(120), allowNull: true },
    contact_email: { type: DataTypes.STRING(320), allowNull: true },
    token_hash: { type: DataTypes.STRING(64), allowNull: true, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    created_by_id: userRef('SET NULL', true),
    ...stamps,
  });
  await qi.addIndex('mood_boards', ['brand_id']);

  await qi.createTable('mood_board_items', {
    id: uuid,
    board_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'mood_boards', key: 'id' }, onDelete: 'CASCADE' },
    kind: { type: DataTypes.STRING(10), allowNull: false },
    position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    caption: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    // image
    storage_key: { type: DataTypes.STRING(200), allowNull: true },
    content_type: { type: DataTypes.STRING(40), allowNull: true },
    width: { type: DataTypes.INTEGER, allowNull: true },
    height: { type: DataTypes.INTEGER, allowNull: true },
    // swatch
    color_name: { type: DataTypes.STRING(80), allowNull: true },
    color_value: { type: DataTypes.STRING(200), allowNull: true },
    color_hex: { type: DataTypes.STRING(9), allowNull: true },
    // type sample
    font_family: { type: DataTypes.STRING(120), allowNull: true },
    sample_text: { type: DataTypes.STRING(300), allowNull: true },
    // the client's verdict in the latest decision
    verdict: { type: DataTypes.STRING(10), allowNull: true },
    verdict_comment: { type: DataTypes.STRING(1000), allowNull: true },
    ...stamps,
  });
  await qi.addIndex('mood_board_items', ['board_id', 'position']);

  // Every decision on a board, in order: the record of what the client chose and said.
  await qi.createTable('mood_board_decisions', {
    id: uuid,
    board_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'mood_boards', key: 'id' }, onDelete: 'CASCADE' },
    outcome: { type: DataTypes.STRING(20), allowNull: false },
    comment: { type: DataTypes.STRING(4000), allowNull: false, defaultValue: '' },
    decided_by_name: { type: DataTypes.STRING(120), allowNull: false },
    decided_by_email: { type: DataTypes.STRING(320), allowNull: true },
    verdicts: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('mood_board_decisions', ['board_id', 'created_at']);

  await qi.createTable('review_requests', {
    id: uuid,
    brand_id: brandRef,
    revision: { type: DataTypes.INTEGER, allowNull: false },
    message: { type: DataTypes.STRING(2000), allowNull: false, defaultValue: '' },
    requested_by_id: userRef('SET NULL', true),
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'open' },
    decided_by_id: userRef('SET NULL', true),
    decided_at: { type: DataTypes.DATE, allowNull: true },
    decision_note: { type: DataTypes.STRING(4000), allowNull: true },
    ...stamps,
  });
  await qi.addIndex('review_requests', ['brand_id', 'created_at']);

  // Comments anchor to a top-level block id of the draft; replies point at their thread's first comment.
  await qi.createTable('review_comments', {
    id: uuid,
    brand_id: brandRef,
    review_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'review_requests', key: 'id' }, onDelete: 'SET NULL' },
    parent_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'review_comments', key: 'id' }, onDelete: 'CASCADE' },
    block_id: { type: DataTypes.STRING(100), allowNull: false },
    revision: { type: DataTypes.INTEGER, allowNull: false },
    body: { type: DataTypes.STRING(4000), allowNull: false },
    author_id: userRef('SET NULL', true),
    resolved_at: { type: DataTypes.DATE, allowNull: true },
    resolved_by_id: userRef('SET NULL', true),
    ...stamps,
  });
  await qi.addIndex('review_comments', ['brand_id', 'block_id']);

  await qi.createTable('brand_follows', {
    id: uuid,
    brand_id: brandRef,
    user_id: userRef('CASCADE', false),
    ...stamps,
  });
  await qi.addIndex('brand_follows', ['brand_id', 'user_id'], { unique: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  for (const table of ['brand_follows', 'review_comments', 'review_requests', 'mood_board_decisions', 'mood_board_items', 'mood_boards', 'briefs']) {
    await qi.dropTable(table);
  }
}
