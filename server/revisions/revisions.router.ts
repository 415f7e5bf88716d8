import type { Router } from 'express';
import { z } from 'zod';
import {
  answerSchema,
  findingSchema,
  manualItemSchema,
  returnSchema,
  saveRevisionSchema,
  signSchema,
  withdrawSchema,
} from '../../shared/schemas/revision.schema';
import { validate } from '../http/validate';
import { idParam, idRouter } from '../http/route-ids';
import { signedInActor } from '../authz/actor';
import type { CalcsService } from '../calcs/calcs.service';
import type { LifecycleService } from '../calcs/lifecycle.service';
import { readRevision } from '../calcs/revision-read';
import { formOf, sendRevision } from '../calcs/revision-answer';
import type { WorkflowService } from '../workflow/workflow.service';
import type { ReviewService } from '../workflow/review.service';
import type { FindingsService } from '../workflow/findings.service';

const itemParamsSchema = z.object({ itemId: z.string().regex(/^[A-Za-z0-9._-]{1,40}$/, 'is not a checklist item id') });

export interface RevisionServices {
  calcs: CalcsService;
  lifecycle: LifecycleService;
  workflow: WorkflowService;
  review: ReviewService;
  findings: FindingsService;
}

export function revisionsRouter(s: RevisionServices): Router {
  const router = idRouter();
  router.get('/:id', async (req, res) => {
    sendRevision(res, await readRevision(req.ability, idParam(req), undefined, undefined, formOf(req)));
  });
  router.put('/:id', validate({ body: saveRevisionSchema }), async (req, res) => {
    sendRevision(res, await s.calcs.save(req.ability, signedInActor(req), idParam(req), req.body, formOf(req)));
  });
  router.post('/:id/sign', validate({ body: signSchema }), async (req, res) => {
    res.json(
      await s.workflow.sign(req.ability, { ...signedInActor(req), roles: req.user!.roles }, idParam(req), req.body),
    );
  });
  router.post('/:id/return', validate({ body: returnSchema }), async (req, res) => {
    res.json(
      await s.review.returnToAuthor(
        req.ability,
        signedInActor(req),
        idParam(req),
        req.body.reason,
        req.body.lockVersion,
      ),
    );
  });
  router.post('/:id/withdraw', validate({ body: withdrawSchema }), async (req, res) => {
    res.json(
      await s.lifecycle.withdraw(req.ability, signedInActor(req), idParam(req), req.body.reason, req.body.lockVersion),
    );
  });
  router.post('/:id/findings', validate({ body: findingSchema }), async (req, res) => {
    const anchor = { clauseRef: req.body.clauseRef ?? null, anchorPath: req.body.anchorPath ?? null };
    res
      .status(201)
      .json(await s.findings.raiseFinding(req.ability, signedInActor(req), idParam(req), req.body.text, anchor));
  });
  router.put(
    '/:id/manual-items/:itemId',
    validate({ params: itemParamsSchema, body: manualItemSchema }),
    async (req, res) => {
      res.json(
        await s.review.setManualItem(
          req.ability,
          signedInActor(req),
          idParam(req),
          String(req.params.itemId),
          req.body.done,
          req.body.note,
        ),
      );
    },
  );
  return router;
}

export function findingsRouter(findings: FindingsService): Router {
  const router = idRouter();
  router.post('/:id/answer', validate({ body: answerSchema }), async (req, res) => {
    res.json(await findings.answerFinding(req.ability, signedInActor(req), idParam(req), req.body.answer));
  });
  router.post('/:id/close', async (req, res) => {
    res.json(await findings.closeFinding(req.ability, signedInActor(req), idParam(req)));
  });
  return router;
}
