import type { Transaction } from 'sequelize';
import { Attachment } from '../db/models';
import { signedAttachments, type SignedAttachment } from '../calcs/revision-content';

/**
 * Copies the previous revision's attachments into a new one when its author asks to. The bytes are
 * stored once by SHA-256, so only rows are copied. The author who carried them over becomes the
 * uploader (and may remove them while drafting); the note keeps who attached them first. Returns the set carried, for
 * the audit trail.
 */
export async function carryOver(
  fromRevisionId: number,
  toRevisionId: number,
  fromLabel: string,
  actor: { id: number; name: string },
  transaction: Transaction,
): Promise<SignedAttachment[]> {
  const rows = await Attachment.findAll({ where: { revisionId: fromRevisionId }, order: [['id', 'ASC']], transaction });
  for (const a of rows) {
    await Attachment.create(
      {
        revisionId: toRevisionId,
        kind: a.kind,
        fileName: a.fileName,
        mediaType: a.mediaType,
        sizeBytes: a.sizeBytes,
        sha256: a.sha256,
        storageKey: a.storageKey,
        note: `Carried over from revision ${fromLabel} (attached by ${a.uploadedByName})${a.note ? `: ${a.note}` : ''}`.slice(
          0,
          500,
        ),
        uploadedBy: actor.id,
        uploadedByName: actor.name,
      },
      { transaction },
    );
  }
  return signedAttachments(rows);
}
