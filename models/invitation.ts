import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Role } from '@/lib/shared/domain';

/** A one-time, expiring invitation to set a password; only the token's sha-256 is stored. */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: string;
  declare organisationId: string;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare tokenHash: string;
  declare invitedById: string | null;
  declare userId: string | null;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  // A newer invitation to the same person was sent; this link no longer works.
  declare supersededAt: CreationOptional<Date | null>;
  // The office switched the account off while the link was pending.
  declare withdrawnAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Invitation.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        name: { type: DataTypes.STRING(160), allowNull: false },
        role: { type: DataTypes.STRING(16), allowNull: false },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        invitedById: { type: DataTypes.UUID, allowNull: true },
        userId: { type: DataTypes.UUID, allowNull: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true },
        supersededAt: { type: DataTypes.DATE(3), allowNull: true, defaultValue: null },
        withdrawnAt: { type: DataTypes.DATE(3), allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Invitation', tableName: 'invitations', underscored: true, updatedAt: false },
    );
  }
}
