import { DataTypes, type Sequelize } from 'sequelize';
import { SyncedModel, syncedColumns, uuidKey } from './synced';

/** One line of the farm's daily water need: a kind (people, beef cows…), a count, a per-head figure. */
export class DemandLine extends SyncedModel<DemandLine> {
  declare id: string;
  declare farmId: string;
  declare kind: string;
  declare count: number;
  declare litresPerHeadPerDay: number;
  // Where the per-head figure comes from (catalogue source id, or "farmer's own figure").
  declare figureSource: string;
  declare note: string;
  /** Unusual values the advisor confirmed ("is this right?"), or null. */
  declare confirmed: string[] | null;

  static initModel(sequelize: Sequelize) {
    DemandLine.init(
      {
        id: uuidKey,
        farmId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.STRING(32), allowNull: false },
        count: { type: DataTypes.INTEGER, allowNull: false },
        litresPerHeadPerDay: { type: DataTypes.DOUBLE, allowNull: false },
        figureSource: { type: DataTypes.STRING(160), allowNull: false, defaultValue: '' },
        note: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
        confirmed: { type: DataTypes.JSON, allowNull: true },
        ...syncedColumns,
      },
      { sequelize, modelName: 'DemandLine', tableName: 'demand_lines', underscored: true },
    );
  }
}
