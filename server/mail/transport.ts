import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../config';

type SmtpSettings = Pick<Config, 'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_SECURE' | 'SMTP_USER' | 'SMTP_PASSWORD'>;

/**
 * The SMTP connection from configuration. Timeouts are short because the sender holds a row
 * lock while it talks to the server; a hung relay must turn into a retry, not a stuck queue.
 */
export function createMailTransport(config: SmtpSettings): Transporter {
  return nodemailer.createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: config.SMTP_SECURE,
    auth: config.SMTP_USER ? { user: config.SMTP_USER, pass: config.SMTP_PASSWORD ?? '' } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
}

/** Stable per outbox row, so a message delivered twice after a crash is recognisably the same one. */
export function messageIdOf(row: { id: number; createdAt: Date }, from: string): string {
  const domain = /@([^>\s]+)/.exec(from)?.[1] ?? 'torquetrail.invalid';
  return `<tt-outbox-${row.id}-${row.createdAt.getTime()}@${domain}>`;
}
