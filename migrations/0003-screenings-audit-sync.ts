import { DataTypes, type QueryInterface } from 'sequelize';
import { id, ownedBy } from './support';

type Ctx = { context: QueryInterface };

export async function up({ context: qi }: Ctx) {
  await qi.createTable('screenings', {
    id,
    visit_id: ownedBy('visits'),
    engine_version: { type: DataTypes.STRING(24), allowNull: false },
    inputs_hash: { type: DataTypes.CHAR(64), allowNull: false },
    inputs: { type: DataTypes.JSON, allowNull: false },
    result: { type: DataTypes.JSON, allowNull: false },
    verdict: { type: DataTypes.STRING(12), allowNull: false },
    probability_meets_demand: { type: DataTypes.DOUBLE, allowNull: true },
    delivery_lpd: { type: DataTypes.DOUBLE, allowNull: true },
    demand_lpd: { type: DataTypes.DOUBLE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('screenings', ['visit_id', 'created_at'], { name: 'screenings_visit_created' });
  await qi.addIndex('screenings', ['visit_id', 'inputs_hash'], { name: 'screenings_visit_inputs' });

  await qi.createTable('audit_log', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    organisation_id: ownedBy('organisations'),
    actor_id: { type: DataTypes.UUID, allowNull: true },
    entity: { type: DataTypes.STRING(32), allowNull: false },
    entity_id: { type: DataTypes.STRING(36), allowNull: false },
    visit_id: { type: DataTypes.UUID, allowNull: true },
    action: { type: DataTypes.STRING(32), allowNull: false },
    changes: { type: DataTypes.JSON, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('audit_log', ['visit_id', 'created_at'], { name: 'audit_visit_created' });
  await qi.addIndex('audit_log', ['organisation_id', 'created_at'], { name: 'audit_org_created' });
  await qi.addIndex('audit_log', ['entity', 'entity_id'], { name: 'audit_entity' });

  await qi.createTable('sync_ops', {
    op_id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    user_id: { type: DataTypes.UUID, allowNull: false },
    entity: { type: DataTypes.STRING(32), allowNull: false },
    entity_id: { type: DataTypes.STRING(36), allowNull: false },
    outcome: { type: DataTypes.JSON, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('sync_ops', ['user_id', 'created_at'], { name: 'sync_ops_user_created' });

  await qi.createTable('sign_in_attempts', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    address: { type: DataTypes.STRING(64), allowNull: false },
    succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('sign_in_attempts', ['email', 'created_at'], { name: 'sign_in_email_created' });
  await qi.addIndex('sign_in_attempts', ['address', 'created_at'], { name: 'sign_in_address_created' });
}

export async function down({ context: qi }: Ctx) {
  for (const table of ['sign_in_attempts', 'sync_ops', 'audit_log', 'screenings']) await qi.dropTable(table);
}
