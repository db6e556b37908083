import { DataTypes, type Sequelize } from 'sequelize';
import { SyncedModel, syncedColumns, uuidKey } from './synced';

/** Photo metadata; the bytes live in storage under `storageKey` once uploaded. */
export class Photo extends SyncedModel<Photo> {
  declare id: string;
  declare visitId: string;
  declare pointId: string | null;
  declare caption: string;
  declare mime: string;
  declare bytes: number;
  declare sha256: string;
  declare storageKey: string | null;
  declare width: number | null;
  declare height: number | null;
  declare lat: number | null;
  declare lon: number | null;
  declare takenAt: Date | null;
  declare uploadedAt: Date | null;

  static initModel(sequelize: Sequelize) {
    Photo.init(
      {
        id: uuidKey,
        visitId: { type: DataTypes.UUID, allowNull: false },
        pointId: { type: DataTypes.UUID, allowNull: true },
        caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
        mime: { type: DataTypes.STRING(40), allowNull: false },
        bytes: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        storageKey: { type: DataTypes.STRING(300), allowNull: true },
        width: { type: DataTypes.INTEGER, allowNull: true },
        height: { type: DataTypes.INTEGER, allowNull: true },
        lat: { type: DataTypes.DOUBLE, allowNull: true },
        lon: { type: DataTypes.DOUBLE, allowNull: true },
        takenAt: { type: DataTypes.DATE, allowNull: true },
        uploadedAt: { type: DataTypes.DATE, allowNull: true },
        ...syncedColumns,
      },
      { sequelize, modelName: 'Photo', tableName: 'photos', underscored: true },
    );
  }
}
