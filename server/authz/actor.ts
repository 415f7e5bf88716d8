import type { Request, RequestHandler } from 'express';
import { createAppAbility, defineRulesFor } from '../../shared/authz/app-ability';
import type { Actor } from '../audit/audit.service';
import { clientIp } from '../http/client-ip';

/** Builds `req.ability` from the same shared rules the client receives. */
export const attachAbility: RequestHandler = (req, _res, next) => {
  req.ability = createAppAbility(defineRulesFor(req.user));
  next();
};

/** Who did it, for the audit trail. */
export function actorOf(req: Request): Actor {
  return req.user
    ? { id: req.user.id, name: req.user.displayName, ip: clientIp(req) }
    : { id: null, name: 'anonymous', ip: clientIp(req) };
}

/** The actor for routes behind `requireSignIn`, typed with a non-null id. */
export function signedInActor(req: Request): Actor & { id: number } {
  if (!req.user) throw new Error('signedInActor used on a route without requireSignIn');
  return { id: req.user.id, name: req.user.displayName, ip: clientIp(req) };
}
