import { DataTypes, type Sequelize } from 'sequelize';
import { SyncedModel, syncedColumns, uuidKey } from './synced';

/** A spring or creek the advisor measured; flow measurements hang off it. */
export class WaterSource extends SyncedModel<WaterSource> {
  declare id: string;
  declare visitId: string;
  declare name: string;
  declare kind: string;
  declare notes: string;

  static initModel(sequelize: Sequelize) {
    WaterSource.init(
      {
        id: uuidKey,
        visitId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(160), allowNull: false },
        kind: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'creek' },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        ...syncedColumns,
      },
      { sequelize, modelName: 'WaterSource', tableName: 'water_sources', underscored: true },
    );
  }
}
