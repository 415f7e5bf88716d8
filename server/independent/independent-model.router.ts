import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { idParamsSchema } from '../../shared/schemas/common.schema';
import { lockModelSchema, saveModelSchema } from '../../shared/schemas/independent-model.schema';
import { validate } from '../http/validate';
import { signedInActor } from '../authz/actor';
import { IndependentModelService } from './independent-model.service';

/** /api/revisions/:id/independent-model: the checker's model of one revision. */
export function independentModelRouter(sequelize: Sequelize): Router {
  const service = new IndependentModelService(sequelize);
  const router = Router();
  const id = (p: { id?: unknown }) => Number(p.id);
  router.get('/:id/independent-model', validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await service.read(req.ability, id(req.params)));
  });
  router.put('/:id/independent-model', validate({ params: idParamsSchema, body: saveModelSchema }), async (req, res) => {
    res.json(await service.save(req.ability, signedInActor(req), id(req.params), req.body.input, req.body.lockVersion));
  });
  router.post('/:id/independent-model/lock', validate({ params: idParamsSchema, body: lockModelSchema }), async (req, res) => {
    res.json(await service.lock(req.ability, signedInActor(req), id(req.params), req.body.lockVersion));
  });
  return router;
}
