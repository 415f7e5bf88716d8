import type { Sequelize, Transaction } from 'sequelize';
import type { UploadFields } from '../../shared/schemas/attachment.schema';
import { Attachment, type Revision } from '../db/models';
import { appendAudit, type Actor } from '../audit/audit.service';
import { refreshAfterAttachmentChange } from '../workflow/signed-content';
import { cleanFileName } from './attachment-access';

/** Attachment rows written and deleted inside a revision's transaction, each with its audit entry. */

export interface UploadedFile {
  buffer: Buffer;
  originalname: string;
}

/** An upload once its content is checked and its bytes stored under `key`. */
export interface CheckedUpload {
  file: UploadedFile;
  fields: UploadFields;
  mediaType: string;
  sha256: string;
  key: string;
}

/** Adds the row, refreshes the revision's content hash and records who added what. Returns the new row's id. */
export async function addAttachmentRow(
  sequelize: Sequelize,
  actor: Actor & { id: number },
  revision: Revision,
  { file, fields, mediaType, sha256, key }: CheckedUpload,
  transaction: Transaction,
): Promise<number> {
  const row = await Attachment.create(
    {
      revisionId: revision.id,
      kind: fields.kind,
      fileName: cleanFileName(file.originalname),
      mediaType,
      sizeBytes: file.buffer.length,
      sha256,
      storageKey: key,
      note: fields.note,
      uploadedBy: actor.id,
      uploadedByName: actor.name,
    },
    { transaction },
  );
  await refreshAfterAttachmentChange(revision, transaction);
  await appendAudit(
    sequelize,
    actor,
    {
      action: 'attachment.added',
      entityType: 'Revision',
      entityId: revision.id,
      payload: {
        attachmentId: row.id,
        kind: row.kind,
        fileName: row.fileName,
        mediaType,
        sizeBytes: row.sizeBytes,
        sha256,
        contentHash: revision.contentHash,
      },
    },
    transaction,
  );
  return row.id;
}

/** Deletes the row, refreshes the revision's content hash and records the removal. */
export async function removeAttachmentRow(
  sequelize: Sequelize,
  actor: Actor & { id: number },
  row: Attachment,
  revision: Revision,
  transaction: Transaction,
): Promise<void> {
  await row.destroy({ transaction });
  await refreshAfterAttachmentChange(revision, transaction);
  await appendAudit(
    sequelize,
    actor,
    {
      action: 'attachment.removed',
      entityType: 'Revision',
      entityId: row.revisionId,
      payload: {
        attachmentId: row.id,
        kind: row.kind,
        fileName: row.fileName,
        sha256: row.sha256,
        contentHash: revision.contentHash,
      },
    },
    transaction,
  );
}
