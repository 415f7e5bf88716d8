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
