import { DataTypes, type CreationOptional, type Sequelize } from 'sequelize';
import type { VisitStatus } from '@/lib/shared/domain';
import { SyncedModel, syncedColumns, uuidKey } from './synced';

export class Visit extends SyncedModel<Visit> {
  declare id: string;
  declare organisationId: string;
  declare farmId: string;
  declare advisorId: string | null;
  declare plannedOn: string | null;
  declare status: VisitStatus;
  declare visitedAt: Date | null;
  declare lastSyncedAt: Date | null;
  declare notes: string;
  // Revision at which the visit last became visible to a phone (see migrations/0007).
  declare exposedRev: CreationOptional<number>;

  static initModel(sequelize: Sequelize) {
    Visit.init(
      {
        id: uuidKey,
        organisationId: { type: DataTypes.UUID, allowNull: false },
        farmId: { type: DataTypes.UUID, allowNull: false },
        advisorId: { type: DataTypes.UUID, allowNull: true },
        plannedOn: { type: DataTypes.DATEONLY, allowNull: true },
        status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'requested' },
        visitedAt: { type: DataTypes.DATE, allowNull: true },
        lastSyncedAt: { type: DataTypes.DATE, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        exposedRev: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
        ...syncedColumns,
      },
      { sequelize, modelName: 'Visit', tableName: 'visits', underscored: true },
    );
  }
}
