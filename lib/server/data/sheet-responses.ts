import 'server-only';
import { Screening, SheetResponse, SheetSend, User, Visit, getSequelize } from '@/lib/server/db';
import type { SessionUser } from '../auth/permissions';
import { recordAudit } from '../audit';
import { notFound } from '../errors';
import { sendView } from '../sheets/send';
import { getSheetVisitOrThrow } from './sheets';

export interface SheetResponseView { id: string; kind: string; text: string; at: string; farmer: string }

async function latestScreeningId(visitId: string): Promise<string> {
  const s = await Screening.findOne({ where: { visitId }, order: [['createdAt', 'DESC']], attributes: ['id'] });
  if (!s) throw notFound('sheet: this visit has not been screened yet');
  return s.id;
}

/** The farmer's acknowledgements and questions on a visit's sheet, oldest first. */
export async function listSheetResponses(user: SessionUser, visitId: string): Promise<SheetResponseView[]> {
  await getSheetVisitOrThrow(user, visitId, 'sheet:read');
  const rows = await SheetResponse.findAll({ where: { visitId }, order: [['createdAt', 'ASC'], ['id', 'ASC']], limit: 200 });
  const names = new Map((await User.findAll({ where: { id: [...new Set(rows.map((r) => r.farmerId))] }, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]));
  return rows.map((r) => ({ id: r.id, kind: r.kind, text: r.text, at: r.createdAt.toISOString(), farmer: names.get(r.farmerId) ?? '' }));
}

/** Records the farmer's question or acknowledgement; an acknowledgement moves the visit on. */
export async function respondToSheet(user: SessionUser, visitId: string, kind: 'acknowledged' | 'question', text: string): Promise<SheetResponseView> {
  const visit = await getSheetVisitOrThrow(user, visitId, 'sheet:acknowledge');
  const screeningId = await latestScreeningId(visitId);
  const row = await getSequelize().transaction(async (transaction) => {
    const created = await SheetResponse.create({ id: crypto.randomUUID(), visitId, screeningId, farmerId: user.id, kind, text }, { transaction });
    if (kind === 'acknowledged') {
      const fresh = await Visit.findByPk(visitId, { transaction, rejectOnEmpty: true });
      if (['surveyed', 'screened', 'sent'].includes(fresh.status)) await fresh.update({ status: 'acknowledged' }, { transaction });
    }
    await recordAudit({ organisationId: visit.organisationId, actorId: user.id, entity: 'sheet_response', entityId: created.id, visitId,
      action: kind === 'acknowledged' ? 'sheet_acknowledged' : 'sheet_question', changes: { screeningId, text } }, transaction);
    return created;
  });
  return { id: row.id, kind: row.kind, text: row.text, at: row.createdAt.toISOString(), farmer: user.name };
}

/** Every send of the visit's sheet, newest first (advisor and coordinator). */
export async function listSheetSends(user: SessionUser, visitId: string) {
  await getSheetVisitOrThrow(user, visitId, 'sheet:send');
  const rows = await SheetSend.findAll({ where: { visitId }, order: [['createdAt', 'DESC'], ['id', 'ASC']], limit: 50 });
  return rows.map(sendView);
}
