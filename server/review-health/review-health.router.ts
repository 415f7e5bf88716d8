import { Router } from 'express';
import {
  healthQuerySchema,
  signalKeyParamsSchema,
  signalPageQuerySchema,
  updateHealthSettingsSchema,
  type SignalKey,
} from '../../shared/schemas/review-health.schema';
import { validate } from '../http/validate';
import { signedInActor } from '../authz/actor';
import type { Sequelize } from 'sequelize';
import { ReviewHealthService } from './review-health.service';
import { HealthSettingsService } from './health-settings.service';
import { healthCsv } from './health-csv';

export function reviewHealthRouter(sequelize: Sequelize): Router {
  const health = new ReviewHealthService(sequelize);
  const settings = new HealthSettingsService(sequelize);
  const router = Router();
  router.get('/', validate({ query: healthQuerySchema }), async (req, res) => {
    res.json(await health.report(req.ability, res.locals.query));
  });
  router.get('/signals.csv', validate({ query: healthQuerySchema }), async (req, res) => {
    const report = await health.report(req.ability, res.locals.query, { all: true });
    const name = `review-health-${report.project?.code ?? 'all'}-${report.from}-${report.to}.csv`.replace(
      /[^A-Za-z0-9._-]/g,
      '_',
    );
    res.type('text/csv').attachment(name).send(healthCsv(report));
  });
  router.get(
    '/signals/:key',
    validate({ params: signalKeyParamsSchema, query: signalPageQuerySchema }),
    async (req, res) => {
      res.json(await health.page(req.ability, req.params.key as SignalKey, res.locals.query));
    },
  );
  router.get('/settings', async (req, res) => {
    res.json(await settings.get(req.ability));
  });
  router.put('/settings', validate({ body: updateHealthSettingsSchema }), async (req, res) => {
    res.json(await settings.update(req.ability, signedInActor(req), req.body));
  });
  return router;
}
