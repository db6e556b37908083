import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A failed or successful sign-in, kept in the database so rate limits hold across app servers. */
export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare address: string;
  declare succeeded: boolean;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SignInAttempt.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        email: { type: DataTypes.STRING(254), allowNull: false },
        address: { type: DataTypes.STRING(64), allowNull: false },
        succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'SignInAttempt', tableName: 'sign_in_attempts', underscored: true, updatedAt: false },
    );
  }
}
