// Palette routes: candidate palettes offered to the client together, and the route the client chose.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type RouteSetStatus = 'draft' | 'sent' | 'chosen' | 'comments';

/** One colour of a route as stored: the value typed, its parsed hex, and its role in the palette. */
export interface RouteColor {
  name: string;
  value: string;
  hex: string;
  role: string | null;
}

export class PaletteRouteSet extends Model<InferAttributes<PaletteRouteSet>, InferCreationAttributes<PaletteRouteSet>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare title: string;
  declare intro: CreationOptional<string>;
  declare status: CreationOptional<RouteSetStatus>;
  declare contactName: string | null;
  declare contactEmail: string | null;
  declare tokenHash: string | null;
  declare expiresAt: Date | null;
  declare sentAt: Date | null;
  declare createdById: string | null;
  declare chosenRouteId: string | null;
  declare decidedByName: string | null;
  declare decisionComment: CreationOptional<string>;
  declare decidedAt: Date | null;
  declare appliedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class PaletteRoute extends Model<InferAttributes<PaletteRoute>, InferCreationAttributes<PaletteRoute>> {
  declare id: CreationOptional<string>;
  declare setId: string;
  declare position: number;
  declare name: string;
  declare rationale: CreationOptional<string>;
  declare colors: RouteColor[];
  declare clientComment: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Bind the palette-route models; called from initModels. */
export function initPaletteRouteModels(sequelize: Sequelize): void {
  const common = { sequelize, underscored: true };
  const id = { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true };
  const text = (n: number, allowNull = true) => ({ type: DataTypes.STRING(n), allowNull });
  PaletteRouteSet.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      title: text(160, false),
      intro: { type: DataTypes.STRING(2000), allowNull: false, defaultValue: '' },
      status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'draft' },
      contactName: text(120),
      contactEmail: text(320),
      tokenHash: { type: DataTypes.STRING(64), allowNull: true, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: true },
      sentAt: { type: DataTypes.DATE, allowNull: true },
      createdById: { type: DataTypes.TEXT, allowNull: true },
      chosenRouteId: { type: DataTypes.UUID, allowNull: true },
      decidedByName: text(120),
      decisionComment: { type: DataTypes.STRING(4000), allowNull: false, defaultValue: '' },
      decidedAt: { type: DataTypes.DATE, allowNull: true },
      appliedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { ...common, tableName: 'palette_route_sets' },
  );
  PaletteRoute.init(
    {
      id,
      setId: { type: DataTypes.UUID, allowNull: false },
      position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      name: text(80, false),
      rationale: { type: DataTypes.STRING(600), allowNull: false, defaultValue: '' },
      colors: { type: DataTypes.JSONB, allowNull: false },
      clientComment: text(1000),
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { ...common, tableName: 'palette_routes' },
  );
}
