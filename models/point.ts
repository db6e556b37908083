import { DataTypes, type CreationOptional, type Sequelize } from 'sequelize';
import type { PointRole } from '@/lib/shared/domain';
import { SyncedModel, syncedColumns, uuidKey } from './synced';

/** A located point of the site walk: intake, pump site, tank, profile station. */
export class Point extends SyncedModel<Point> {
  declare id: string;
  declare visitId: string;
  declare role: PointRole;
  declare label: string;
  declare lat: number | null;
  declare lon: number | null;
  declare accuracyM: number | null;
  declare altitudeM: number | null;
  declare altitudeAccuracyM: number | null;
  declare chainageM: number | null;
  /** Reduced level of a profile station, m (levelled; altitude is the GPS reading). */
  declare reducedLevelM: CreationOptional<number | null>;
  declare flags: CreationOptional<string[] | null>;
  declare capturedAt: Date | null;

  static initModel(sequelize: Sequelize) {
    Point.init(
      {
        id: uuidKey,
        visitId: { type: DataTypes.UUID, allowNull: false },
        role: { type: DataTypes.STRING(12), allowNull: false },
        label: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
        lat: { type: DataTypes.DOUBLE, allowNull: true },
        lon: { type: DataTypes.DOUBLE, allowNull: true },
        accuracyM: { type: DataTypes.DOUBLE, allowNull: true },
        altitudeM: { type: DataTypes.DOUBLE, allowNull: true },
        altitudeAccuracyM: { type: DataTypes.DOUBLE, allowNull: true },
        chainageM: { type: DataTypes.DOUBLE, allowNull: true },
        reducedLevelM: { type: DataTypes.DOUBLE, allowNull: true },
        flags: { type: DataTypes.JSON, allowNull: true },
        capturedAt: { type: DataTypes.DATE, allowNull: true },
        ...syncedColumns,
      },
      { sequelize, modelName: 'Point', tableName: 'points', underscored: true },
    );
  }
}
