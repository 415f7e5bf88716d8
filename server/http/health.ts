import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import { RETRY_AFTER_SECONDS } from '../db/transaction';

/**
 * For a load balancer: 200 when this instance can reach its database, else 503 with Retry-After.
 * Mounted before sessions, so health checks never create session rows. Says nothing else.
 */
export function healthCheck(sequelize: Sequelize): RequestHandler {
  return async (_req, res) => {
    try {
      await sequelize.query('SELECT 1');
      res.set('Cache-Control', 'no-store').json({ status: 'ok' });
    } catch {
      res.set('Retry-After', String(RETRY_AFTER_SECONDS)).status(503).json({ status: 'unavailable' });
    }
  };
}
