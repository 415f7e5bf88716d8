import type { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { confirmGrantSchema, refuseGrantSchema } from '../../shared/schemas/role-grant.schema';
import { validate } from '../http/validate';
import { idParam, idRouter } from '../http/route-ids';
import { signedInActor } from '../authz/actor';
import { RoleGrantsService } from './role-grants.service';

/** `/api/role-grants`: signing roles waiting for a second person, and that person's decision. */
export function roleGrantsRouter(sequelize: Sequelize): Router {
  const router = idRouter();
  const grants = new RoleGrantsService(sequelize);
  router.get('/', async (req, res) => {
    res.json(await grants.listPending(req.ability));
  });
  router.post('/:id/confirm', validate({ body: confirmGrantSchema }), async (req, res) => {
    res.json(await grants.confirm(req.ability, signedInActor(req), idParam(req), req.body.password));
  });
  router.post('/:id/refuse', validate({ body: refuseGrantSchema }), async (req, res) => {
    res.json(await grants.refuse(req.ability, signedInActor(req), idParam(req), req.body.reason));
  });
  return router;
}
