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
import { BRAND_ROLES, STUDIO_ROLES, type BrandRole, type StudioRole } from '../../src/lib/auth/roles';

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

  Studio.hasMany(StudioMember, { foreignKey: 'studioId', as: 'members' });
  StudioMember.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' });
  Studio.hasMany(Brand, { foreignKey: 'studioId', as: 'brands' });
  Brand.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' });
  Brand.hasMany(BrandMember, { foreignKey: 'brandId', as: 'members' });
  BrandMember.belongsTo(Brand, { foreignKey: 'brandId', as: 'brand' });
  Brand.hasMany(Invitation, { foreignKey: 'brandId', as: 'invitations' });
  Invitation.belongsTo(Brand, { foreignKey: 'brandId', as: 'brand' });
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
