import { DataTypes, type QueryInterface } from 'sequelize';
import { id, ownedBy } from './support';

type Ctx = { context: QueryInterface };

// The coordinator's office: one-time invitations (token kept only as its sha-256) and the indexes
// the visits table's filters and sorts use.
export async function up({ context: qi }: Ctx) {
  await qi.createTable('invitations', {
    id,
    organisation_id: ownedBy('organisations'),
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(160), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    invited_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    user_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('invitations', ['organisation_id', 'created_at'], { name: 'invitations_org_created' });
  await qi.addIndex('invitations', ['email'], { name: 'invitations_email' });

  // Filters of the visits table: by advisor within the organisation, by last sync, by farm area.
  await qi.addIndex('visits', ['organisation_id', 'advisor_id', 'planned_on'], { name: 'visits_org_advisor_planned' });
  await qi.addIndex('visits', ['organisation_id', 'last_synced_at'], { name: 'visits_org_synced' });
  await qi.addIndex('visits', ['organisation_id', 'updated_at'], { name: 'visits_org_updated' });
  await qi.addIndex('farms', ['organisation_id', 'area'], { name: 'farms_org_area' });
  await qi.addIndex('users', ['organisation_id', 'name'], { name: 'users_org_name' });
}

export async function down({ context: qi }: Ctx) {
  await qi.removeIndex('users', 'users_org_name');
  await qi.removeIndex('farms', 'farms_org_area');
  await qi.removeIndex('visits', 'visits_org_updated');
  await qi.removeIndex('visits', 'visits_org_synced');
  await qi.removeIndex('visits', 'visits_org_advisor_planned');
  await qi.dropTable('invitations');
}
