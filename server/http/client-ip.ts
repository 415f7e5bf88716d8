import { isIP } from 'node:net';
import type { Request } from 'express';

/** Longest address text the audit trail keeps (the width of audit_events.ip). */
export const IP_TEXT_MAX = 255;

const isAddress = (text: string | undefined): text is string =>
  !!text && text.length <= IP_TEXT_MAX && isIP(text) !== 0;

/**
 * The address to record for a request. `req.ip` comes from X-Forwarded-For when a proxy is
 * trusted, and a sender can put any text there; text that is not an IP address is never recorded
 * (it could not be trusted, and may not fit), so the peer the connection came from is used instead.
 */
export function clientIp(req: Request): string | null {
  if (isAddress(req.ip)) return req.ip;
  const peer = req.socket?.remoteAddress;
  return isAddress(peer) ? peer : null;
}
