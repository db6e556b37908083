import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** What the farmer said before the visit that is not a demand line: where the tank should go. */
export class FarmNeed extends Model<InferAttributes<FarmNeed>, InferCreationAttributes<FarmNeed>> {
  declare farmId: string;
  declare tankSite: string;
  declare updatedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    FarmNeed.init(
      {
        farmId: { type: DataTypes.UUID, primaryKey: true },
        tankSite: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
        updatedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'FarmNeed', tableName: 'farm_needs', underscored: true },
    );
  }
}
