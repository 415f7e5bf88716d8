import type { Request, RequestHandler } from 'express';
import { LRUCache } from 'lru-cache';
import { createAppAbility, defineRulesFor, type AbilityUser, type AppAbility } from '../../shared/authz/app-ability';
import type { Actor } from '../audit/audit.service';
import { clientIp } from '../http/client-ip';

/*
 * The rules are a function of the person's id and roles alone (shared/authz/app-ability.ts), and an ability is
 * never changed once built, so one ability per id and set of roles serves every request of that person: its rules
 * are built, and indexed by CASL on their first check, once rather than on every request. The roles are the ones
 * read with the session on this very request, so a role given or taken is a new key at once.
 */
const abilities = new LRUCache<string, AppAbility>({ max: 2_000 });

export function abilityOf(user: AbilityUser | null | undefined): AppAbility {
  const key = user ? `${user.id}:${user.roles.join(',')}` : '';
  let ability = abilities.get(key);
  if (!ability) {
    ability = createAppAbility(defineRulesFor(user));
    abilities.set(key, ability);
  }
  return ability;
}

/** Builds `req.ability` from the same shared rules the client receives. */
export const attachAbility: RequestHandler = (req, _res, next) => {
  req.ability = abilityOf(req.user);
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
