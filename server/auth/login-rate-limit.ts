import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';
import { MariaDbRateLimitStore } from './rate-limit-store';
import type { ApiErrorBody } from '../../shared/schemas/api-error.schema';

/**
 * Limits sign-in attempts per account and address, so guessing one account's password from
 * one place is slow while other people behind the same address can still sign in. The count
 * lives in MariaDB, so several app instances enforce one limit together.
 */
export function loginRateLimit(sequelize: Sequelize, config: Config): RequestHandler {
  return rateLimit({
    store: new MariaDbRateLimitStore(sequelize, { prefix: 'login:' }),
    windowMs: config.LOGIN_RATE_WINDOW_MINUTES * 60_000,
    limit: config.LOGIN_RATE_LIMIT,
    // Only failed attempts count, so people who sign in often are never locked out by success.
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => {
      const username = typeof req.body?.username === 'string' ? req.body.username.trim().toLowerCase() : '';
      return `${ipKeyGenerator(req.ip ?? '')}|${username}`;
    },
    handler: (_req, res) => {
      res.status(429).json({
        code: 'rate_limited',
        message: `Too many sign-in attempts; wait ${config.LOGIN_RATE_WINDOW_MINUTES} minutes and try again`,
      } satisfies ApiErrorBody);
    },
  });
}
