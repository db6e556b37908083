import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// An unusual demand line (more than 200 people, say) is saved only once the advisor confirms it on the
// phone; the confirmation stays with the line. Flow and fall readings keep theirs inside their JSON.
export async function up({ context: qi }: Ctx) {
  await qi.addColumn('demand_lines', 'confirmed', { type: DataTypes.JSON, allowNull: true });
}

export async function down({ context: qi }: Ctx) {
  await qi.removeColumn('demand_lines', 'confirmed');
}
