import { DataTypes, type QueryInterface } from 'sequelize';
import { id, ownedBy, syncedColumns, timestamps } from './support';

type Ctx = { context: QueryInterface };

export async function up({ context: qi }: Ctx) {
  // One database-wide revision counter: every synced save takes the next value (pull cursor).
  await qi.sequelize.query('CREATE SEQUENCE IF NOT EXISTS change_rev START WITH 1 INCREMENT BY 1 CACHE 100');

  await qi.createTable('organisations', {
    id,
    name: { type: DataTypes.STRING(160), allowNull: false },
    district: { type: DataTypes.STRING(160), allowNull: false, defaultValue: '' },
    settings: { type: DataTypes.JSON, allowNull: false },
    ...timestamps,
  });

  await qi.createTable('users', {
    id,
    organisation_id: ownedBy('organisations'),
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    units: { type: DataTypes.STRING(8), allowNull: true },
    phone: { type: DataTypes.STRING(40), allowNull: true },
    session_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('users', ['organisation_id', 'role', 'name'], { name: 'users_org_role_name' });

  await qi.createTable('farms', {
    id,
    organisation_id: ownedBy('organisations'),
    owner_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    name: { type: DataTypes.STRING(160), allowNull: false },
    area: { type: DataTypes.STRING(160), allowNull: false, defaultValue: '' },
    lat: { type: DataTypes.DOUBLE, allowNull: true },
    lon: { type: DataTypes.DOUBLE, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false },
    ...syncedColumns,
  });
  await qi.addIndex('farms', ['organisation_id', 'name'], { name: 'farms_org_name' });
  await qi.addIndex('farms', ['owner_id'], { name: 'farms_owner' });
  await qi.addIndex('farms', ['rev'], { name: 'farms_rev' });

  await qi.createTable('visits', {
    id,
    organisation_id: ownedBy('organisations'),
    farm_id: ownedBy('farms'),
    advisor_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    planned_on: { type: DataTypes.DATEONLY, allowNull: true },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'requested' },
    visited_at: { type: DataTypes.DATE, allowNull: true },
    last_synced_at: { type: DataTypes.DATE, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false },
    ...syncedColumns,
  });
  await qi.addIndex('visits', ['organisation_id', 'status', 'planned_on'], { name: 'visits_org_status_planned' });
  await qi.addIndex('visits', ['organisation_id', 'planned_on'], { name: 'visits_org_planned' });
  await qi.addIndex('visits', ['advisor_id', 'planned_on'], { name: 'visits_advisor_planned' });
  await qi.addIndex('visits', ['farm_id', 'planned_on'], { name: 'visits_farm_planned' });
  await qi.addIndex('visits', ['rev'], { name: 'visits_rev' });
}

export async function down({ context: qi }: Ctx) {
  for (const table of ['visits', 'farms', 'users', 'organisations']) await qi.dropTable(table);
  await qi.sequelize.query('DROP SEQUENCE IF EXISTS change_rev');
}
