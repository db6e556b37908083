// Reads what the local fake SMTP server caught (its JSON inbox on loopback).
export interface CaughtMail {
  id: string;
  to: string;
  from: string;
  subject: string;
  raw: string;
}

export async function caughtMail(): Promise<CaughtMail[]> {
  const res = await fetch(`http://127.0.0.1:${process.env.MAIL_INBOX_PORT}/messages`);
  return ((await res.json()) as { messages: CaughtMail[] }).messages;
}

/** Messages to one address (addresses in tests are unique, so earlier runs don't interfere). */
export async function mailTo(address: string): Promise<CaughtMail[]> {
  return (await caughtMail()).filter((m) => m.to.includes(address));
}
