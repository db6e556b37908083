import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { Screening, SheetResponse, SheetSend, User, Visit, getSequelize } from '@/lib/server/db';
import type { OpenQuestion } from '@/lib/shared/conversation';
import type { Role } from '@/lib/shared/domain';
import type { SheetResponseKind } from '@/models/sheet-response';
import type { SessionUser } from '../auth/permissions';
import { recordAudit } from '../audit';
import { invalid, notFound } from '../errors';
import { sendAnswerNotice, sendQuestionNotice } from '../mail/conversation-notices';
import { sendView } from '../sheets/send';
import { getSheetVisitOrThrow } from './sheets';
import { moveVisit } from './visit-moves';

/** One line of a sheet's thread as pages and the API show it: who said what, when. */
export interface SheetResponseView {
  id: string;
  kind: SheetResponseKind;
  text: string;
  at: string;
  author: { name: string; role: Role | null };
  /** For an answer: the question it answers. For a question: whether an answer names it. */
  replyToId: string | null;
  answered?: boolean;
}

async function latestScreeningId(visitId: string): Promise<string> {
  const s = await Screening.findOne({ where: { visitId }, order: [['createdAt', 'DESC']], attributes: ['id'] });
  if (!s) throw notFound('sheet: this visit has not been screened yet');
  return s.id;
}

function toView(r: SheetResponse, authors: Map<string, { name: string; role: Role }>, answered: Set<string>): SheetResponseView {
  const author = authors.get(r.authorId);
  return {
    id: r.id,
    kind: r.kind,
    text: r.text,
    at: r.createdAt.toISOString(),
    author: { name: author?.name ?? 'Someone no longer here', role: author?.role ?? null },
    replyToId: r.replyToId,
    ...(r.kind === 'question' ? { answered: answered.has(r.id) } : {}),
  };
}

async function authorsOf(rows: SheetResponse[]) {
  const ids = [...new Set(rows.map((r) => r.authorId))];
  const users = ids.length ? await User.findAll({ where: { id: ids }, attributes: ['id', 'name', 'role'] }) : [];
  return new Map(users.map((u) => [u.id, { name: u.name, role: u.role as Role }]));
}

/** The sheet's thread, oldest first: the farmer's reading, decisions and questions, and the answers. */
export async function listSheetResponses(user: SessionUser, visitId: string): Promise<SheetResponseView[]> {
  await getSheetVisitOrThrow(user, visitId, 'sheet:read');
  const rows = await SheetResponse.findAll({
    where: { visitId },
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
    limit: 500,
  });
  const answered = new Set(rows.filter((r) => r.kind === 'answer' && r.replyToId).map((r) => r.replyToId as string));
  const authors = await authorsOf(rows);
  return rows.map((r) => toView(r, authors, answered));
}

const SELF = (user: SessionUser) => new Map([[user.id, { name: user.name, role: user.role }]]);

/** "I have read it": recorded once; a sent sheet's visit moves to "Farmer has read it". Not a decision. */
export async function acknowledgeSheet(user: SessionUser, visitId: string): Promise<SheetResponseView> {
  const visit = await getSheetVisitOrThrow(user, visitId, 'sheet:acknowledge');
  const screeningId = await latestScreeningId(visitId);
  const row = await getSequelize().transaction(async (transaction) => {
    const earlier = await SheetResponse.findOne({ where: { visitId, authorId: user.id, kind: 'acknowledged' }, transaction });
    if (earlier) return earlier;
    const created = await SheetResponse.create(
      { id: crypto.randomUUID(), visitId, screeningId, authorId: user.id, kind: 'acknowledged', text: 'I have read the sheet.', replyToId: null },
      { transaction },
    );
    const fresh = await Visit.findByPk(visitId, { transaction, lock: transaction.LOCK.UPDATE, rejectOnEmpty: true });
    if (fresh.status === 'sent') await moveVisit(fresh, 'acknowledged', { by: 'farmer', actorId: user.id, cause: 'farmer read the sheet' }, transaction);
    await recordAudit(
      {
        organisationId: visit.organisationId,
        actorId: user.id,
        entity: 'sheet_response',
        entityId: created.id,
        visitId,
        action: 'sheet_acknowledged',
        changes: { screeningId },
      },
      transaction,
    );
    return created;
  });
  return toView(row, SELF(user), new Set());
}

/** The farmer's decision on a sent sheet: go ahead, or not now with a reason; the visit moves with it. */
export async function decideOnSheet(user: SessionUser, visitId: string, decision: 'go-ahead' | 'not-now', reason: string): Promise<SheetResponseView> {
  const visit = await getSheetVisitOrThrow(user, visitId, 'sheet:decide');
  const screeningId = await latestScreeningId(visitId);
  const row = await getSequelize().transaction(async (transaction) => {
    const fresh = await Visit.findByPk(visitId, { transaction, lock: transaction.LOCK.UPDATE, rejectOnEmpty: true });
    // Throws the table's 409 when the visit is past deciding (installed, commissioned, cancelled).
    await moveVisit(fresh, decision === 'go-ahead' ? 'agreed' : 'declined', { by: 'farmer', actorId: user.id, cause: 'farmer’s decision' }, transaction);
    const created = await SheetResponse.create(
      { id: crypto.randomUUID(), visitId, screeningId, authorId: user.id, kind: decision, text: reason, replyToId: null },
      { transaction },
    );
    await recordAudit(
      {
        organisationId: visit.organisationId,
        actorId: user.id,
        entity: 'sheet_response',
        entityId: created.id,
        visitId,
        action: decision === 'go-ahead' ? 'sheet_go_ahead' : 'sheet_not_now',
        changes: { screeningId, reason },
      },
      transaction,
    );
    return created;
  });
  return toView(row, SELF(user), new Set());
}

// Mail goes after the commit; a refused message is logged, never undoes the question or answer.
async function mailQuietly(what: string, send: () => Promise<void>): Promise<boolean> {
  try {
    await send();
    return true;
  } catch (error) {
    console.error(`[fallbook] ${what} not sent`, error);
    return false;
  }
}

/** The farmer's question: stored, then the assigned advisor and every active coordinator are e-mailed. */
export async function askQuestion(user: SessionUser, visitId: string, text: string): Promise<SheetResponseView & { told: number }> {
  const visit = await getSheetVisitOrThrow(user, visitId, 'sheet:acknowledge');
  const screeningId = await latestScreeningId(visitId);
  const row = await getSequelize().transaction(async (transaction) => {
    const created = await SheetResponse.create(
      { id: crypto.randomUUID(), visitId, screeningId, authorId: user.id, kind: 'question', text, replyToId: null },
      { transaction },
    );
    await recordAudit(
      {
        organisationId: visit.organisationId,
        actorId: user.id,
        entity: 'sheet_response',
        entityId: created.id,
        visitId,
        action: 'sheet_question',
        changes: { text },
      },
      transaction,
    );
    return created;
  });
  const staff = await User.findAll({
    where: {
      organisationId: visit.organisationId,
      active: true,
      [Op.or]: [{ role: 'coordinator' }, ...(visit.advisorId ? [{ id: visit.advisorId, role: 'advisor' }] : [])],
    },
    attributes: ['id', 'name', 'email'],
  });
  const mail = { farmName: visit.Farm?.name ?? '', farmerName: user.name, text, at: row.createdAt, visitId };
  const sent = await Promise.all(staff.map((s) => mailQuietly('question notice', () => sendQuestionNotice({ email: s.email, name: s.name }, mail))));
  return { ...toView(row, SELF(user), new Set()), told: sent.filter(Boolean).length };
}

/** An answer by the assigned advisor or a coordinator to one question; the farmer is e-mailed it. */
export async function answerQuestion(
  user: SessionUser,
  visitId: string,
  questionId: string,
  text: string,
): Promise<SheetResponseView & { farmerTold: boolean }> {
  const visit = await getSheetVisitOrThrow(user, visitId, 'sheet:answer');
  const question = await SheetResponse.findOne({ where: { id: questionId, visitId, kind: 'question' } });
  if (!question) throw invalid('questionId: Choose a question on this sheet.', { questionId: ['Choose a question on this sheet.'] });
  const row = await getSequelize().transaction(async (transaction) => {
    const created = await SheetResponse.create(
      { id: crypto.randomUUID(), visitId, screeningId: question.screeningId, authorId: user.id, kind: 'answer', text, replyToId: question.id },
      { transaction },
    );
    await recordAudit(
      {
        organisationId: visit.organisationId,
        actorId: user.id,
        entity: 'sheet_response',
        entityId: created.id,
        visitId,
        action: 'sheet_answer',
        changes: { questionId, text },
      },
      transaction,
    );
    return created;
  });
  const farmer = question.authorId ? await User.findOne({ where: { id: question.authorId, active: true }, attributes: ['name', 'email'] }) : null;
  const farmerTold = farmer
    ? await mailQuietly('answer notice', () =>
        sendAnswerNotice(
          { email: farmer.email, name: farmer.name },
          { farmName: visit.Farm?.name ?? '', question: question.text, answer: text, by: user.name, at: row.createdAt, visitId },
        ),
      )
    : false;
  return { ...toView(row, SELF(user), new Set()), farmerTold };
}

/** Questions still waiting for an answer: the organisation's (coordinators) or on the caller's visits (advisors), oldest first. */
export async function listOpenQuestions(user: SessionUser, limit = 50): Promise<OpenQuestion[]> {
  if (user.role !== 'coordinator' && user.role !== 'advisor') return [];
  const scope = user.role === 'advisor' ? 'AND v.advisor_id = ?' : '';
  const rows = await getSequelize().query<{ id: string; visitId: string; farmName: string; farmerName: string | null; text: string; at: Date }>(
    `SELECT q.id, q.visit_id AS visitId, f.name AS farmName, u.name AS farmerName, q.text, q.created_at AS at
       FROM sheet_responses q
       JOIN visits v ON v.id = q.visit_id AND v.organisation_id = ? AND v.deleted_at IS NULL ${scope}
       JOIN farms f ON f.id = v.farm_id
       LEFT JOIN users u ON u.id = q.author_id
      WHERE q.kind = 'question' AND NOT EXISTS (SELECT 1 FROM sheet_responses a WHERE a.reply_to_id = q.id)
      ORDER BY q.created_at ASC, q.id ASC LIMIT ?`,
    { replacements: user.role === 'advisor' ? [user.organisationId, user.id, limit] : [user.organisationId, limit], type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: r.id,
    visitId: r.visitId,
    farmName: r.farmName,
    farmerName: r.farmerName ?? '',
    text: r.text,
    at: new Date(r.at).toISOString(),
  }));
}

/** Every send of the visit's sheet, newest first (advisor and coordinator). */
export async function listSheetSends(user: SessionUser, visitId: string) {
  await getSheetVisitOrThrow(user, visitId, 'sheet:send');
  const rows = await SheetSend.findAll({
    where: { visitId },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'ASC'],
    ],
    limit: 50,
  });
  return rows.map(sendView);
}
