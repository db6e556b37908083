import 'server-only';
import { formatDay } from '@/lib/shared/format';
import { appEnv } from '../env';
import { sendMail } from './transport';

/** An absolute link into the app (NEXTAUTH_URL is its public address). */
export function appLink(path: string): string {
  return new URL(path, appEnv().NEXTAUTH_URL).toString();
}

export interface AssignedVisit { farmName: string; area: string; plannedOn: string | null }

/** Tells an advisor which visits are now theirs; one message however many visits. */
export async function sendAssignmentNotice(to: { email: string; name: string }, visits: AssignedVisit[], by: string) {
  const lines = visits.map((v) => `- ${v.farmName} (${v.area || 'no area given'}), planned ${formatDay(v.plannedOn)}`);
  const subject = visits.length === 1
    ? `Site visit for you: ${visits[0]?.farmName ?? ''}`
    : `${visits.length} site visits for you`;
  await sendMail({
    to: to.email,
    subject,
    text: [
      `Hello ${to.name},`,
      '',
      `${by} has assigned ${visits.length === 1 ? 'a site visit' : 'these site visits'} to you:`,
      ...lines,
      '',
      'They appear on your phone at its next sync (open Fallbook with a signal, or tap "Sync now").',
      `Your visits: ${appLink('/field')}`,
    ].join('\n'),
  });
}

/** The one-time link to set a password; says who invited them and when the link stops working. */
export async function sendInvitation(to: { email: string; name: string }, token: string, organisation: string, by: string, expiresAt: Date) {
  const link = appLink(`/welcome/${token}`);
  await sendMail({
    to: to.email,
    subject: `Your Fallbook account with ${organisation}`,
    text: [
      `Hello ${to.name},`,
      '',
      `${by} has invited you to Fallbook for ${organisation}.`,
      'Open this link to choose your password (it works once):',
      link,
      '',
      `The link stops working on ${expiresAt.toUTCString()}. If it has, ask for a new one.`,
      'If you were not expecting this, ignore this message.',
    ].join('\n'),
  });
}
