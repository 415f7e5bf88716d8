import type { Router } from 'express';
import { lockModelSchema, saveModelSchema } from '../../shared/schemas/independent-model.schema';
import { validate } from '../http/validate';
import { idParam, idRouter } from '../http/route-ids';
import { signedInActor } from '../authz/actor';
import type { IndependentModelService } from './independent-model.service';

/** /api/revisions/:id/independent-model: the checker's model of one revision. */
export function independentModelRouter(service: IndependentModelService): Router {
  const router = idRouter();
  router.get('/:id/independent-model', async (req, res) => {
    res.json(await service.read(req.ability, idParam(req)));
  });
  router.put('/:id/independent-model', validate({ body: saveModelSchema }), async (req, res) => {
    res.json(await service.save(req.ability, signedInActor(req), idParam(req), req.body.input, req.body.lockVersion));
  });
  router.post('/:id/independent-model/lock', validate({ body: lockModelSchema }), async (req, res) => {
    res.json(await service.lock(req.ability, signedInActor(req), idParam(req), req.body.lockVersion));
  });
  return router;
}
