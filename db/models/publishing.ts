// Published versions, share links, PDF exports and our own rate counters.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { BuildStep, Manifest, VersionState } from '@/lib/publishing/build/contract';

export interface VersionFile {
  /** Storage key of the version's own copy. */
  key: string;
  contentType: string;
}

export class GuidelineVersion extends Model<InferAttributes<GuidelineVersion>, InferCreationAttributes<GuidelineVersion>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare number: number;
  declare note: string;
  declare draftRevision: number;
  declare snapshot: { doc: unknown; identity: unknown };
  /** Copied files by their public id (logo or typeface id). */
  declare files: Record<string, VersionFile>;
  declare publishedById: string | null;
  declare publishedAt: CreationOptional<Date>;
  /** building → ready (every file written, manifest set) or failed (buildError says why); see src/lib/publishing/build/contract.ts. */
  declare state: CreationOptional<VersionState>;
  declare buildError: CreationOptional<string | null>;
  declare buildSteps: CreationOptional<BuildStep[]>;
  declare manifest: CreationOptional<Manifest | null>;
  declare builtAt: CreationOptional<Date | null>;
}

export class ShareLink extends Model<InferAttributes<ShareLink>, InferCreationAttributes<ShareLink>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare tokenHash: string;
  declare label: string | null;
  declare versionNumber: number | null;
  declare allowDownloads: boolean;
  /** The link also opens the version's reveal presentation (and its PDF). */
  declare allowPresentation: CreationOptional<boolean>;
  declare passwordHash: string | null;
  declare expiresAt: Date | null;
  declare revokedAt: Date | null;
  declare lastUsedAt: Date | null;
  declare useCount: CreationOptional<number>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class PdfExport extends Model<InferAttributes<PdfExport>, InferCreationAttributes<PdfExport>> {
  declare id: CreationOptional<string>;
  declare versionId: string;
  /** Paper size of the print edition, or 'slides' for the 16:9 presentation. */
  declare size: 'a4' | 'letter' | 'slides';
  declare state: 'queued' | 'rendering' | 'done' | 'failed';
  declare progress: number;
  declare storageKey: string | null;
  declare error: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

const id = { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true };

export function initPublishingModels(sequelize: Sequelize): void {
  const common = { sequelize, underscored: true };
  GuidelineVersion.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      number: { type: DataTypes.INTEGER, allowNull: false },
      note: { type: DataTypes.STRING(2000), allowNull: false },
      draftRevision: { type: DataTypes.INTEGER, allowNull: false },
      snapshot: { type: DataTypes.JSONB, allowNull: false },
      files: { type: DataTypes.JSONB, allowNull: false },
      publishedById: { type: DataTypes.TEXT, allowNull: true },
      publishedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      state: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'building' },
      buildError: { type: DataTypes.TEXT, allowNull: true },
      buildSteps: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      manifest: { type: DataTypes.JSONB, allowNull: true },
      builtAt: { type: DataTypes.DATE, allowNull: true },
    },
    { ...common, tableName: 'guideline_versions', timestamps: false },
  );
  ShareLink.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      label: { type: DataTypes.STRING(120), allowNull: true },
      versionNumber: { type: DataTypes.INTEGER, allowNull: true },
      allowDownloads: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      allowPresentation: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      passwordHash: { type: DataTypes.STRING(200), allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      lastUsedAt: { type: DataTypes.DATE, allowNull: true },
      useCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdById: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { ...common, tableName: 'share_links' },
  );
  PdfExport.init(
    {
      id,
      versionId: { type: DataTypes.UUID, allowNull: false },
      size: { type: DataTypes.STRING(10), allowNull: false },
      state: { type: DataTypes.STRING(12), allowNull: false },
      progress: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      storageKey: { type: DataTypes.STRING(200), allowNull: true },
      error: { type: DataTypes.STRING(500), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { ...common, tableName: 'pdf_exports' },
  );
}
