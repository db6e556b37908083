import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// An invitation link stops working when a newer one is sent to the same person (superseded_at) or
// when the office switches the account off (withdrawn_at); a link sent before either never
// switches an account back on. Existing rows get the same treatment as new ones would have.
export async function up({ context: qi }: Ctx) {
  await qi.addColumn('invitations', 'superseded_at', { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn('invitations', 'withdrawn_at', { type: DataTypes.DATE(3), allowNull: true });
  await qi.sequelize.query(
    `UPDATE invitations i JOIN invitations n ON n.user_id = i.user_id AND n.created_at > i.created_at
     SET i.superseded_at = CURRENT_TIMESTAMP(3) WHERE i.used_at IS NULL AND i.superseded_at IS NULL`,
  );
  await qi.sequelize.query(
    `UPDATE invitations i JOIN users u ON u.id = i.user_id
     SET i.withdrawn_at = CURRENT_TIMESTAMP(3) WHERE i.used_at IS NULL AND u.active = 0`,
  );
}

export async function down({ context: qi }: Ctx) {
  await qi.removeColumn('invitations', 'withdrawn_at');
  await qi.removeColumn('invitations', 'superseded_at');
}
