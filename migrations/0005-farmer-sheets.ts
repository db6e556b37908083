import { DataTypes, type QueryInterface } from 'sequelize';
import { id, ownedBy, timestamps } from './support';

type Ctx = { context: QueryInterface };

// The farmer's sheet: every send of it (who, when, to whom, how it went), the farmer's
// acknowledgements and questions, and what the farmer said about where the tank should go.
export async function up({ context: qi }: Ctx) {
  await qi.createTable('sheet_sends', {
    id,
    visit_id: ownedBy('visits'),
    screening_id: ownedBy('screenings'),
    sent_by_id: { type: DataTypes.UUID, allowNull: true },
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    paper: { type: DataTypes.STRING(8), allowNull: false },
    status: { type: DataTypes.STRING(8), allowNull: false },
    error: { type: DataTypes.STRING(500), allowNull: true },
    message_id: { type: DataTypes.STRING(255), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('sheet_sends', ['visit_id', 'created_at'], { name: 'sheet_sends_visit_created' });

  await qi.createTable('sheet_responses', {
    id,
    visit_id: ownedBy('visits'),
    screening_id: ownedBy('screenings'),
    farmer_id: { type: DataTypes.UUID, allowNull: false },
    kind: { type: DataTypes.STRING(12), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('sheet_responses', ['visit_id', 'created_at'], { name: 'sheet_responses_visit_created' });

  await qi.createTable('farm_needs', {
    farm_id: { ...ownedBy('farms'), primaryKey: true },
    tank_site: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
    updated_by_id: { type: DataTypes.UUID, allowNull: true },
    ...timestamps,
  });
}

export async function down({ context: qi }: Ctx) {
  for (const table of ['farm_needs', 'sheet_responses', 'sheet_sends']) await qi.dropTable(table);
}
