import type { AppAbility } from '../../shared/authz/app-ability';
import type { AttachmentDto } from '../../shared/schemas/attachment.schema';
import { EDITABLE_STATES } from '../../shared/schemas/revision.schema';
import type { Revision, Attachment } from '../db/models';
import { AppError } from '../errors/app-error';
import { revisionSubject } from '../calcs/calc-access';
import { CLOSED_STATES } from '../../shared/workflow/state-sets';

/** Once a revision is released or closed its file set is part of the record: read-only. */
export const READ_ONLY_STATES: readonly Revision['status'][] = CLOSED_STATES;

/**
 * Who may add files: the author while editing, the independent checker or approver while
 * reviewing (a marked-up drawing, a certificate they obtained). Nobody else.
 */
export function mayAddFiles(ability: AppAbility, revision: Revision): boolean {
  if (READ_ONLY_STATES.includes(revision.status)) return false;
  const subject = revisionSubject(revision);
  return ability.can('update', subject) || ability.can('check', subject) || ability.can('return', subject);
}

/** Refuses an upload `mayAddFiles` does not allow: 409 once the file set is read-only, 403 otherwise. */
export function assertMayAdd(ability: AppAbility, revision: Revision): void {
  if (READ_ONLY_STATES.includes(revision.status)) throw readOnly(revision, 'added');
  if (!mayAddFiles(ability, revision)) {
    throw new AppError(
      'forbidden',
      403,
      'Files are added by the author while editing, or by the independent checker or approver while reviewing',
    );
  }
}

/** The uploader or the revision's author removes a file, and only before the revision is submitted. */
export function assertMayRemove(actorId: number, row: Attachment, revision: Revision): void {
  if (READ_ONLY_STATES.includes(revision.status)) throw readOnly(revision, 'removed');
  if (!EDITABLE_STATES.includes(revision.status))
    throw AppError.conflict(
      `Files are removed only before submission; revision ${revision.label} is ${revision.status.replace('_', ' ')}`,
    );
  // The author answers for every file of their draft, so they can take out one a co-editor attached by mistake.
  if (row.uploadedBy !== actorId && revision.authorId !== actorId)
    throw new AppError(
      'forbidden',
      403,
      'Only the person who attached a file, or the author of the revision, can remove it',
    );
}

function readOnly(revision: Revision, verb: string): AppError {
  const state = revision.status.replace('_', ' ');
  return new AppError(
    'read_only',
    409,
    `Revision ${revision.label} is ${state}; its attachments are read-only and none can be ${verb}. ` +
      'Start a new revision to change them.',
  );
}

// eslint-disable-next-line no-control-regex -- control characters are what cleanFileName strips
const CONTROL_OR_QUOTE = /[\u0000-\u001F\u007F"]/g;

/** A safe display name: no folders, no control characters, not empty, not absurdly long. */
export function cleanFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  const cleaned = base.replace(CONTROL_OR_QUOTE, '').trim().slice(-200);
  return cleaned.length > 0 && cleaned !== '.' && cleaned !== '..' ? cleaned : 'file';
}

export function toAttachmentDto(a: Attachment): AttachmentDto {
  return {
    id: a.id,
    revisionId: a.revisionId,
    kind: a.kind,
    fileName: a.fileName,
    mediaType: a.mediaType,
    sizeBytes: a.sizeBytes,
    sha256: a.sha256,
    note: a.note,
    uploadedBy: { id: a.uploadedBy, name: a.uploadedByName },
    createdAt: a.createdAt.toISOString(),
  };
}
