import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { sendMail } from '@/lib/server/mail/transport';
import { mailTo } from './support/mailbox';

describe('mail through nodemailer to the local fake SMTP server', () => {
  it('delivers one message with its subject and attachment to the right recipient', async () => {
    const to = `mail-${randomUUID().slice(0, 8)}@fixtures.test`;
    const { messageId } = await sendMail({
      to,
      subject: 'Your site sheet',
      text: 'Hello',
      attachments: [{ filename: 'sheet.txt', content: 'figures' }],
    });
    expect(messageId).toMatch(/@/);
    const caught = await mailTo(to);
    expect(caught).toHaveLength(1);
    expect(caught[0]?.subject).toBe('Your site sheet');
    expect(caught[0]?.from).toContain('no-reply@fallbook.test');
    expect(caught[0]?.raw).toContain('filename=sheet.txt');
  });

  it('rejects an address the SMTP conversation cannot use', async () => {
    await expect(sendMail({ to: 'not an address', subject: 'x', text: 'x' })).rejects.toThrow();
  });
});
