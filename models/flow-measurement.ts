import { DataTypes, type Sequelize } from 'sequelize';
import { SyncedModel, syncedColumns, uuidKey } from './synced';

/** One flow measurement: the method and its raw trials, exactly as read in the field. */
export class FlowMeasurement extends SyncedModel<FlowMeasurement> {
  declare id: string;
  declare visitId: string;
  declare sourceId: string | null;
  declare method: string;
  declare season: string;
  declare takenAt: Date | null;
  // Raw trials in SI (e.g. [{volumeL, seconds}] or [{headM}]), validated by lib/shared schemas.
  declare readings: unknown;
  declare notes: string;

  static initModel(sequelize: Sequelize) {
    FlowMeasurement.init(
      {
        id: uuidKey,
        visitId: { type: DataTypes.UUID, allowNull: false },
        sourceId: { type: DataTypes.UUID, allowNull: true },
        method: { type: DataTypes.STRING(24), allowNull: false },
        season: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'unknown' },
        takenAt: { type: DataTypes.DATE, allowNull: true },
        readings: { type: DataTypes.JSON, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        ...syncedColumns,
      },
      { sequelize, modelName: 'FlowMeasurement', tableName: 'flow_measurements', underscored: true },
    );
  }
}
