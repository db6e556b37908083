import 'server-only';
import { formatDay } from '@/lib/shared/display/dates';
import { appEnv } from '../env';
import { sendMail } from './transport';

/** An absolute link into the app (NEXTAUTH_URL is its public address). */
export function appLink(path: string): string {
  return new URL(path, appEnv().NEXTAUTH_URL).toString();
}

export interface AssignedVisit {
  farmName: string;
  area: string;
  plannedOn: string | null;
}

/** Tells an advisor which visits are now theirs; one message however many visits. */
export async function sendAssignmentNotice(to: { email: string; name: string }, visits: AssignedVisit[], by: string) {
  const lines = visits.map(
    (v) => `- ${v.farmName} (${v.area || 'no area given'}), ${v.plannedOn ? `planned ${formatDay(v.plannedOn)}` : 'no date yet: it will be agreed with you'}`,
  );
  const subject = visits.length === 1 ? `Site visit for you: ${visits[0]?.farmName ?? ''}` : `${visits.length} site visits for you`;
  await sendMail({
    to: to.email,
    subject,
    text: [
      `Hello ${to.name},`,
      '',
      `${by} has assigned ${visits.length === 1 ? 'a site visit' : 'these site visits'} to you:`,
      ...lines,
      '',
      // True for every assigned visit, dated or not: the pull sends an advisor all visits assigned to them.
      `${visits.length === 1 ? 'It comes' : 'They come'} onto your phone at its next sync (open Fallbook with a signal, or tap "Sync now").`,
      `Your visits: ${appLink('/field')}`,
    ].join('\n'),
  });
}

/** Tells the advisor a visit was theirs that it now goes to someone else; their phone drops it at its next sync. */
export async function sendReassignedAwayNotice(to: { email: string; name: string }, visits: (AssignedVisit & { newAdvisor: string })[], by: string) {
  const lines = visits.map(
    (v) => `- ${v.farmName} (${v.area || 'no area given'}): now with ${v.newAdvisor}${v.plannedOn ? `, planned ${formatDay(v.plannedOn)}` : ''}`,
  );
  await sendMail({
    to: to.email,
    subject: visits.length === 1 ? `Site visit moved to another advisor: ${visits[0]?.farmName ?? ''}` : `${visits.length} site visits moved to other advisors`,
    text: [
      `Hello ${to.name},`,
      '',
      `${by} has given ${visits.length === 1 ? 'this site visit' : 'these site visits'} to another advisor:`,
      ...lines,
      '',
      `${visits.length === 1 ? 'It leaves' : 'They leave'} your phone at its next sync, and the server no longer takes changes to ${visits.length === 1 ? 'it' : 'them'} from you.`,
      'If your phone holds readings that have not been sent yet, tell your coordinator before you sync.',
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
