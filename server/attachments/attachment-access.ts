import type { AppAbility } from '../../shared/authz/app-ability';
import type { AttachmentDto } from '../../shared/schemas/attachment.schema';
import type { Revision, Attachment } from '../db/models';
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
