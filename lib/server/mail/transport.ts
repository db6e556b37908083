import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import type Mail from 'nodemailer/lib/mailer';
import { appEnv } from '../env';

let transporter: Transporter | undefined;

// SMTP settings from .env: the local fake server by default, a real relay when credentials are set.
function getTransporter(): Transporter {
  if (!transporter) {
    const env = appEnv();
    const auth = env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? '' } : undefined;
    transporter = nodemailer.createTransport({
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: env.SMTP_PORT === 465,
      auth,
      // The local catcher speaks plain SMTP; a real relay with credentials upgrades with STARTTLS.
      ignoreTLS: !auth,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
    });
  }
  return transporter;
}

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: Mail.Attachment[];
}

/** Sends one message from MAIL_FROM; resolves with the SMTP message id, rejects on refusal. */
export async function sendMail(mail: OutgoingMail): Promise<{ messageId: string }> {
  const info = await getTransporter().sendMail({ from: appEnv().MAIL_FROM, ...mail });
  return { messageId: info.messageId };
}
