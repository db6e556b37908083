import 'server-only';
import { formatDateTime } from '@/lib/shared/display/dates';
import { sendMail } from './transport';
import { appLink } from './notices';

export interface QuestionMail {
  farmName: string;
  farmerName: string;
  text: string;
  at: Date;
  visitId: string;
}

/** Tells the assigned advisor and the coordinators that a farmer asked a question on a sheet. */
export async function sendQuestionNotice(to: { email: string; name: string }, q: QuestionMail): Promise<void> {
  await sendMail({
    to: to.email,
    subject: `Question from ${q.farmerName} about ${q.farmName}`,
    text: [
      `Hello ${to.name},`,
      '',
      `${q.farmerName} asked a question on the sheet for ${q.farmName} (${formatDateTime(q.at)}):`,
      '',
      ...q.text.split('\n').map((l) => `> ${l}`),
      '',
      `Answer it on the sheet: ${appLink(`/sheets/${q.visitId}#conversation`)}`,
      'The farmer gets your answer by e-mail.',
    ].join('\n'),
  });
}

/** Sends the farmer the answer to their question, with the question it answers. */
export async function sendAnswerNotice(
  to: { email: string; name: string },
  a: { farmName: string; question: string; answer: string; by: string; at: Date; visitId: string },
): Promise<void> {
  await sendMail({
    to: to.email,
    subject: `Answer to your question about ${a.farmName}`,
    text: [
      `Hello ${to.name},`,
      '',
      'You asked:',
      ...a.question.split('\n').map((l) => `> ${l}`),
      '',
      `${a.by} answered (${formatDateTime(a.at)}):`,
      '',
      a.answer,
      '',
      `The whole conversation is on your sheet: ${appLink(`/sheets/${a.visitId}#conversation`)}`,
    ].join('\n'),
  });
}
