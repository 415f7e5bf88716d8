import type { Router } from 'express';
import { z } from 'zod';
import { decimalId } from '../../shared/schemas/common.schema';
import { calcListQuerySchema, createCalcSchema, newRevisionSchema } from '../../shared/schemas/revision.schema';
import { validate } from '../http/validate';
import { idParam, idRouter } from '../http/route-ids';
import { signedInActor } from '../authz/actor';
import type { CalcsService } from './calcs.service';
import type { LifecycleService } from './lifecycle.service';
import { listCalcs } from './calc-list';
import { formOf, sendRevision } from './revision-answer';
import { diffRevisions } from './revision-history';

const diffQuerySchema = z.object({
  from: decimalId('a revision id'),
  to: decimalId('a revision id'),
});

export function calcsRouter(calcs: CalcsService, lifecycle: LifecycleService): Router {
  const router = idRouter();
  router.get('/', validate({ query: calcListQuerySchema }), async (req, res) => {
    res.json(await listCalcs(req.ability, res.locals.query));
  });
  router.post('/', validate({ body: createCalcSchema }), async (req, res) => {
    res.status(201).json(await calcs.create(req.ability, signedInActor(req), req.body));
  });
  router.get('/:id', async (req, res) => {
    res.json(await calcs.get(req.ability, idParam(req)));
  });
  router.get('/:id/latest-revision', async (req, res) => {
    sendRevision(res, await calcs.latestRevision(req.ability, idParam(req), formOf(req)));
  });
  router.post('/:id/revisions', validate({ body: newRevisionSchema }), async (req, res) => {
    res
      .status(201)
      .json(
        await lifecycle.newRevision(
          req.ability,
          signedInActor(req),
          idParam(req),
          req.body.reasonForChange,
          req.body.carryAttachments === true,
        ),
      );
  });
  router.get('/:id/diff', validate({ query: diffQuerySchema }), async (req, res) => {
    res.json(await diffRevisions(req.ability, idParam(req), res.locals.query.from, res.locals.query.to));
  });
  return router;
}
