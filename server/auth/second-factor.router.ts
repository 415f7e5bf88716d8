import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { confirmSecondFactorSchema, disableSecondFactorSchema } from '../../shared/schemas/second-factor.schema';
import { validate } from '../http/validate';
import { signedInActor } from '../authz/actor';
import { SecondFactorService } from './second-factor';

/** `/api/auth/second-factor`: the signed-in person's own one-time-code set-up. */
export function secondFactorRouter(sequelize: Sequelize): Router {
  const router = Router();
  const service = new SecondFactorService(sequelize);
  router.get('/', async (req, res) => {
    res.json(await service.status(req.user!.id));
  });
  router.post('/begin', async (req, res) => {
    const { secret, enrolment } = await service.begin(signedInActor(req), req.user!.username);
    req.session.pendingTotp = secret;
    res.json(enrolment);
  });
  router.post('/confirm', validate({ body: confirmSecondFactorSchema }), async (req, res) => {
    const status = await service.confirm(signedInActor(req), req.session.pendingTotp, req.body.code);
    delete req.session.pendingTotp;
    res.json(status);
  });
  router.post('/disable', validate({ body: disableSecondFactorSchema }), async (req, res) => {
    res.json(await service.disable(signedInActor(req), req.body.password));
  });
  return router;
}
