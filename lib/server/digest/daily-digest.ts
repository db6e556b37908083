import 'server-only';
import { QueryTypes } from 'sequelize';
import { Organisation, User, getSequelize } from '@/lib/server/db';
import type { Role } from '@/lib/shared/domain';
import { formatDateTime, formatDay } from '@/lib/shared/display/dates';
import { todayIso } from '@/lib/shared/visit-rules';
import { appLink } from '../mail/notices';
import { sendMail } from '../mail/transport';

// A coordinator's morning in one e-mail: what is late, who is waiting for an answer, which sheets
// nobody has read, and which sends failed. Each advisor gets the same for their own visits. A
// person with nothing in any list gets no mail.

/** Days a sent sheet may stay unread before the digest names it (time for the farmer to open it). */
export const UNREAD_AFTER_DAYS = 3;
/** The most lines one list shows; the rest is counted and linked. */
const LIST_MAX = 25;

interface Line {
  visitId: string;
  advisorId: string | null;
  farmName: string;
  text: string;
}

export interface DigestSections {
  overdue: Line[];
  questions: Line[];
  unread: Line[];
  failed: Line[];
}

export interface Digest {
  to: { id: string; email: string; name: string; role: Role };
  subject: string;
  text: string;
  counts: Record<keyof DigestSections, number>;
}

const daysBetween = (from: string, to: string) => Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** The organisation's four lists as of `now`, for every advisor at once (the digests filter them). */
export async function digestSections(organisationId: string, now = new Date()): Promise<DigestSections> {
  const sequelize = getSequelize();
  const today = todayIso(now);
  const unreadBefore = new Date(now.getTime() - UNREAD_AFTER_DAYS * 86_400_000);
  const q = <T extends object>(sql: string, replacements: unknown[]) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  const [overdue, questions, unread, failed] = await Promise.all([
    q<{ visitId: string; advisorId: string | null; farmName: string; plannedOn: string; advisorName: string | null }>(
      `SELECT v.id AS visitId, v.advisor_id AS advisorId, f.name AS farmName, DATE_FORMAT(v.planned_on, '%Y-%m-%d') AS plannedOn, a.name AS advisorName
         FROM visits v JOIN farms f ON f.id = v.farm_id LEFT JOIN users a ON a.id = v.advisor_id
        WHERE v.organisation_id = ? AND v.deleted_at IS NULL AND v.status IN ('requested', 'scheduled') AND v.planned_on < ?
        ORDER BY v.planned_on ASC, f.name ASC`,
      [organisationId, today],
    ),
    q<{ visitId: string; advisorId: string | null; farmName: string; farmerName: string | null; text: string; at: Date }>(
      `SELECT v.id AS visitId, v.advisor_id AS advisorId, f.name AS farmName, u.name AS farmerName, r.text, r.created_at AS at
         FROM sheet_responses r JOIN visits v ON v.id = r.visit_id AND v.organisation_id = ? AND v.deleted_at IS NULL
         JOIN farms f ON f.id = v.farm_id LEFT JOIN users u ON u.id = r.author_id
        WHERE r.kind = 'question' AND NOT EXISTS (SELECT 1 FROM sheet_responses a WHERE a.reply_to_id = r.id)
        ORDER BY r.created_at ASC, r.id ASC`,
      [organisationId],
    ),
    q<{ visitId: string; advisorId: string | null; farmName: string; sentAt: Date; toAddress: string }>(
      `SELECT v.id AS visitId, v.advisor_id AS advisorId, f.name AS farmName, s.created_at AS sentAt, s.to_address AS toAddress
         FROM visits v JOIN farms f ON f.id = v.farm_id
         JOIN sheet_sends s ON s.id = (SELECT s2.id FROM sheet_sends s2 WHERE s2.visit_id = v.id AND s2.status = 'sent' ORDER BY s2.created_at DESC, s2.id DESC LIMIT 1)
        WHERE v.organisation_id = ? AND v.deleted_at IS NULL AND v.status = 'sent' AND s.created_at < ?
        ORDER BY s.created_at ASC, f.name ASC`,
      [organisationId, unreadBefore],
    ),
    q<{ visitId: string; advisorId: string | null; farmName: string; at: Date; toAddress: string }>(
      `SELECT v.id AS visitId, v.advisor_id AS advisorId, f.name AS farmName, s.created_at AS at, s.to_address AS toAddress
         FROM sheet_sends s JOIN visits v ON v.id = s.visit_id AND v.organisation_id = ? AND v.deleted_at IS NULL
         JOIN farms f ON f.id = v.farm_id
        WHERE s.status = 'failed'
          AND s.id = (SELECT s2.id FROM sheet_sends s2 WHERE s2.visit_id = v.id ORDER BY s2.created_at DESC, s2.id DESC LIMIT 1)
        ORDER BY s.created_at ASC, f.name ASC`,
      [organisationId],
    ),
  ]);
  return {
    overdue: overdue.map((r) => {
      const late = daysBetween(r.plannedOn, today);
      return {
        visitId: r.visitId,
        advisorId: r.advisorId,
        farmName: r.farmName,
        text: `${r.farmName}: planned for ${formatDay(r.plannedOn)}, ${plural(late, 'day')} ago; ${r.advisorName ? `with ${r.advisorName}` : 'no advisor yet'}`,
      };
    }),
    questions: questions.map((r) => ({
      visitId: r.visitId,
      advisorId: r.advisorId,
      farmName: r.farmName,
      text: `${r.farmName}: ${r.farmerName ?? 'the farmer'} asked on ${formatDateTime(r.at)}: “${oneLine(r.text)}”`,
    })),
    unread: unread.map((r) => ({
      visitId: r.visitId,
      advisorId: r.advisorId,
      farmName: r.farmName,
      text: `${r.farmName}: sent to ${r.toAddress} on ${formatDateTime(r.sentAt)}, not read yet`,
    })),
    failed: failed.map((r) => ({
      visitId: r.visitId,
      advisorId: r.advisorId,
      farmName: r.farmName,
      text: `${r.farmName}: the e-mail to ${r.toAddress} on ${formatDateTime(r.at)} failed; send it again from the sheet`,
    })),
  };
}

// A question's first 120 characters on one line: the whole of it is on the sheet.
function oneLine(text: string): string {
  const flat = text.replace(/\s+/g, ' ').trim();
  return flat.length > 120 ? `${flat.slice(0, 119)}…` : flat;
}

const HEADINGS: Record<keyof DigestSections, string> = {
  overdue: 'Visits past their planned day',
  questions: 'Questions waiting for an answer',
  unread: `Sheets sent more than ${UNREAD_AFTER_DAYS} days ago and not read yet`,
  failed: 'Sheet e-mails that did not go out',
};

// Where each line leads: the office's visit page for a coordinator; for an advisor the sheet (where
// questions are answered and sheets sent) or the visit on the phone.
function linkFor(role: Role, section: keyof DigestSections, visitId: string): string {
  if (role === 'coordinator') return appLink(section === 'questions' ? `/sheets/${visitId}#conversation` : `/office/visits/${visitId}`);
  return appLink(section === 'overdue' ? `/field/visit?id=${visitId}` : `/sheets/${visitId}${section === 'questions' ? '#conversation' : ''}`);
}

/** One person's digest from the organisation's lists, or null when every list is empty. */
export function composeDigest(to: Digest['to'], all: DigestSections, today: string): Digest | null {
  const mine = (lines: Line[]) => (to.role === 'coordinator' ? lines : lines.filter((l) => l.advisorId === to.id));
  const sections: DigestSections = { overdue: mine(all.overdue), questions: mine(all.questions), unread: mine(all.unread), failed: mine(all.failed) };
  const keys = Object.keys(HEADINGS) as (keyof DigestSections)[];
  const counts = Object.fromEntries(keys.map((k) => [k, sections[k].length])) as Digest['counts'];
  if (keys.every((k) => counts[k] === 0)) return null;
  const summary = [
    counts.overdue && plural(counts.overdue, 'overdue visit'),
    counts.questions && plural(counts.questions, 'open question'),
    counts.unread && plural(counts.unread, 'unread sheet'),
    counts.failed && plural(counts.failed, 'failed send'),
  ]
    .filter(Boolean)
    .join(', ');
  const body: string[] = [
    `Hello ${to.name},`,
    '',
    to.role === 'coordinator'
      ? `Here is what needs you in the district this morning (${formatDay(today)}):`
      : `Here is what needs you on your visits this morning (${formatDay(today)}):`,
  ];
  for (const k of keys) {
    const lines = sections[k];
    if (!lines.length) continue;
    body.push('', `${HEADINGS[k]} (${lines.length})`);
    for (const line of lines.slice(0, LIST_MAX)) body.push(`- ${line.text}`, `  ${linkFor(to.role, k, line.visitId)}`);
    if (lines.length > LIST_MAX) body.push(`- and ${lines.length - LIST_MAX} more: ${appLink(to.role === 'coordinator' ? '/office/visits' : '/field')}`);
  }
  body.push(
    '',
    to.role === 'coordinator' ? `The office: ${appLink('/office')}` : `Your visits: ${appLink('/field')}`,
    'This e-mail comes each morning when something is waiting; on a quiet day none comes.',
  );
  return { to, subject: `Fallbook this morning: ${summary}`, text: body.join('\n'), counts };
}

/** Every digest the organisation's active coordinators and advisors would get now (empty ones left out). */
export async function buildDigests(organisationId: string, now = new Date()): Promise<Digest[]> {
  const [sections, people] = await Promise.all([
    digestSections(organisationId, now),
    User.findAll({
      where: { organisationId, active: true, role: ['coordinator', 'advisor'] },
      attributes: ['id', 'email', 'name', 'role'],
      order: [['name', 'ASC']],
    }),
  ]);
  const today = todayIso(now);
  return people.flatMap((p) => {
    const digest = composeDigest({ id: p.id, email: p.email, name: p.name, role: p.role as Role }, sections, today);
    return digest ? [digest] : [];
  });
}

/** Builds and sends every organisation's digests; a refused message is logged and the rest still go. */
export async function sendDailyDigests(now = new Date(), organisationIds?: string[]): Promise<{ sent: number; failed: number }> {
  const ids = organisationIds ?? (await Organisation.findAll({ attributes: ['id'] })).map((o) => o.id);
  let sent = 0;
  let failed = 0;
  for (const id of ids) {
    for (const digest of await buildDigests(id, now)) {
      try {
        await sendMail({ to: digest.to.email, subject: digest.subject, text: digest.text });
        sent++;
      } catch (error) {
        failed++;
        console.error(`[fallbook] daily digest to ${digest.to.email} failed:`, error);
      }
    }
  }
  return { sent, failed };
}
