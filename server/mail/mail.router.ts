import type { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { mailPreferencesSchema, sentMailQuerySchema } from '../../shared/schemas/mail.schema';
import { validate } from '../http/validate';
import { idParam, idRouter } from '../http/route-ids';
import { signedInActor } from '../authz/actor';
import { preferencesOf, savePreferences } from './preferences.service';
import type { SentMailService } from './sent-mail.service';

/** `/api/mail`: your own mail preferences, and the admins' sent-mail screen. */
export function mailRouter(sequelize: Sequelize, sentMail: SentMailService): Router {
  const router = idRouter();
  router.get('/preferences', async (req, res) => {
    res.json(await preferencesOf(req.user!.id, req.user!.roles));
  });
  router.put('/preferences', validate({ body: mailPreferencesSchema }), async (req, res) => {
    res.json(await savePreferences(sequelize, signedInActor(req), req.user!.roles, req.body.preferences));
  });
  router.get('/sent', validate({ query: sentMailQuerySchema }), async (req, res) => {
    res.json(await sentMail.list(req.ability, res.locals.query));
  });
  router.get('/sent/:id', async (req, res) => {
    res.json(await sentMail.get(req.ability, idParam(req)));
  });
  return router;
}
