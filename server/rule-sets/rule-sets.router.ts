import type { Router } from 'express';
import { z } from 'zod';
import { decimalId } from '../../shared/schemas/common.schema';
import {
  confirmSchema,
  createDraftSchema,
  proposeSchema,
  tryItSchema,
  updateDraftSchema,
} from '../../shared/schemas/rule-set.schema';
import { validate } from '../http/validate';
import { idParam, idRouter } from '../http/route-ids';
import { signedInActor } from '../authz/actor';
import type { RuleSetsService } from './rule-sets.service';
import type { ImpactService } from './impact.service';

const diffQuerySchema = z.object({
  from: decimalId('a version id'),
  to: decimalId('a version id'),
});

export function ruleSetsRouter(ruleSets: RuleSetsService, impact: ImpactService): Router {
  const router = idRouter();
  router.get('/', async (req, res) => {
    res.json(await ruleSets.list(req.ability));
  });
  router.get('/diff', validate({ query: diffQuerySchema }), async (req, res) => {
    res.json(await impact.diff(req.ability, res.locals.query.from, res.locals.query.to));
  });
  router.get('/:id', async (req, res) => {
    res.json(await ruleSets.get(req.ability, idParam(req)));
  });
  router.post('/', validate({ body: createDraftSchema }), async (req, res) => {
    res.status(201).json(await ruleSets.createDraft(req.ability, signedInActor(req), req.body.fromId));
  });
  router.put('/:id', validate({ body: updateDraftSchema }), async (req, res) => {
    res.json(
      await ruleSets.updateDraft(
        req.ability,
        signedInActor(req),
        idParam(req),
        req.body.document,
        req.body.lockVersion,
      ),
    );
  });
  router.post('/:id/propose', validate({ body: proposeSchema }), async (req, res) => {
    res.json(
      await ruleSets.propose(
        req.ability,
        signedInActor(req),
        idParam(req),
        req.body.effectiveDate,
        req.body.lockVersion,
      ),
    );
  });
  router.post('/:id/confirm', validate({ body: confirmSchema }), async (req, res) => {
    res.json(
      await ruleSets.confirm(req.ability, signedInActor(req), idParam(req), req.body.password, req.body.lockVersion),
    );
  });
  router.post('/:id/try', validate({ body: tryItSchema }), async (req, res) => {
    res.json(await impact.tryIt(req.ability, idParam(req), req.body.revisionId));
  });
  router.get('/:id/impact', async (req, res) => {
    res.json(await impact.analyse(req.ability, idParam(req)));
  });
  router.get('/:id/impact.csv', async (req, res) => {
    const csv = await impact.csv(req.ability, idParam(req));
    res
      .type('text/csv')
      .attachment(`impact-${idParam(req)}.csv`)
      .send(csv);
  });
  return router;
}
