import { DataTypes, type Sequelize } from 'sequelize';
import { SyncedModel, syncedColumns, uuidKey } from './synced';

/** The drive or delivery pipe as planned on site: length along the route, size, material. */
export class PipeRun extends SyncedModel<PipeRun> {
  declare id: string;
  declare visitId: string;
  // 'drive' (intake → ram) or 'delivery' (ram → tank).
  declare purpose: string;
  declare lengthM: number | null;
  declare diameterMm: number | null;
  declare material: string;
  declare pressureClass: string | null;

  static initModel(sequelize: Sequelize) {
    PipeRun.init(
      {
        id: uuidKey,
        visitId: { type: DataTypes.UUID, allowNull: false },
        purpose: { type: DataTypes.STRING(10), allowNull: false },
        lengthM: { type: DataTypes.DOUBLE, allowNull: true },
        diameterMm: { type: DataTypes.DOUBLE, allowNull: true },
        material: { type: DataTypes.STRING(24), allowNull: false },
        pressureClass: { type: DataTypes.STRING(24), allowNull: true },
        ...syncedColumns,
      },
      { sequelize, modelName: 'PipeRun', tableName: 'pipe_runs', underscored: true },
    );
  }
}
