import type { Transaction } from 'sequelize';
import { ATTACHMENT_KIND_LABELS } from '../../shared/schemas/attachment.schema';
import { Attachment, type Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { parseRuleSet } from '../rule-sets/rule-set-cache';

/**
 * A manual item that requires an attachment (e.g. "material certificate attached") can only be
 * ticked when the revision has a file of that kind: the tick is evidence, not a promise.
 */
export async function assertAttachmentFor(revision: Revision, itemId: string, transaction: Transaction): Promise<void> {
  const item = revision.ruleSet
    ? (parseRuleSet(revision.ruleSet).manualItems ?? []).find((m) => m.id === itemId)
    : undefined;
  const kind = item?.requiresAttachment;
  if (!item || !kind) return;
  const count = await Attachment.count({ where: { revisionId: revision.id, kind }, transaction });
  if (count > 0) return;
  throw new AppError(
    'attachment_required',
    409,
    `"${item.text}" needs a ${ATTACHMENT_KIND_LABELS[kind].toLowerCase()} attached to revision ${revision.label} before it can be ticked; attach one on the Attachments tab`,
    { fieldErrors: { done: [`needs a ${kind} attachment first`] } },
  );
}
