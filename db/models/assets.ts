// Models of the asset shelf: uploaded originals, the index of generated renditions, and the download log.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Box } from '@/lib/logo/geometry';
import type { AssetFormat, AssetKind, AssetState } from '@/lib/assets/kinds';

export class Asset extends Model<InferAttributes<Asset>, InferCreationAttributes<Asset>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare name: string;
  declare kind: AssetKind;
  declare format: AssetFormat;
  declare mime: string;
  declare state: CreationOptional<AssetState>;
  declare storageKey: string;
  declare contentHash: string;
  declare byteSize: number;
  declare width: number | null;
  declare height: number | null;
  /** What a logo draws, as fractions of its canvas (for clear-space avatars). */
  declare drawnBounds: Box | null;
  /** The settings a generated pattern tile was drawn from (null for uploaded files). */
  declare patternSettings: CreationOptional<Record<string, unknown> | null>;
  declare originalFilename: string;
  declare tags: CreationOptional<string[]>;
  declare description: string | null;
  declare usageNotes: string | null;
  /** A photograph's description for people who cannot see it (needed before it is approved). */
  declare altText: CreationOptional<string | null>;
  declare caption: CreationOptional<string | null>;
  /** A photograph's focal point as fractions of its width and height; null is the centre. */
  declare focusX: CreationOptional<number | null>;
  declare focusY: CreationOptional<number | null>;
  /** Usage rights or licence text: the studio's record of the licence, not the licence itself. */
  declare rights: CreationOptional<string | null>;
  /** The credit line to print beside the asset (photographer, agency, foundry). */
  declare credit: CreationOptional<string | null>;
  /** The calendar day (ISO 8601 date, UTC) the asset stops being usable; the expiry job retires it that day. */
  declare expiresOn: CreationOptional<string | null>;
  declare uploadedById: string | null;
  declare stateChangedAt: Date | null;
  declare stateChangedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class AssetRendition extends Model<InferAttributes<AssetRendition>, InferCreationAttributes<AssetRendition>> {
  declare id: CreationOptional<string>;
  declare assetId: string;
  declare paramsKey: string;
  declare storageKey: string;
  declare contentType: string;
  declare byteSize: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class AssetDownload extends Model<InferAttributes<AssetDownload>, InferCreationAttributes<AssetDownload>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare assetId: string | null;
  declare kind: 'file' | 'bundle';
  declare userId: string | null;
  declare shareLinkId: string | null;
  declare details: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;
}

/** One expiry notice sent for an asset and the expiry date it was about ('ahead': days before; 'due': on the day). */
export class AssetExpiryNotice extends Model<InferAttributes<AssetExpiryNotice>, InferCreationAttributes<AssetExpiryNotice>> {
  declare assetId: string;
  declare notice: 'ahead' | 'due';
  declare expiresOn: string;
  declare recipients: number;
  declare sentAt: Date;
}

const id = { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true };
const timestamps = { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE };

/** Bind the asset models; called at the end of initModels. */
export function initAssetModels(sequelize: Sequelize): void {
  const common = { sequelize, underscored: true };
  Asset.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(160), allowNull: false },
      kind: { type: DataTypes.STRING(16), allowNull: false },
      format: { type: DataTypes.STRING(8), allowNull: false },
      mime: { type: DataTypes.STRING(80), allowNull: false },
      state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'draft' },
      storageKey: { type: DataTypes.STRING(200), allowNull: false },
      contentHash: { type: DataTypes.STRING(64), allowNull: false },
      byteSize: { type: DataTypes.INTEGER, allowNull: false },
      width: { type: DataTypes.DOUBLE, allowNull: true },
      height: { type: DataTypes.DOUBLE, allowNull: true },
      drawnBounds: { type: DataTypes.JSONB, allowNull: true },
      patternSettings: { type: DataTypes.JSONB, allowNull: true },
      originalFilename: { type: DataTypes.STRING(255), allowNull: false },
      tags: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      description: { type: DataTypes.TEXT, allowNull: true },
      usageNotes: { type: DataTypes.TEXT, allowNull: true },
      altText: { type: DataTypes.TEXT, allowNull: true },
      caption: { type: DataTypes.TEXT, allowNull: true },
      focusX: { type: DataTypes.DOUBLE, allowNull: true },
      focusY: { type: DataTypes.DOUBLE, allowNull: true },
      rights: { type: DataTypes.TEXT, allowNull: true },
      credit: { type: DataTypes.TEXT, allowNull: true },
      expiresOn: { type: DataTypes.DATEONLY, allowNull: true },
      uploadedById: { type: DataTypes.TEXT, allowNull: true },
      stateChangedAt: { type: DataTypes.DATE, allowNull: true },
      stateChangedById: { type: DataTypes.TEXT, allowNull: true },
      ...timestamps,
    },
    { ...common, tableName: 'assets' },
  );
  AssetRendition.init(
    {
      id,
      assetId: { type: DataTypes.UUID, allowNull: false },
      paramsKey: { type: DataTypes.STRING(64), allowNull: false },
      storageKey: { type: DataTypes.STRING(200), allowNull: false },
      contentType: { type: DataTypes.STRING(80), allowNull: false },
      byteSize: { type: DataTypes.INTEGER, allowNull: false },
      ...timestamps,
    },
    { ...common, tableName: 'asset_renditions' },
  );
  AssetDownload.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      assetId: { type: DataTypes.UUID, allowNull: true },
      kind: { type: DataTypes.STRING(10), allowNull: false },
      userId: { type: DataTypes.TEXT, allowNull: true },
      shareLinkId: { type: DataTypes.UUID, allowNull: true },
      details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      createdAt: DataTypes.DATE,
    },
    { ...common, tableName: 'asset_downloads', updatedAt: false },
  );
  AssetExpiryNotice.init(
    {
      assetId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
      notice: { type: DataTypes.STRING(8), allowNull: false, primaryKey: true },
      expiresOn: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
      recipients: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      sentAt: { type: DataTypes.DATE, allowNull: false },
    },
    { ...common, tableName: 'asset_expiry_notices', timestamps: false },
  );
}
