import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Who changed what, and when. Append-only. */
export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<number>;
  declare organisationId: string;
  declare actorId: string | null;
  declare entity: string;
  declare entityId: string;
  // The visit the change belongs to, for the visit page's history.
  declare visitId: string | null;
  declare action: string;
  declare changes: unknown;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditEntry.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        actorId: { type: DataTypes.UUID, allowNull: true },
        entity: { type: DataTypes.STRING(32), allowNull: false },
        entityId: { type: DataTypes.STRING(36), allowNull: false },
        visitId: { type: DataTypes.UUID, allowNull: true },
        action: { type: DataTypes.STRING(32), allowNull: false },
        changes: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: 'AuditEntry', tableName: 'audit_log', underscored: true, updatedAt: false },
    );
  }
}
