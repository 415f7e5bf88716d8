import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { validate } from '../http/validate';
import { AppError } from '../errors/app-error';
import { recordedMetadataOf } from './stored-result';

const versionParamsSchema = z.object({ version: z.string().regex(/^\d{1,4}\.\d{1,4}\.\d{1,4}$/, 'is not a version') });

/**
 * `/api/engine-metadata/:version`: the units and formulas of the results an engine version produced, as recorded
 * when it first stored one. The browser reads them once to expand results sent as stored
 * (shared/schemas/revision-form.ts). A version's record never changes, so the browser may keep it.
 */
export function engineMetadataRouter(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/:version', validate({ params: versionParamsSchema }), async (req, res) => {
    const version = String(req.params.version);
    const meta = await recordedMetadataOf(sequelize, version);
    if (!meta) throw AppError.notFound(`Engine version ${version}`);
    res.set('Cache-Control', 'private, max-age=86400, immutable').json({ engineVersion: version, ...meta });
  });
  return router;
}
