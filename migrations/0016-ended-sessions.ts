import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// Sessions are signed tokens the server does not store; a session ended by signing out is listed
// here (by its id) until the token would have expired anyway, so the same cookie is refused after.
export async function up({ context: qi }: Ctx) {
  await qi.createTable('ended_sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true, allowNull: false },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('ended_sessions', ['expires_at'], { name: 'ended_sessions_expires' });
}

export async function down({ context: qi }: Ctx) {
  await qi.dropTable('ended_sessions');
}
