import pino from 'pino';

/** One structured logger for the process, writing JSON lines to stdout. */
export const logger = pino({
  level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' ? 'silent' : 'info'),
  redact: ['req.headers.cookie', 'password', '*.password'],
});
