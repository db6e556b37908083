import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// Rows read "newest first" (screenings, sheet sends and replies, the audit trail) need times finer
// than a second: two saves in the same second otherwise come back in no defined order.
const COLUMNS: [table: string, column: string][] = [
  ['screenings', 'created_at'],
  ['sheet_sends', 'created_at'],
  ['sheet_sends', 'updated_at'],
  ['sheet_responses', 'created_at'],
  ['audit_log', 'created_at'],
];

export async function up({ context: qi }: Ctx) {
  for (const [table, column] of COLUMNS) await qi.changeColumn(table, column, { type: DataTypes.DATE(3), allowNull: false });
}

export async function down({ context: qi }: Ctx) {
  for (const [table, column] of COLUMNS) await qi.changeColumn(table, column, { type: DataTypes.DATE, allowNull: false });
}
