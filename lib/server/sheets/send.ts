import 'server-only';
import { SheetSend, Visit, getSequelize } from '@/lib/server/db';
import type { PaperSize, SendSheetBody } from '@/lib/shared/schemas/sheet';
import { sheetEmail } from '@/lib/shared/sheet/email';
import { buildSheetView, type SheetView } from '@/lib/shared/sheet/view-model';
import { canMove } from '@/lib/shared/visit-states';
import type { SessionUser } from '../auth/permissions';
import { recordAudit } from '../audit';
import { loadSheet } from '../data/sheets';
import { moveVisit } from '../data/visit-moves';
import { appEnv } from '../env';
import { invalid } from '../errors';
import { sendMail } from '../mail/transport';
import { sheetFileName } from './file-name';
import { assertMaySendSheet } from './send-limit';
import { renderSheetPdf } from './pdf';

export interface SheetSendView {
  id: string;
  to: string;
  paper: string;
  status: string;
  error: string | null;
  at: string;
  sentById: string | null;
}

/** A send record as the API shows it. */
export function sendView(row: SheetSend): SheetSendView {
  return { id: row.id, to: row.toAddress, paper: row.paper, status: row.status, error: row.error, at: row.updatedAt.toISOString(), sentById: row.sentById };
}

/** The sheet's link and the PDF's file name for a visit. */
export function sheetLink(visitId: string): string {
  return `${appEnv().NEXTAUTH_URL.replace(/\/$/, '')}/sheets/${visitId}`;
}

type SheetContext = Awaited<ReturnType<typeof loadSheet>>;

function recipient(ctx: SheetContext, body: SendSheetBody): string {
  const to = body.to ?? ctx.farmer?.email;
  if (!to) throw invalid('This farm has no farmer with an e-mail address: enter one.', { to: ['Enter an e-mail address.'] });
  return to;
}

function message(user: SessionUser, ctx: SheetContext, view: SheetView, visitId: string, note: string | undefined) {
  return sheetEmail({
    farmerName: ctx.farmer?.name ?? null,
    senderName: user.name,
    farmName: view.farmName,
    verdictWord: view.verdictWord,
    summary: view.summary,
    link: sheetLink(visitId),
    note,
  });
}

/** The e-mail as it would go out (to, subject, text), in the farmer's units, without sending it. */
export async function previewSheetSend(user: SessionUser, visitId: string, body: SendSheetBody): Promise<{ to: string; subject: string; text: string }> {
  const ctx = await loadSheet(user, visitId, 'sheet:send');
  const to = recipient(ctx, body);
  const view = buildSheetView(ctx.source, ctx.farmer?.units ?? 'metric');
  return { to, ...message(user, ctx, view, visitId, body.note) };
}

/**
 * E-mails the visit's sheet (link + PDF in the farmer's units) to the farmer, or to `to`, with the
 * sender's note if any, within the sender's hourly limit. Every attempt is recorded and audited with
 * its address; a refused message is kept as `failed`, so it can be retried.
 */
export async function sendSheet(user: SessionUser, visitId: string, body: SendSheetBody): Promise<SheetSendView> {
  const ctx = await loadSheet(user, visitId, 'sheet:send');
  await assertMaySendSheet(user.id);
  const to = recipient(ctx, body);
  const units = ctx.farmer?.units ?? 'metric';
  const paper: PaperSize = body.paper ?? (units === 'us' ? 'letter' : 'a4');
  const view = buildSheetView(ctx.source, units);
  const pdf = await renderSheetPdf(view, paper);
  const row = await SheetSend.create({
    id: crypto.randomUUID(),
    visitId,
    screeningId: ctx.screeningId,
    sentById: user.id,
    toAddress: to,
    paper,
    status: 'sending',
    error: null,
    messageId: null,
  });
  const mail = message(user, ctx, view, visitId, body.note);
  try {
    const { messageId } = await sendMail({
      to,
      subject: mail.subject,
      text: mail.text,
      attachments: [{ filename: sheetFileName(view.farmName), content: pdf, contentType: 'application/pdf' }],
    });
    await row.update({ status: 'sent', messageId });
  } catch (error) {
    // The mail server's own words stay in the log: they can name hosts, accounts and software.
    console.error('[fallbook] sheet not sent', row.id, error);
    await row.update({
      status: 'failed',
      error: 'The mail server did not take the message. Try again in a few minutes; if it keeps failing, tell whoever runs Fallbook.',
    });
  }
  await getSequelize().transaction(async (transaction) => {
    if (row.status === 'sent') {
      const visit = await Visit.findByPk(visitId, { transaction, rejectOnEmpty: true });
      if (canMove(visit.status, 'sent', 'app')) await moveVisit(visit, 'sent', { by: 'app', actorId: user.id, cause: 'sheet sent' }, transaction);
    }
    await recordAudit(
      {
        organisationId: ctx.visit.organisationId,
        actorId: user.id,
        entity: 'sheet_send',
        entityId: row.id,
        visitId,
        action: row.status === 'sent' ? 'sheet_sent' : 'sheet_send_failed',
        changes: { to, paper, error: row.error },
      },
      transaction,
    );
  });
  return sendView(row);
}
