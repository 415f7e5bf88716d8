import type { Transaction } from 'sequelize';
import { Attachment, type Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { EDITABLE_STATES } from '../../shared/schemas/revision.schema';
import { CONTENT_FORMAT, signedAttachments, type SignedAttachment } from '../calcs/revision-content';
import { currentHashOf } from '../calcs/revision-read';
import { signingFormatOf } from '../independent/signed-model';

/**
 * What a new signature covers: the content in the current format, attachments included. A revision
 * still in format 1 (made before attachments were signed) moves to format 2 here; its earlier
 * signatures keep their format and are judged in it, so they verify exactly as before. `known`: the
 * content's hash in one format, computed under this same transaction.
 */
export async function signedContentFor(
  revision: Revision,
  transaction: Transaction,
  known?: { format: number; hash: string | null },
): Promise<{ hash: string; format: number; attachments: SignedAttachment[] }> {
  const rows = await Attachment.findAll({ where: { revisionId: revision.id }, transaction });
  const format = await signingFormatOf(revision.id, CONTENT_FORMAT, transaction);
  // The hash just recomputed in the same transaction (the integrity check) is the one to sign when its format is.
  const hash = known?.format === format ? known.hash : await currentHashOf(revision, transaction, undefined, format);
  if (!hash) throw new AppError('integrity', 409, 'The revision has no result to sign');
  revision.contentFormat = format;
  revision.contentHash = hash;
  return { hash, format, attachments: signedAttachments(rows) };
}

/** After the attachment set changed: the revision's hash follows it, and a signer must reload first. */
export async function refreshAfterAttachmentChange(revision: Revision, transaction: Transaction): Promise<void> {
  revision.contentFormat = await signingFormatOf(revision.id, CONTENT_FORMAT, transaction);
  revision.contentHash = await currentHashOf(revision, transaction, undefined, revision.contentFormat);
  // In review a signer must have seen the new set (409 until they reload); the author editing keeps their place.
  if (!EDITABLE_STATES.includes(revision.status)) revision.lockVersion += 1;
  await revision.save({ transaction });
}
