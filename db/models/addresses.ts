// A brand's earlier public addresses (slugs), kept so that published links to them redirect.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class BrandFormerSlug extends Model<InferAttributes<BrandFormerSlug>, InferCreationAttributes<BrandFormerSlug>> {
  declare slug: string;
  declare brandId: string;
  declare createdAt: CreationOptional<Date>;
}

export function initAddressModels(sequelize: Sequelize): void {
  BrandFormerSlug.init(
    {
      slug: { type: DataTypes.STRING(80), primaryKey: true },
      brandId: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, underscored: true, tableName: 'brand_former_slugs', updatedAt: false },
  );
}
