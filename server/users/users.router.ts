import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { idParamsSchema, pageQuerySchema } from '../../shared/schemas/common.schema';
import { createUserSchema, updateUserSchema } from '../../shared/schemas/user.schema';
import { validate } from '../http/validate';
import { signedInActor } from '../authz/actor';
import { AppError } from '../errors/app-error';
import { UsersService } from './users.service';

const activeSchema = z.object({ active: z.boolean({ error: 'must be true or false' }) }).strict();

export function usersRouter(sequelize: Sequelize): Router {
  const router = Router();
  const users = new UsersService(sequelize);

  router.get('/', validate({ query: pageQuerySchema }), async (req, res) => {
    res.json(await users.list(req.ability, res.locals.query));
  });
  router.post('/', validate({ body: createUserSchema }), async (req, res) => {
    res.status(201).json(await users.create(req.ability, signedInActor(req), req.body));
  });
  router.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await users.get(req.ability, Number(req.params.id)));
  });
  router.patch('/:id', validate({ params: idParamsSchema, body: updateUserSchema }), async (req, res) => {
    res.json(await users.update(req.ability, signedInActor(req), Number(req.params.id), req.body));
  });
  router.put('/:id/active', validate({ params: idParamsSchema, body: activeSchema }), async (req, res) => {
    res.json(await users.setActive(req.ability, signedInActor(req), Number(req.params.id), req.body.active));
  });
  // Accounts are kept for the record: signatures and audit entries refer to them forever.
  router.delete('/:id', () => {
    throw new AppError('not_allowed', 405, 'User accounts are never deleted; deactivate the account instead');
  });
  return router;
}
