import { Router } from 'express';
import { z } from 'zod';
import { idParamsSchema } from '../../shared/schemas/common.schema';
import {
  answerSchema, findingSchema, manualItemSchema, returnSchema, saveRevisionSchema, signSchema, withdrawSchema,
} from '../../shared/schemas/revision.schema';
import { validate } from '../http/validate';
import { signedInActor } from '../authz/actor';
import type { CalcsService } from '../calcs/calcs.service';
import type { LifecycleService } from '../calcs/lifecycle.service';
import { readRevision } from '../calcs/revision-read';
import type { WorkflowService } from '../workflow/workflow.service';
import type { ReviewService } from '../workflow/review.service';

const itemParamsSchema = idParamsSchema.extend({ itemId: z.string().regex(/^[A-Za-z0-9._-]{1,40}$/, 'is not a checklist item id') });

export interface RevisionServices { calcs: CalcsService; lifecycle: LifecycleService; workflow: WorkflowService; review: ReviewService }

export function revisionsRouter(s: RevisionServices): Router {
  const router = Router();
  const id = (p: { id?: unknown }) => Number(p.id);
  router.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await readRevision(req.ability, id(req.params)));
  });
  router.put('/:id', validate({ params: idParamsSchema, body: saveRevisionSchema }), async (req, res) => {
    res.json(await s.calcs.save(req.ability, signedInActor(req), id(req.params), req.body));
  });
  router.post('/:id/sign', validate({ params: idParamsSchema, body: signSchema }), async (req, res) => {
    res.json(await s.workflow.sign(req.ability, { ...signedInActor(req), roles: req.user!.roles }, id(req.params), req.body));
  });
  router.post('/:id/return', validate({ params: idParamsSchema, body: returnSchema }), async (req, res) => {
    res.json(await s.review.returnToAuthor(req.ability, signedInActor(req), id(req.params), req.body.reason, req.body.lockVersion));
  });
  router.post('/:id/withdraw', validate({ params: idParamsSchema, body: withdrawSchema }), async (req, res) => {
    res.json(await s.lifecycle.withdraw(req.ability, signedInActor(req), id(req.params), req.body.reason, req.body.lockVersion));
  });
  router.post('/:id/findings', validate({ params: idParamsSchema, body: findingSchema }), async (req, res) => {
    res.status(201).json(await s.review.raiseFinding(req.ability, signedInActor(req), id(req.params), req.body.text, { clauseRef: req.body.clauseRef ?? null, anchorPath: req.body.anchorPath ?? null }));
  });
  router.put('/:id/manual-items/:itemId', validate({ params: itemParamsSchema, body: manualItemSchema }), async (req, res) => {
    res.json(await s.review.setManualItem(req.ability, signedInActor(req), id(req.params), String(req.params.itemId), req.body.done, req.body.note));
  });
  return router;
}

export function findingsRouter(review: ReviewService): Router {
  const router = Router();
  router.post('/:id/answer', validate({ params: idParamsSchema, body: answerSchema }), async (req, res) => {
    res.json(await review.answerFinding(req.ability, signedInActor(req), Number(req.params.id), req.body.answer));
  });
  router.post('/:id/close', validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await review.closeFinding(req.ability, signedInActor(req), Number(req.params.id)));
  });
  return router;
}
