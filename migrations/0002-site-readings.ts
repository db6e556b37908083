import { DataTypes, type QueryInterface } from 'sequelize';
import { id, ownedBy, syncedColumns } from './support';

type Ctx = { context: QueryInterface };

// Everything captured on a site walk, as raw readings. Each table is listed by visit and pulled by rev.
const visitChildren = ['water_sources', 'flow_measurements', 'fall_readings', 'points', 'photos', 'pipe_runs'];

export async function up({ context: qi }: Ctx) {
  await qi.createTable('water_sources', {
    id,
    visit_id: ownedBy('visits'),
    name: { type: DataTypes.STRING(160), allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'creek' },
    notes: { type: DataTypes.TEXT, allowNull: false },
    ...syncedColumns,
  });

  await qi.createTable('flow_measurements', {
    id,
    visit_id: ownedBy('visits'),
    source_id: { type: DataTypes.UUID, allowNull: true },
    method: { type: DataTypes.STRING(24), allowNull: false },
    season: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'unknown' },
    taken_at: { type: DataTypes.DATE, allowNull: true },
    readings: { type: DataTypes.JSON, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false },
    ...syncedColumns,
  });

  await qi.createTable('fall_readings', {
    id,
    visit_id: ownedBy('visits'),
    purpose: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'fall' },
    method: { type: DataTypes.STRING(16), allowNull: false },
    seq: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    taken_at: { type: DataTypes.DATE, allowNull: true },
    bookings: { type: DataTypes.JSON, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false },
    ...syncedColumns,
  });

  await qi.createTable('points', {
    id,
    visit_id: ownedBy('visits'),
    role: { type: DataTypes.STRING(12), allowNull: false },
    label: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    lat: { type: DataTypes.DOUBLE, allowNull: true },
    lon: { type: DataTypes.DOUBLE, allowNull: true },
    accuracy_m: { type: DataTypes.DOUBLE, allowNull: true },
    altitude_m: { type: DataTypes.DOUBLE, allowNull: true },
    altitude_accuracy_m: { type: DataTypes.DOUBLE, allowNull: true },
    chainage_m: { type: DataTypes.DOUBLE, allowNull: true },
    captured_at: { type: DataTypes.DATE, allowNull: true },
    ...syncedColumns,
  });

  await qi.createTable('photos', {
    id,
    visit_id: ownedBy('visits'),
    point_id: { type: DataTypes.UUID, allowNull: true },
    caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
    mime: { type: DataTypes.STRING(40), allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    storage_key: { type: DataTypes.STRING(300), allowNull: true },
    width: { type: DataTypes.INTEGER, allowNull: true },
    height: { type: DataTypes.INTEGER, allowNull: true },
    lat: { type: DataTypes.DOUBLE, allowNull: true },
    lon: { type: DataTypes.DOUBLE, allowNull: true },
    taken_at: { type: DataTypes.DATE, allowNull: true },
    uploaded_at: { type: DataTypes.DATE, allowNull: true },
    ...syncedColumns,
  });
  await qi.addIndex('photos', ['sha256'], { name: 'photos_sha256' });

  await qi.createTable('pipe_runs', {
    id,
    visit_id: ownedBy('visits'),
    purpose: { type: DataTypes.STRING(10), allowNull: false },
    length_m: { type: DataTypes.DOUBLE, allowNull: true },
    diameter_mm: { type: DataTypes.DOUBLE, allowNull: true },
    material: { type: DataTypes.STRING(24), allowNull: false },
    pressure_class: { type: DataTypes.STRING(24), allowNull: true },
    ...syncedColumns,
  });

  for (const table of visitChildren) {
    await qi.addIndex(table, ['visit_id', 'rev'], { name: `${table}_visit_rev` });
    await qi.addIndex(table, ['rev'], { name: `${table}_rev` });
  }

  await qi.createTable('demand_lines', {
    id,
    farm_id: ownedBy('farms'),
    kind: { type: DataTypes.STRING(32), allowNull: false },
    count: { type: DataTypes.INTEGER, allowNull: false },
    litres_per_head_per_day: { type: DataTypes.DOUBLE, allowNull: false },
    figure_source: { type: DataTypes.STRING(160), allowNull: false, defaultValue: '' },
    note: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
    ...syncedColumns,
  });
  await qi.addIndex('demand_lines', ['farm_id', 'rev'], { name: 'demand_lines_farm_rev' });
  await qi.addIndex('demand_lines', ['rev'], { name: 'demand_lines_rev' });
}

export async function down({ context: qi }: Ctx) {
  await qi.dropTable('demand_lines');
  for (const table of [...visitChildren].reverse()) await qi.dropTable(table);
}
