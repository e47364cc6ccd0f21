import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

// The handover invoice of a brand (at most one) and the payment provider's events it has taken in, kept by id so a
// delivery seen twice changes nothing. Rows of handover_invoices announce themselves as change notices ('handover'),
// so every process's gate memory (src/lib/handover/gate.server.ts) honours a payment or refund within a second.
export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  const run = (sql: string) => qi.sequelize.query(sql);
  await qi.createTable('handover_invoices', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    brand_id: { type: DataTypes.UUID, allowNull: false, unique: true, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' },
    // Integer minor units (cents, pence, yen), as the payment provider counts them.
    amount: { type: DataTypes.INTEGER, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    due_on: { type: DataTypes.DATEONLY, allowNull: false },
    releases: { type: DataTypes.STRING(16), allowNull: false },
    client_email: { type: DataTypes.TEXT, allowNull: false },
    state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'draft' },
    // Why the files are held back again (a refund, a failed payment), in words for the client and the designer.
    state_reason: { type: DataTypes.TEXT, allowNull: true },
    // The provider's time of the last payment event applied: an older event arriving late changes nothing.
    payment_event_at: { type: DataTypes.DATE, allowNull: true },
    pay_token_hash: { type: DataTypes.STRING(64), allowNull: true, unique: true },
    checkout_session_id: { type: DataTypes.TEXT, allowNull: true },
    payment_intent_id: { type: DataTypes.TEXT, allowNull: true },
    created_by_id: { type: DataTypes.TEXT, allowNull: true, references: { model: 'user', key: 'id' }, onDelete: 'SET NULL' },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    paid_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await run(`ALTER TABLE handover_invoices ADD CONSTRAINT handover_invoices_amount CHECK (amount > 0)`);
  await run(`ALTER TABLE handover_invoices ADD CONSTRAINT handover_invoices_currency CHECK (currency ~ '^[A-Z]{3}$')`);
  await run(`ALTER TABLE handover_invoices ADD CONSTRAINT handover_invoices_releases CHECK (releases IN ('final-files', 'print', 'shelf'))`);
  await run(`ALTER TABLE handover_invoices ADD CONSTRAINT handover_invoices_state CHECK (state IN ('draft', 'sent', 'paid', 'failed', 'refunded'))`);
  await qi.createTable('payment_events', {
    id: { type: DataTypes.TEXT, primaryKey: true },
    type: { type: DataTypes.TEXT, allowNull: false },
    invoice_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'handover_invoices', key: 'id' }, onDelete: 'SET NULL' },
    // What the event did: 'applied', or why it changed nothing ('stale', 'unknown-invoice', 'ignored').
    outcome: { type: DataTypes.STRING(20), allowNull: false },
    occurred_at: { type: DataTypes.DATE, allowNull: false },
    received_at: { type: DataTypes.DATE, allowNull: false },
  });
  await run(`CREATE TRIGGER plumbline_change_notice AFTER INSERT OR UPDATE OR DELETE ON handover_invoices FOR EACH ROW EXECUTE FUNCTION plumbline_change_notice('handover')`);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  await qi.sequelize.query('DROP TRIGGER IF EXISTS plumbline_change_notice ON handover_invoices');
  await qi.dropTable('payment_events');
  await qi.dropTable('handover_invoices');
}
