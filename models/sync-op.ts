import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** An operation id the server has applied: replaying the same op returns the stored outcome. */
export class SyncOp extends Model<InferAttributes<SyncOp>, InferCreationAttributes<SyncOp>> {
  declare opId: string;
  declare userId: string;
  declare entity: string;
  declare entityId: string;
  declare outcome: unknown;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SyncOp.init(
      {
        opId: { type: DataTypes.UUID, primaryKey: true },
        userId: { type: DataTypes.UUID, allowNull: false },
        entity: { type: DataTypes.STRING(32), allowNull: false },
        entityId: { type: DataTypes.STRING(36), allowNull: false },
        outcome: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'SyncOp', tableName: 'sync_ops', underscored: true, updatedAt: false },
    );
  }
}
