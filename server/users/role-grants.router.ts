import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { idParamsSchema } from '../../shared/schemas/common.schema';
import { confirmGrantSchema, refuseGrantSchema } from '../../shared/schemas/role-grant.schema';
import { validate } from '../http/validate';
import { signedInActor } from '../authz/actor';
import { RoleGrantsService } from './role-grants.service';

/** `/api/role-grants`: signing roles waiting for a second person, and that person's decision. */
export function roleGrantsRouter(sequelize: Sequelize): Router {
  const router = Router();
  const grants = new RoleGrantsService(sequelize);
  router.get('/', async (req, res) => {
    res.json(await grants.listPending(req.ability));
  });
  router.post('/:id/confirm', validate({ params: idParamsSchema, body: confirmGrantSchema }), async (req, res) => {
    res.json(await grants.confirm(req.ability, signedInActor(req), Number(req.params.id), req.body.password));
  });
  router.post('/:id/refuse', validate({ params: idParamsSchema, body: refuseGrantSchema }), async (req, res) => {
    res.json(await grants.refuse(req.ability, signedInActor(req), Number(req.params.id), req.body.reason));
  });
  return router;
}
