// Sequelize models for Plumbline's own tables. better-auth owns "user", "session", "account",
// "verification" and "rateLimit": no model here points at them, our foreign keys only reference "user"(id).
import {
  DataTypes,
  Model,
  Sequelize,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
} from 'sequelize';
import pg from 'pg';
import { BRAND_ROLES, STUDIO_ROLES, type BrandRole, type StudioRole } from '@/lib/auth/roles';
import type { Box, ColorRole, LightParts, LogoVariant, LogoVariantSlot, TypefaceRole, TypeScaleSettings } from '@/lib/identity/types';

/** A designer's own file for one variant slot of a logo. */
export interface LogoVariantFile {
  key: string;
  format: 'svg' | 'png';
  byteSize: number;
}
import type { FontMetrics } from '@/lib/type/metrics';
import { initAssetModels } from './assets';
import { initCollaborationModels } from './collaboration';
import { initPaletteRouteModels } from './palette-routes';
import { initPublishingModels } from './publishing';
import { initAddressModels } from './addresses';
import { initInsightModels } from './insights';
import { initHandoverModels } from './handover';

export class Studio extends Model<InferAttributes<Studio>, InferCreationAttributes<Studio>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class StudioMember extends Model<InferAttributes<StudioMember>, InferCreationAttributes<StudioMember>> {
  declare id: CreationOptional<string>;
  declare studioId: ForeignKey<Studio['id']>;
  declare userId: string;
  declare role: StudioRole;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class Brand extends Model<InferAttributes<Brand>, InferCreationAttributes<Brand>> {
  declare id: CreationOptional<string>;
  declare studioId: ForeignKey<Studio['id']>;
  declare name: string;
  declare slug: string;
  declare createdById: string | null;
  declare typeScale: CreationOptional<TypeScaleSettings | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class BrandMember extends Model<InferAttributes<BrandMember>, InferCreationAttributes<BrandMember>> {
  declare id: CreationOptional<string>;
  declare brandId: ForeignKey<Brand['id']>;
  declare userId: string;
  declare role: BrandRole;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<string>;
  declare brandId: ForeignKey<Brand['id']>;
  declare email: string;
  declare role: BrandRole;
  declare tokenHash: string;
  declare invitedById: string | null;
  declare expiresAt: Date;
  declare acceptedAt: Date | null;
  declare revokedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<string>;
  declare studioId: string | null;
  declare brandId: string | null;
  declare actorId: string | null;
  declare action: string;
  declare targetType: string;
  declare targetId: string | null;
  declare details: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;
}

export class BrandColor extends Model<InferAttributes<BrandColor>, InferCreationAttributes<BrandColor>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare name: string;
  declare value: string;
  declare hex: string;
  declare role: ColorRole | null;
  declare cmykOverride: [number, number, number, number] | null;
  declare spot: string | null;
  declare position: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class BrandLogo extends Model<InferAttributes<BrandLogo>, InferCreationAttributes<BrandLogo>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare name: string;
  declare variant: LogoVariant;
  declare format: 'svg' | 'png';
  declare storageKey: string;
  declare contentHash: string;
  declare byteSize: number;
  declare canvas: Box;
  declare bounds: Box;
  declare clearSpaceUnit: number;
  declare clearSpaceLabel: string;
  declare clearSpaceMultiple: number;
  declare thinnestStroke: number;
  declare minScreenPx: number | null;
  declare minPrintMm: number | null;
  /** Files the designer supplied for one-colour or dark-ground versions, by slot; each wins over the computed one. */
  declare variantFiles: CreationOptional<Partial<Record<LogoVariantSlot, LogoVariantFile>>>;
  /** How light parts print in one colour: holes (the default) or ink. */
  declare lightParts: CreationOptional<LightParts>;
  declare position: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class BrandTypeface extends Model<InferAttributes<BrandTypeface>, InferCreationAttributes<BrandTypeface>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare role: TypefaceRole;
  declare family: string;
  declare source: 'shipped' | 'upload';
  declare shippedKey: string | null;
  declare storageKey: string | null;
  declare format: string;
  declare metrics: FontMetrics;
  declare fallback: string[];
  declare weights: number[];
  declare licenceConfirmedAt: Date | null;
  declare licenceConfirmedById: string | null;
  declare licenceNote: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class GuidelineDraft extends Model<InferAttributes<GuidelineDraft>, InferCreationAttributes<GuidelineDraft>> {
  declare brandId: string;
  declare revision: number;
  declare doc: { type: 'doc'; content: unknown[] };
  declare updatedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

const id = { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true };
const timestamps = { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE };

/** Bind every model to one Sequelize instance; call once per process. */
export function initModels(sequelize: Sequelize): void {
  const common = { sequelize, underscored: true };
  Studio.init({ id, name: { type: DataTypes.STRING(120), allowNull: false }, ...timestamps }, { ...common, tableName: 'studios' });
  StudioMember.init(
    {
      id,
      userId: { type: DataTypes.TEXT, allowNull: false },
      role: { type: DataTypes.ENUM(...STUDIO_ROLES), allowNull: false },
      ...timestamps,
    },
    { ...common, tableName: 'studio_members' },
  );
  Brand.init(
    {
      id,
      name: { type: DataTypes.STRING(120), allowNull: false },
      slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
      createdById: { type: DataTypes.TEXT, allowNull: true },
      typeScale: { type: DataTypes.JSONB, allowNull: true },
      ...timestamps,
    },
    { ...common, tableName: 'brands' },
  );
  BrandMember.init(
    {
      id,
      userId: { type: DataTypes.TEXT, allowNull: false },
      role: { type: DataTypes.ENUM(...BRAND_ROLES), allowNull: false },
      ...timestamps,
    },
    { ...common, tableName: 'brand_members' },
  );
  Invitation.init(
    {
      id,
      email: { type: DataTypes.STRING(320), allowNull: false },
      role: { type: DataTypes.ENUM(...BRAND_ROLES), allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      invitedById: { type: DataTypes.TEXT, allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    },
    { ...common, tableName: 'invitations' },
  );
  AuditEvent.init(
    {
      id,
      studioId: { type: DataTypes.UUID, allowNull: true },
      brandId: { type: DataTypes.UUID, allowNull: true },
      actorId: { type: DataTypes.TEXT, allowNull: true },
      action: { type: DataTypes.STRING(80), allowNull: false },
      targetType: { type: DataTypes.STRING(40), allowNull: false },
      targetId: { type: DataTypes.TEXT, allowNull: true },
      details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      createdAt: DataTypes.DATE,
    },
    { ...common, tableName: 'audit_events', updatedAt: false },
  );

  BrandColor.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(80), allowNull: false },
      value: { type: DataTypes.STRING(200), allowNull: false },
      hex: { type: DataTypes.STRING(9), allowNull: false },
      role: { type: DataTypes.STRING(20), allowNull: true },
      cmykOverride: { type: DataTypes.JSONB, allowNull: true },
      spot: { type: DataTypes.STRING(120), allowNull: true },
      position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      ...timestamps,
    },
    { ...common, tableName: 'brand_colors' },
  );
  BrandLogo.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      variant: { type: DataTypes.STRING(20), allowNull: false },
      format: { type: DataTypes.STRING(8), allowNull: false },
      storageKey: { type: DataTypes.STRING(200), allowNull: false },
      contentHash: { type: DataTypes.STRING(64), allowNull: false },
      byteSize: { type: DataTypes.INTEGER, allowNull: false },
      canvas: { type: DataTypes.JSONB, allowNull: false },
      bounds: { type: DataTypes.JSONB, allowNull: false },
      clearSpaceUnit: { type: DataTypes.DOUBLE, allowNull: false },
      clearSpaceLabel: { type: DataTypes.STRING(120), allowNull: false },
      clearSpaceMultiple: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 },
      thinnestStroke: { type: DataTypes.DOUBLE, allowNull: false },
      minScreenPx: { type: DataTypes.INTEGER, allowNull: true },
      minPrintMm: { type: DataTypes.DOUBLE, allowNull: true },
      variantFiles: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      lightParts: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'holes' },
      position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      ...timestamps,
    },
    { ...common, tableName: 'brand_logos' },
  );
  BrandTypeface.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      role: { type: DataTypes.STRING(20), allowNull: false },
      family: { type: DataTypes.STRING(120), allowNull: false },
      source: { type: DataTypes.STRING(10), allowNull: false },
      shippedKey: { type: DataTypes.STRING(60), allowNull: true },
      storageKey: { type: DataTypes.STRING(200), allowNull: true },
      format: { type: DataTypes.STRING(8), allowNull: false },
      metrics: { type: DataTypes.JSONB, allowNull: false },
      fallback: { type: DataTypes.JSONB, allowNull: false },
      weights: { type: DataTypes.JSONB, allowNull: false },
      licenceConfirmedAt: { type: DataTypes.DATE, allowNull: true },
      licenceConfirmedById: { type: DataTypes.TEXT, allowNull: true },
      licenceNote: { type: DataTypes.STRING(500), allowNull: true },
      ...timestamps,
    },
    { ...common, tableName: 'brand_typefaces' },
  );

  GuidelineDraft.init(
    {
      brandId: { type: DataTypes.UUID, primaryKey: true },
      revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      doc: { type: DataTypes.JSONB, allowNull: false },
      updatedById: { type: DataTypes.TEXT, allowNull: true },
      ...timestamps,
    },
    { ...common, tableName: 'guideline_drafts' },
  );

  Studio.hasMany(StudioMember, { foreignKey: 'studioId', as: 'members' });
  StudioMember.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' });
  Studio.hasMany(Brand, { foreignKey: 'studioId', as: 'brands' });
  Brand.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' });
  Brand.hasMany(BrandMember, { foreignKey: 'brandId', as: 'members' });
  BrandMember.belongsTo(Brand, { foreignKey: 'brandId', as: 'brand' });
  Brand.hasMany(Invitation, { foreignKey: 'brandId', as: 'invitations' });
  Invitation.belongsTo(Brand, { foreignKey: 'brandId', as: 'brand' });
  initAssetModels(sequelize);
  initCollaborationModels(sequelize);
  initPublishingModels(sequelize);
  initAddressModels(sequelize);
  initPaletteRouteModels(sequelize);
  initInsightModels(sequelize);
  initHandoverModels(sequelize);
}

/** A Sequelize instance on PostgreSQL through pg, with the models bound. */
export function connect(databaseUrl: string, opts: { logging?: boolean } = {}): Sequelize {
  const sequelize = new Sequelize(databaseUrl, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: opts.logging ? console.log : false,
    pool: { max: 10, idle: 10_000 },
  });
  initModels(sequelize);
  return sequelize;
}
export * from './publishing';
export * from './assets';
export * from './addresses';
export * from './palette-routes';
export * from './insights';
export * from './handover';
