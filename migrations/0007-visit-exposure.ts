import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// The revision at which a visit last became visible to a phone (created, assigned to another
// advisor, restored, or booked into the field). A pull past an older cursor sends such a visit
// whole, with records older than the cursor, exactly once in its revision order.
export async function up({ context: qi }: Ctx) {
  await qi.addColumn('visits', 'exposed_rev', { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 });
  await qi.sequelize.query('UPDATE visits SET exposed_rev = rev');
}

export async function down({ context: qi }: Ctx) {
  await qi.removeColumn('visits', 'exposed_rev');
}
