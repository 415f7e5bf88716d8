import fs from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { createHash } from 'node:crypto';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type ParsedMail } from 'mailparser';

export interface ReceivedMail {
  envelopeFrom: string;
  envelopeTo: string[];
  /** Every header by lower-case name, as sent (unfolded, not decoded); the last one wins. */
  headers: Record<string, string>;
  /** Decoded by mailparser, as a mail client shows them. */
  subject: string;
  from: string;
  to: string;
  text: string;
  html: string | null;
  attachments: { fileName: string | null; contentType: string; size: number; sha256: string }[];
  receivedAt: string;
}

export interface FakeSmtp {
  port: number;
  messages: ReceivedMail[];
  close: () => Promise<void>;
}

const addressText = (a: ParsedMail['to']) => (Array.isArray(a) ? a.map((x) => x.text).join(', ') : (a?.text ?? ''));

/** Reads a message the way a mail client does (mailparser): encodings, encoded words, parts, attachments. */
export async function toMail(raw: Buffer, from: string, to: string[]): Promise<ReceivedMail> {
  const parsed = await simpleParser(raw);
  const headers: Record<string, string> = {};
  for (const { key, line } of parsed.headerLines)
    headers[key] = line
      .slice(line.indexOf(':') + 1)
      .replace(/\r?\n[ \t]+/g, ' ')
      .trim();
  return {
    envelopeFrom: from,
    envelopeTo: to,
    headers,
    subject: parsed.subject ?? '',
    from: addressText(parsed.from),
    to: addressText(parsed.to),
    text: parsed.text ?? '',
    html: parsed.html === false ? null : (parsed.html ?? null),
    attachments: parsed.attachments.map((a) => ({
      fileName: a.filename ?? null,
      contentType: a.contentType,
      size: a.size,
      sha256: createHash('sha256').update(a.content).digest('hex'),
    })),
    receivedAt: new Date().toISOString(),
  };
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
    authOptional: true,
    allowInsecureAuth: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    banner: 'Torquetrail fake SMTP',
    onAuth: (auth, _session, done) => done(null, { user: auth.username ?? 'anyone' }),
    onData(stream, session, done) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
        // Acknowledged only once parsed and kept, so a sender that saw "250" finds it in `messages`.
        toMail(
          Buffer.concat(chunks),
          from,
          session.envelope.rcptTo.map((r) => r.address),
        ).then(
          (mail) => {
            messages.push(mail);
            if (options.inboxFile) fs.appendFileSync(options.inboxFile, `${JSON.stringify(mail)}\n`);
            done();
          },
          (err: Error) => done(err),
        );
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
