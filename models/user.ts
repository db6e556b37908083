import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Role, UnitSystem } from '@/lib/shared/domain';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: string;
  declare organisationId: string;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare passwordHash: string | null;
  declare active: CreationOptional<boolean>;
  declare units: UnitSystem | null;
  declare phone: string | null;
  // Bumped to end every session of the user (deactivation, password change).
  declare sessionVersion: CreationOptional<number>;
  declare lastSignInAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        role: { type: DataTypes.STRING(16), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: true },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        units: { type: DataTypes.STRING(8), allowNull: true },
        phone: { type: DataTypes.STRING(40), allowNull: true },
        sessionVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        lastSignInAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'User', tableName: 'users', underscored: true },
    );
  }
}
