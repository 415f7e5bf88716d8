import type { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { pageQuerySchema } from '../../shared/schemas/common.schema';
import { createProjectSchema, updateProjectSchema } from '../../shared/schemas/project.schema';
import { validate } from '../http/validate';
import { idParam, idRouter } from '../http/route-ids';
import { signedInActor } from '../authz/actor';
import { ProjectsService } from './projects.service';

export function projectsRouter(sequelize: Sequelize): Router {
  const router = idRouter();
  const projects = new ProjectsService(sequelize);

  router.get('/', validate({ query: pageQuerySchema }), async (req, res) => {
    res.json(await projects.list(req.ability, res.locals.query));
  });
  router.post('/', validate({ body: createProjectSchema }), async (req, res) => {
    res.status(201).json(await projects.create(req.ability, signedInActor(req), req.body));
  });
  router.get('/:id', async (req, res) => {
    res.json(await projects.get(req.ability, idParam(req)));
  });
  router.patch('/:id', validate({ body: updateProjectSchema }), async (req, res) => {
    res.json(await projects.update(req.ability, signedInActor(req), idParam(req), req.body));
  });
  return router;
}
