import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// A commissioning check keeps the waste valve's stroke as the advisor set it, when they measured it:
// the valve advice then models that stroke instead of assuming the middle of the usual range.
export async function up({ context: qi }: Ctx) {
  await qi.addColumn('commissionings', 'waste_valve_stroke_mm', { type: DataTypes.DOUBLE, allowNull: true });
}

export async function down({ context: qi }: Ctx) {
  await qi.removeColumn('commissionings', 'waste_valve_stroke_mm');
}
