import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { idParamsSchema, pageQuerySchema } from '../../shared/schemas/common.schema';
import { createProjectSchema, updateProjectSchema } from '../../shared/schemas/project.schema';
import { validate } from '../http/validate';
import { signedInActor } from '../authz/actor';
import { ProjectsService } from './projects.service';

export function projectsRouter(sequelize: Sequelize): Router {
  const router = Router();
  const projects = new ProjectsService(sequelize);

  router.get('/', validate({ query: pageQuerySchema }), async (req, res) => {
    res.json(await projects.list(req.ability, res.locals.query));
  });
  router.post('/', validate({ body: createProjectSchema }), async (req, res) => {
    res.status(201).json(await projects.create(req.ability, signedInActor(req), req.body));
  });
  router.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await projects.get(req.ability, Number(req.params.id)));
  });
  router.patch('/:id', validate({ params: idParamsSchema, body: updateProjectSchema }), async (req, res) => {
    res.json(await projects.update(req.ability, signedInActor(req), Number(req.params.id), req.body));
  });
  return router;
}
