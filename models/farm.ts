import { DataTypes, type Sequelize } from 'sequelize';
import { SyncedModel, syncedColumns, uuidKey } from './synced';

export class Farm extends SyncedModel<Farm> {
  declare id: string;
  declare organisationId: string;
  declare ownerId: string | null;
  declare name: string;
  declare area: string;
  declare lat: number | null;
  declare lon: number | null;
  declare notes: string;

  static initModel(sequelize: Sequelize) {
    Farm.init(
      {
        id: uuidKey,
        organisationId: { type: DataTypes.UUID, allowNull: false },
        ownerId: { type: DataTypes.UUID, allowNull: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        area: { type: DataTypes.STRING(160), allowNull: false, defaultValue: '' },
        lat: { type: DataTypes.DOUBLE, allowNull: true },
        lon: { type: DataTypes.DOUBLE, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        ...syncedColumns,
      },
      { sequelize, modelName: 'Farm', tableName: 'farms', underscored: true },
    );
  }
}
