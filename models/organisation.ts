import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { UnitSystem } from '@/lib/shared/domain';
import type { PriceList } from '@/lib/shared/costs/price-list';

/** Organisation-wide choices; the engine and the sheet read them. */
export interface OrganisationSettings {
  unitsDefault: UnitSystem;
  designFractionOfLowest: number;
  /** Least chance of meeting the demand for a plain go; absent on older rows (the engine's default 0.8 then). */
  minProbabilityForGo?: number;
  demandFigures: Record<string, number>;
  pipePrices: { material: string; diameterMm: number; pricePerM: number; currency: string }[];
  /** Prices for costing the sheet; absent on older rows (the invented defaults then). */
  priceList?: Partial<PriceList>;
}

export class Organisation extends Model<InferAttributes<Organisation>, InferCreationAttributes<Organisation>> {
  declare id: string;
  declare name: string;
  declare district: string;
  declare settings: OrganisationSettings;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Organisation.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.STRING(160), allowNull: false },
        district: { type: DataTypes.STRING(160), allowNull: false, defaultValue: '' },
        settings: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Organisation', tableName: 'organisations', underscored: true },
    );
  }
}
