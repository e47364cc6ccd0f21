// A brand's handover invoice (final files released on payment) and the payment events it has taken in.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { InvoiceState, Releases } from '@/lib/handover/invoice';

export class HandoverInvoice extends Model<InferAttributes<HandoverInvoice>, InferCreationAttributes<HandoverInvoice>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare amount: number;
  declare currency: string;
  declare dueOn: string;
  declare releases: Releases;
  declare clientEmail: string;
  declare state: CreationOptional<InvoiceState>;
  declare stateReason: CreationOptional<string | null>;
  declare paymentEventAt: CreationOptional<Date | null>;
  declare payTokenHash: CreationOptional<string | null>;
  declare checkoutSessionId: CreationOptional<string | null>;
  declare paymentIntentId: CreationOptional<string | null>;
  declare createdById: string | null;
  declare sentAt: CreationOptional<Date | null>;
  declare paidAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class PaymentEvent extends Model<InferAttributes<PaymentEvent>, InferCreationAttributes<PaymentEvent>> {
  declare id: string;
  declare type: string;
  declare invoiceId: string | null;
  declare outcome: string;
  declare occurredAt: Date;
  declare receivedAt: Date;
}

export function initHandoverModels(sequelize: Sequelize): void {
  HandoverInvoice.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      brandId: { type: DataTypes.UUID, allowNull: false },
      amount: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      dueOn: { type: DataTypes.DATEONLY, allowNull: false },
      releases: { type: DataTypes.STRING(16), allowNull: false },
      clientEmail: { type: DataTypes.TEXT, allowNull: false },
      state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'draft' },
      stateReason: { type: DataTypes.TEXT, allowNull: true },
      paymentEventAt: { type: DataTypes.DATE, allowNull: true },
      payTokenHash: { type: DataTypes.STRING(64), allowNull: true },
      checkoutSessionId: { type: DataTypes.TEXT, allowNull: true },
      paymentIntentId: { type: DataTypes.TEXT, allowNull: true },
      createdById: { type: DataTypes.TEXT, allowNull: true },
      sentAt: { type: DataTypes.DATE, allowNull: true },
      paidAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, underscored: true, tableName: 'handover_invoices' },
  );
  PaymentEvent.init(
    {
      id: { type: DataTypes.TEXT, primaryKey: true },
      type: { type: DataTypes.TEXT, allowNull: false },
      invoiceId: { type: DataTypes.UUID, allowNull: true },
      outcome: { type: DataTypes.STRING(20), allowNull: false },
      occurredAt: { type: DataTypes.DATE, allowNull: false },
      receivedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { sequelize, underscored: true, tableName: 'payment_events', timestamps: false },
  );
}
