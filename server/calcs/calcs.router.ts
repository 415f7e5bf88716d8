import { Router } from 'express';
import { z } from 'zod';
import { decimalId, idParamsSchema } from '../../shared/schemas/common.schema';
import { calcListQuerySchema, createCalcSchema, newRevisionSchema } from '../../shared/schemas/revision.schema';
import { validate } from '../http/validate';
import { signedInActor } from '../authz/actor';
import type { CalcsService } from './calcs.service';
import type { LifecycleService } from './lifecycle.service';
import { listCalcs } from './calc-list';
import { diffRevisions } from './revision-history';

const diffQuerySchema = z.object({
  from: decimalId('a revision id'),
  to: decimalId('a revision id'),
});

export function calcsRouter(calcs: CalcsService, lifecycle: LifecycleService): Router {
  const router = Router();
  router.get('/', validate({ query: calcListQuerySchema }), async (req, res) => {
    res.json(await listCalcs(req.ability, res.locals.query));
  });
  router.post('/', validate({ body: createCalcSchema }), async (req, res) => {
    res.status(201).json(await calcs.create(req.ability, signedInActor(req), req.body));
  });
  router.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await calcs.get(req.ability, Number(req.params.id)));
  });
  router.post('/:id/revisions', validate({ params: idParamsSchema, body: newRevisionSchema }), async (req, res) => {
    res.status(201).json(await lifecycle.newRevision(req.ability, signedInActor(req), Number(req.params.id), req.body.reasonForChange, req.body.carryAttachments === true));
  });
  router.get('/:id/diff', validate({ params: idParamsSchema, query: diffQuerySchema }), async (req, res) => {
    res.json(await diffRevisions(req.ability, Number(req.params.id), res.locals.query.from, res.locals.query.to));
  });
  return router;
}
