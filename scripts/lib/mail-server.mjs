// The local fake SMTP server: accepts every message, keeps it as an .eml file in MAIL_DIR, and
// lists what it caught as JSON on a loopback HTTP port (for people and for tests).
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:http';
import path from 'node:path';
import { SMTPServer } from 'smtp-server';

function headerOf(raw, name) {
  const match = raw.match(new RegExp(`^${name}:\\s*(.*(?:\\r?\\n[ \\t].*)*)`, 'im'));
  return match ? match[1].replace(/\r?\n[ \t]+/g, ' ').trim() : '';
}

export async function startMailServer({ host = '127.0.0.1', smtpPort, inboxPort, dir }) {
  mkdirSync(dir, { recursive: true });
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Fallbook local mail catcher',
    onData(stream, session, callback) {
      const chunks = [];
      stream.on('data', (c) => chunks.push(c));
      stream.on('end', () => {
        const name = `${Date.now()}-${Math.random().toString(36).slice(2, 8)}.eml`;
        writeFileSync(path.join(dir, name), Buffer.concat(chunks));
        callback();
      });
    },
  });
  await new Promise((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(smtpPort, host, resolve);
  });

  const inbox = createServer((req, res) => {
    const files = readdirSync(dir)
      .filter((f) => f.endsWith('.eml'))
      .sort();
    const messages = files.map((file) => {
      const raw = readFileSync(path.join(dir, file), 'utf8');
      return { id: file, to: headerOf(raw, 'To'), from: headerOf(raw, 'From'), subject: headerOf(raw, 'Subject'), raw };
    });
    res.setHeader('content-type', 'application/json');
    res.end(JSON.stringify({ messages }));
  });
  await new Promise((resolve, reject) => {
    inbox.once('error', reject);
    inbox.listen(inboxPort, host, resolve);
  });

  return {
    async close() {
      await new Promise((r) => smtp.close(r));
      await new Promise((r) => inbox.close(r));
    },
  };
}
