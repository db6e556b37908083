import { DataTypes, type Sequelize } from 'sequelize';
import { SyncedModel, syncedColumns, uuidKey } from './synced';

/** A run of height readings (level book, hose steps, clinometer legs, GPS) for the fall or the lift. */
export class FallReading extends SyncedModel<FallReading> {
  declare id: string;
  declare visitId: string;
  // 'fall' (intake → pump, along the drive pipe route) or 'lift' (pump → tank).
  declare purpose: string;
  declare method: string;
  declare seq: number;
  declare takenAt: Date | null;
  // Ordered raw bookings in SI, validated by lib/shared schemas.
  declare bookings: unknown;
  declare notes: string;

  static initModel(sequelize: Sequelize) {
    FallReading.init(
      {
        id: uuidKey,
        visitId: { type: DataTypes.UUID, allowNull: false },
        purpose: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'fall' },
        method: { type: DataTypes.STRING(16), allowNull: false },
        seq: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        takenAt: { type: DataTypes.DATE, allowNull: true },
        bookings: { type: DataTypes.JSON, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        ...syncedColumns,
      },
      { sequelize, modelName: 'FallReading', tableName: 'fall_readings', underscored: true },
    );
  }
}
