import cluster from 'node:cluster';
import type { Server } from 'node:http';
import { announce, runAppProcesses } from './app-processes';
import { loadConfig, type Config } from './config';
import { createSequelize } from './db';
import { closeApp, createApp } from './app';
import { logger } from './logger';
import { startMailSender } from './mail/start-sender';

async function main(config: Config): Promise<void> {
  const sequelize = createSequelize(config);
  try {
    await sequelize.authenticate();
  } catch (err) {
    logger.fatal({ err }, `cannot reach MariaDB at ${config.DB_HOST}:${config.DB_PORT}`);
    process.exit(1);
  }
  const app = createApp({ sequelize, config });
  const mailSender = startMailSender(sequelize, config);
  const server: Server = app.listen(config.PORT, config.HOST, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.PORT;
    // A worker tells its primary, which says it once for all of them.
    if (cluster.isWorker) process.send?.({ ready: true, port });
    else announce(config, port);
  });

  const shutdown = (signal: string) => {
    logger.info({ signal }, 'shutting down');
    server.close(
      () =>
        void closeApp(app)
          .then(() => mailSender.stop())
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

const config = loadConfig();
if (cluster.isPrimary && config.APP_PROCESSES > 1) runAppProcesses(config);
else void main(config);
