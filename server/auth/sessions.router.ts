import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { sessionIdParamsSchema } from '../../shared/schemas/session-list.schema';
import { validate } from '../http/validate';
import { signedInActor } from '../authz/actor';
import { SessionsService } from './sessions.service';

/** `/api/auth/sessions`: the signed-in person's own sessions. Nobody sees anyone else's. */
export function sessionsRouter(sequelize: Sequelize): Router {
  const router = Router();
  const sessions = new SessionsService(sequelize);
  router.get('/', async (req, res) => {
    res.json(await sessions.list(signedInActor(req).id, req.sessionID));
  });
  router.delete('/:id', validate({ params: sessionIdParamsSchema }), async (req, res) => {
    await sessions.end(signedInActor(req), req.sessionID, String(req.params.id));
    res.status(204).end();
  });
  return router;
}
