import type { Router, RequestHandler } from 'express';
import { uploadFieldsSchema } from '../../shared/schemas/attachment.schema';
import { validate } from '../http/validate';
import { idParam, idRouter } from '../http/route-ids';
import { signedInActor } from '../authz/actor';
import type { AttachmentsService } from './attachments.service';
import { singleUpload } from './upload';

/** `/api/revisions/:id/attachments`: list and upload the files of one revision. */
export function revisionAttachmentsRouter(attachments: AttachmentsService): Router {
  const router = idRouter();
  router.get('/:id/attachments', async (req, res) => {
    res.json(await attachments.list(req.ability, idParam(req)));
  });
  // Refuse (404, 403, 409) before reading a large body the request could never store.
  const precheck: RequestHandler = async (req, _res, next) => {
    await attachments.assertMayAddTo(req.ability, idParam(req));
    next();
  };
  router.post(
    '/:id/attachments',
    precheck,
    singleUpload('file', attachments.maxBytes),
    validate({ body: uploadFieldsSchema }),
    async (req, res) => {
      const file = req.file ? { buffer: req.file.buffer, originalname: req.file.originalname } : undefined;
      res.status(201).json(await attachments.upload(req.ability, signedInActor(req), idParam(req), file, req.body));
    },
  );
  return router;
}

/** `/api/attachments/:id`: download (always as a download, never rendered inline) and remove. */
export function attachmentsRouter(attachments: AttachmentsService): Router {
  const router = idRouter();
  router.get('/:id', async (req, res) => {
    const { attachment, bytes } = await attachments.download(req.ability, idParam(req));
    res.attachment(attachment.fileName).type(attachment.mediaType);
    res.set({ 'Cache-Control': 'private, no-store', 'X-Content-SHA256': attachment.sha256 }).send(bytes);
  });
  router.delete('/:id', async (req, res) => {
    await attachments.remove(req.ability, signedInActor(req), idParam(req));
    res.status(204).end();
  });
  return router;
}
