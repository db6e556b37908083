import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** What an installed ram measured at commissioning, with the engine's check against its screening. */
export class Commissioning extends Model<InferAttributes<Commissioning>, InferCreationAttributes<Commissioning>> {
  declare id: string;
  declare organisationId: string;
  declare visitId: string;
  declare screeningId: string | null;
  declare recordedById: string | null;
  declare driveLpm: number;
  declare deliveredLpm: number;
  declare beatsPerMinute: number;
  declare liftM: number;
  declare fallM: number;
  declare drivePipeMaterial: string | null;
  declare wasteValveStrokeMm: number | null;
  declare notes: string;
  declare measuredLpd: number;
  declare predictedLpd: number | null;
  declare outcome: string | null;
  declare result: unknown;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Commissioning.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        visitId: { type: DataTypes.UUID, allowNull: false },
        screeningId: { type: DataTypes.UUID, allowNull: true },
        recordedById: { type: DataTypes.UUID, allowNull: true },
        driveLpm: { type: DataTypes.DOUBLE, allowNull: false },
        deliveredLpm: { type: DataTypes.DOUBLE, allowNull: false },
        beatsPerMinute: { type: DataTypes.DOUBLE, allowNull: false },
        liftM: { type: DataTypes.DOUBLE, allowNull: false },
        fallM: { type: DataTypes.DOUBLE, allowNull: false },
        drivePipeMaterial: { type: DataTypes.STRING(40), allowNull: true },
        wasteValveStrokeMm: { type: DataTypes.DOUBLE, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        measuredLpd: { type: DataTypes.DOUBLE, allowNull: false },
        predictedLpd: { type: DataTypes.DOUBLE, allowNull: true },
        outcome: { type: DataTypes.STRING(16), allowNull: true },
        result: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Commissioning', tableName: 'commissionings', underscored: true },
    );
  }
}
