import { DataTypes, type ModelAttributeColumnOptions } from 'sequelize';

// Column sets shared by the migrations. Frozen: a later schema change gets a new migration,
// never an edit here (that would rewrite history for databases already migrated).
export const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false };

export const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/** rev, author, soft delete and timestamps: every record that syncs with the phone. */
export const syncedColumns = {
  rev: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
  created_by_id: { type: DataTypes.UUID, allowNull: true },
  deleted_at: { type: DataTypes.DATE, allowNull: true },
  ...timestamps,
};

/** A required reference that disappears with its parent. */
export function ownedBy(table: string): ModelAttributeColumnOptions {
  return {
    type: DataTypes.UUID,
    allowNull: false,
    references: { model: table, key: 'id' },
    onDelete: 'CASCADE',
    onUpdate: 'CASCADE',
  };
}
