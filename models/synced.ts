import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';

// Columns every record that syncs with the phone carries: its revision for the pull cursor, who made it, and
// soft deletion, so a delete reaches every phone like any other change.
export const syncedColumns = {
  // Server revision from the rev_counter row (models/index.ts): the pull cursor and the conflict check.
  rev: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
  createdById: { type: DataTypes.UUID, allowNull: true },
  deletedAt: { type: DataTypes.DATE, allowNull: true },
  createdAt: DataTypes.DATE,
  updatedAt: DataTypes.DATE,
};

export const uuidKey = { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 };

/** Base of every model that syncs with the phone: the shared columns, declared once. */
export abstract class SyncedModel<M extends Model> extends Model<InferAttributes<M>, InferCreationAttributes<M>> {
  declare rev: CreationOptional<number>;
  declare createdById: CreationOptional<string | null>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
