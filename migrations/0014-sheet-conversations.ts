import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// The sheet's thread: a line is written by the farmer (read it, go ahead, not now, a question) or by
// the advisor or a coordinator (an answer), so its writer is the author, not always the farmer; an
// answer names the question it answers. Open questions are questions no answer names.
export async function up({ context: qi }: Ctx) {
  await qi.renameColumn('sheet_responses', 'farmer_id', 'author_id');
  await qi.addColumn('sheet_responses', 'reply_to_id', { type: DataTypes.UUID, allowNull: true });
  await qi.addIndex('sheet_responses', ['reply_to_id'], { name: 'sheet_responses_reply_to' });
  await qi.addIndex('sheet_responses', ['kind', 'created_at'], { name: 'sheet_responses_kind_created' });
}

export async function down({ context: qi }: Ctx) {
  await qi.removeIndex('sheet_responses', 'sheet_responses_kind_created');
  await qi.removeIndex('sheet_responses', 'sheet_responses_reply_to');
  await qi.removeColumn('sheet_responses', 'reply_to_id');
  await qi.renameColumn('sheet_responses', 'author_id', 'farmer_id');
}
