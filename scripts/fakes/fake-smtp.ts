import fs from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { decodeBody, decodeWords, splitMessage } from './mime-text';

export interface ReceivedMail {
  envelopeFrom: string;
  envelopeTo: string[];
  headers: Record<string, string>;
  subject: string;
  text: string;
  receivedAt: string;
}

export interface FakeSmtp { port: number; messages: ReceivedMail[]; close: () => Promise<void> }

function toMail(raw: string, from: string, to: string[]): ReceivedMail {
  const { headers, body } = splitMessage(raw);
  return { envelopeFrom: from, envelopeTo: to, headers, subject: decodeWords(headers['subject'] ?? ''), text: decodeBody(headers, body), receivedAt: new Date().toISOString() };
}

/**
 * A local SMTP server speaking the real protocol: it accepts any sender, recipient and login,
 * keeps every message in memory, and appends it as one JSON line to `inboxFile` when given.
 * STARTTLS is off so that no certificate is needed on loopback.
 */
export async function startFakeSmtp(options: { port: number; host?: string; inboxFile?: string }): Promise<FakeSmtp> {
  const messages: ReceivedMail[] = [];
  if (options.inboxFile) fs.mkdirSync(path.dirname(options.inboxFile), { recursive: true });
  const server = new SMTPServer({
    authOptional: true, allowInsecureAuth: true, disabledCommands: ['STARTTLS'], logger: false, banner: 'Torquetrail fake SMTP',
    onAuth: (auth, _session, done) => done(null, { user: auth.username ?? 'anyone' }),
    onData(stream, session, done) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
        const mail = toMail(Buffer.concat(chunks).toString('utf8'), from, session.envelope.rcptTo.map((r) => r.address));
        messages.push(mail);
        if (options.inboxFile) fs.appendFileSync(options.inboxFile, `${JSON.stringify(mail)}\n`);
        done();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host ?? '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return { port, messages, close: () => new Promise((resolve) => server.close(() => resolve())) };
}
