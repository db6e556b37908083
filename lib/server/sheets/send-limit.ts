import 'server-only';
import { Op } from 'sequelize';
import { SheetSend } from '@/lib/server/db';
import { rateLimited } from '../errors';

// A sheet goes to a farmer, sometimes again or to a second address: far fewer than this in an hour.
// More is mail sent in the organisation's name to anyone, so it waits. Counted from sheet_sends,
// which holds every attempt, so the limit holds across app servers.
export const SHEET_SENDS_PER_HOUR = 20;
const HOUR_MS = 60 * 60 * 1000;

/** Throws a 429 when the sender has sent (or tried to send) too many sheets in the last hour. */
export async function assertMaySendSheet(senderId: string, now = new Date()): Promise<void> {
  const recent = await SheetSend.count({ where: { sentById: senderId, createdAt: { [Op.gte]: new Date(now.getTime() - HOUR_MS) } } });
  if (recent >= SHEET_SENDS_PER_HOUR) {
    throw rateLimited(`You have sent ${recent} sheets in the last hour, the most allowed. Wait a while, then send again.`);
  }
}
