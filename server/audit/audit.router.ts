import type { Router } from 'express';
import { auditQuerySchema } from '../../shared/schemas/audit.schema';
import { validate } from '../http/validate';
import { idParam, idRouter } from '../http/route-ids';
import { auditEntry, auditPeople, checkAuditChain, listAudit } from './audit-read.service';

export function auditRouter(): Router {
  const router = idRouter();
  router.get('/', validate({ query: auditQuerySchema }), async (req, res) => {
    res.json(await listAudit(req.ability, res.locals.query));
  });
  router.get('/people', async (req, res) => {
    res.json(await auditPeople(req.ability));
  });
  router.get('/verify', async (req, res) => {
    res.json(await checkAuditChain(req.ability));
  });
  router.get('/:id', async (req, res) => {
    res.json(await auditEntry(req.ability, idParam(req)));
  });
  return router;
}
