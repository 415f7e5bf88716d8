import type { Sequelize } from 'sequelize';
import type { Config } from '../config';
import { logger } from '../logger';
import { MailSender } from './mail-sender';
import { createMailTransport } from './transport';

/** Runs the outbox sender in this process (every instance may: rows are claimed with SKIP LOCKED). */
export function startMailSender(sequelize: Sequelize, config: Config): { stop: () => Promise<void> } {
  if (!config.MAIL_SENDER) {
    logger.info('mail sender is off in this instance (MAIL_SENDER=false)');
    return { stop: async () => {} };
  }
  const transport = createMailTransport(config);
  const sender = new MailSender(sequelize, {
    transport,
    from: config.MAIL_FROM,
    maxAttempts: config.MAIL_MAX_ATTEMPTS,
    backoffSeconds: config.MAIL_BACKOFF_SECONDS,
  });
  sender.start(config.MAIL_POLL_SECONDS);
  logger.info({ smtp: `${config.SMTP_HOST}:${config.SMTP_PORT}` }, 'mail sender started');
  return {
    stop: async () => {
      await sender.stop();
      transport.close();
    },
  };
}
