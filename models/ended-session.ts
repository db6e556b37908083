import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A session ended by signing out: its token id, refused until the token would have expired anyway. */
export class EndedSession extends Model<InferAttributes<EndedSession>, InferCreationAttributes<EndedSession>> {
  declare sid: string;
  declare userId: string;
  declare expiresAt: Date;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    EndedSession.init(
      {
        sid: { type: DataTypes.STRING(64), primaryKey: true },
        userId: { type: DataTypes.UUID, allowNull: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'EndedSession', tableName: 'ended_sessions', underscored: true, updatedAt: false },
    );
  }
}
