import type { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { pageQuerySchema } from '../../shared/schemas/common.schema';
import { createUserSchema, updateUserSchema } from '../../shared/schemas/user.schema';
import { validate } from '../http/validate';
import { idParam, idRouter } from '../http/route-ids';
import { signedInActor } from '../authz/actor';
import { AppError } from '../errors/app-error';
import { UsersService } from './users.service';

const activeSchema = z.object({ active: z.boolean({ error: 'must be true or false' }) }).strict();

export function usersRouter(sequelize: Sequelize): Router {
  const router = idRouter();
  const users = new UsersService(sequelize);

  router.get('/', validate({ query: pageQuerySchema }), async (req, res) => {
    res.json(await users.list(req.ability, res.locals.query));
  });
  router.post('/', validate({ body: createUserSchema }), async (req, res) => {
    res.status(201).json(await users.create(req.ability, signedInActor(req), req.body));
  });
  router.get('/:id', async (req, res) => {
    res.json(await users.get(req.ability, idParam(req)));
  });
  router.patch('/:id', validate({ body: updateUserSchema }), async (req, res) => {
    res.json(await users.update(req.ability, signedInActor(req), idParam(req), req.body));
  });
  router.put('/:id/active', validate({ body: activeSchema }), async (req, res) => {
    res.json(await users.setActive(req.ability, signedInActor(req), idParam(req), req.body.active));
  });
  // Accounts are kept for the record: signatures and audit entries refer to them forever.
  router.delete('/:id', () => {
    throw new AppError('not_allowed', 405, 'User accounts are never deleted; deactivate the account instead');
  });
  return router;
}
