// What published sites were read (site_insights) and the daily salts of the visitor keys (insight_salts).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { InsightKind } from '@/lib/insights/rows';

export class SiteInsight extends Model<InferAttributes<SiteInsight>, InferCreationAttributes<SiteInsight>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare versionNumber: number;
  declare kind: InsightKind;
  declare path: string | null;
  /** A file the page itself loaded (an image, a font), not one a visitor opened or saved. */
  declare embedded: CreationOptional<boolean>;
  declare shareLinkId: string | null;
  declare member: boolean;
  /** SHA-256 (hex) of the day's salt, address, user agent and brand: the same visitor on the same day, nothing more. */
  declare visitorKey: string;
  declare day: string;
  declare at: Date;
  declare blockId: string | null;
  declare query: string | null;
  declare results: number | null;
}

export class InsightSalt extends Model<InferAttributes<InsightSalt>, InferCreationAttributes<InsightSalt>> {
  declare day: string;
  declare salt: string;
  declare createdAt: CreationOptional<Date>;
}

/** Bind the insights models; called at the end of initModels. */
export function initInsightModels(sequelize: Sequelize): void {
  const common = { sequelize, underscored: true };
  SiteInsight.init(
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      brandId: { type: DataTypes.UUID, allowNull: false },
      versionNumber: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(16), allowNull: false },
      path: { type: DataTypes.STRING(400), allowNull: true },
      embedded: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      shareLinkId: { type: DataTypes.UUID, allowNull: true },
      member: { type: DataTypes.BOOLEAN, allowNull: false },
      visitorKey: { type: DataTypes.STRING(64), allowNull: false },
      day: { type: DataTypes.DATEONLY, allowNull: false },
      at: { type: DataTypes.DATE, allowNull: false },
      blockId: { type: DataTypes.STRING(64), allowNull: true },
      query: { type: DataTypes.STRING(120), allowNull: true },
      results: { type: DataTypes.INTEGER, allowNull: true },
    },
    { ...common, tableName: 'site_insights', timestamps: false },
  );
  InsightSalt.init(
    {
      day: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
      salt: { type: DataTypes.STRING(64), allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    { ...common, tableName: 'insight_salts', updatedAt: false },
  );
}
