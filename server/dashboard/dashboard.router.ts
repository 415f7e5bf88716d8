import { Router } from 'express';
import { z } from 'zod';
import { QUEUE_KEYS, type QueueKey } from '../../shared/schemas/queue.schema';
import { queueQuerySchema, queuesOf } from './queues';
import { validate } from '../http/validate';
import { dashboardFor, queueFor } from './dashboard.service';

const queueParamsSchema = z.object({ key: z.enum(QUEUE_KEYS, { error: 'is not a queue' }) });

export function dashboardRouter(): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await dashboardFor(req.ability, req.user!.id));
  });
  router.get('/queues', validate({ query: queueQuerySchema }), async (req, res) => {
    res.json(await queuesOf(req.user!, req.ability, res.locals.query));
  });
  router.get('/queues/:key', validate({ params: queueParamsSchema, query: queueQuerySchema }), async (req, res) => {
    res.json(await queueFor(req.user!, req.ability, req.params.key as QueueKey, res.locals.query));
  });
  return router;
}
