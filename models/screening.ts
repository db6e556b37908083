import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Verdict } from '@/lib/shared/domain';

/** A stored run of the feasibility engine over one visit's readings. */
export class Screening extends Model<InferAttributes<Screening>, InferCreationAttributes<Screening>> {
  declare id: string;
  declare visitId: string;
  declare engineVersion: string;
  // sha-256 of the canonical inputs: the same readings give the same screening.
  declare inputsHash: string;
  declare inputs: unknown;
  declare result: unknown;
  declare verdict: Verdict;
  declare probabilityMeetsDemand: number | null;
  declare deliveryLpd: number | null;
  declare demandLpd: number | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Screening.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        visitId: { type: DataTypes.UUID, allowNull: false },
        engineVersion: { type: DataTypes.STRING(24), allowNull: false },
        inputsHash: { type: DataTypes.CHAR(64), allowNull: false },
        inputs: { type: DataTypes.JSON, allowNull: false },
        result: { type: DataTypes.JSON, allowNull: false },
        verdict: { type: DataTypes.STRING(12), allowNull: false },
        probabilityMeetsDemand: { type: DataTypes.DOUBLE, allowNull: true },
        deliveryLpd: { type: DataTypes.DOUBLE, allowNull: true },
        demandLpd: { type: DataTypes.DOUBLE, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: 'Screening', tableName: 'screenings', underscored: true, updatedAt: false },
    );
  }
}
