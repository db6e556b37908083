import { DataTypes, type QueryInterface } from 'sequelize';
import { id, ownedBy, timestamps } from './support';

type Ctx = { context: QueryInterface };

// Profile stations (points with role 'station') get a reduced level and flags such as 'no-pump-site';
// commissionings hold what an installed ram measured against its screening.
export async function up({ context: qi }: Ctx) {
  await qi.addColumn('points', 'reduced_level_m', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('points', 'flags', { type: DataTypes.JSON, allowNull: true });
  await qi.createTable('commissionings', {
    id,
    organisation_id: ownedBy('organisations'),
    visit_id: ownedBy('visits'),
    screening_id: { type: DataTypes.UUID, allowNull: true },
    recorded_by_id: { type: DataTypes.UUID, allowNull: true },
    drive_lpm: { type: DataTypes.DOUBLE, allowNull: false },
    delivered_lpm: { type: DataTypes.DOUBLE, allowNull: false },
    beats_per_minute: { type: DataTypes.DOUBLE, allowNull: false },
    lift_m: { type: DataTypes.DOUBLE, allowNull: false },
    fall_m: { type: DataTypes.DOUBLE, allowNull: false },
    drive_pipe_material: { type: DataTypes.STRING(40), allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false },
    measured_lpd: { type: DataTypes.DOUBLE, allowNull: false },
    predicted_lpd: { type: DataTypes.DOUBLE, allowNull: true },
    outcome: { type: DataTypes.STRING(16), allowNull: true },
    result: { type: DataTypes.JSON, allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('commissionings', ['visit_id', 'created_at'], { name: 'commissionings_visit_created' });
  await qi.addIndex('commissionings', ['organisation_id', 'created_at'], { name: 'commissionings_org_created' });
}

export async function down({ context: qi }: Ctx) {
  await qi.dropTable('commissionings');
  await qi.removeColumn('points', 'flags');
  await qi.removeColumn('points', 'reduced_level_m');
}
