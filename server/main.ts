import type { Server } from 'node:http';
import { CAUTION } from '../shared/engine';
import { loadConfig } from './config';
import { createSequelize } from './db';
import { closeApp, createApp } from './app';
import { logger } from './logger';
import { startMailSender } from './mail/start-sender';
import { startSearchRestamp } from './calcs/search-restamp';

async function main(): Promise<void> {
  const config = loadConfig();
  const sequelize = createSequelize(config);
  try {
    await sequelize.authenticate();
  } catch (err) {
    logger.fatal({ err }, `cannot reach MariaDB at ${config.DB_HOST}:${config.DB_PORT}`);
    process.exit(1);
  }
  const app = createApp({ sequelize, config });
  const mailSender = startMailSender(sequelize, config);
  const restamp = startSearchRestamp(sequelize);
  const server: Server = app.listen(config.PORT, config.HOST, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.PORT;
    logger.info({ port }, 'Torquetrail is listening');
    if (config.NODE_ENV !== 'test') {
      process.stdout.write(
        `\nTorquetrail is running at http://${config.HOST}:${port}/  (Ctrl-C stops it)\n` + `${CAUTION}\n\n`,
      );
    }
    if (process.send) process.send({ ready: true, port });
  });

  const shutdown = (signal: string) => {
    logger.info({ signal }, 'shutting down');
    server.close(
      () =>
        void closeApp(app)
          .then(() => mailSender.stop())
          .then(() => restamp.stop())
          .then(() => sequelize.close())
          .finally(() => process.exit(0)),
    );
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on('SIGTERM', () => shutdown('SIGTERM'));
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('unhandledRejection', (err) => {
    logger.error({ err }, 'unhandled rejection');
  });
}

void main();
