import { createHash } from 'node:crypto';
import type { Sequelize, Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { AttachmentDto, AttachmentListDto, UploadFields } from '../../shared/schemas/attachment.schema';
import { Attachment } from '../db/models';
import { AppError } from '../errors/app-error';
import type { Actor } from '../audit/audit.service';
import { loadRevision, loadRevisionForChange } from '../calcs/calc-access';
import { ObjectStore } from './object-store';
import { ACCEPTED_TYPE_NAMES, detectMediaType } from './content-type';
import { assertDeclaredKind } from './declared-kind';
import { assertMayAdd, assertMayRemove, mayAddFiles, toAttachmentDto } from './attachment-access';
import { addAttachmentRow, removeAttachmentRow, type CheckedUpload, type UploadedFile } from './attachment-records';
import { isProjectArchived } from '../projects/project-open';
import { runTransaction } from '../db/transaction';
import { forbiddenCheck } from '../authz/forbidden-check';

/** Drawings, certificates and supporting files of a revision: checked by content, stored by hash. */
export class AttachmentsService {
  constructor(
    private readonly sequelize: Sequelize,
    readonly store: ObjectStore,
    readonly maxBytes: number,
  ) {}

  async list(ability: AppAbility, revisionId: number): Promise<AttachmentListDto> {
    forbiddenCheck(ability).throwUnlessCan('read', 'Revision');
    const revision = await loadRevision(revisionId);
    const rows = await Attachment.findAll({ where: { revisionId }, order: [['id', 'ASC']] });
    return {
      items: rows.map(toAttachmentDto),
      canAdd: mayAddFiles(ability, revision) && !(await isProjectArchived(revision.calcId)),
      maxBytes: this.maxBytes,
      acceptedTypes: ACCEPTED_TYPE_NAMES,
    };
  }

  async upload(
    ability: AppAbility,
    actor: Actor & { id: number },
    revisionId: number,
    file: UploadedFile | undefined,
    fields: UploadFields,
  ): Promise<AttachmentDto> {
    if (!file) throw AppError.validation({ file: ['is required: send the file as multipart form field "file"'] });
    const mediaType = await detectMediaType(file.buffer);
    assertDeclaredKind(file.originalname, fields.kind, mediaType);
    const sha256 = createHash('sha256').update(file.buffer).digest('hex');
    const key = ObjectStore.keyFor(sha256);
    assertMayAdd(ability, await loadRevisionForChange(revisionId));
    // Bytes first: an orphaned blob after a failed insert is harmless, a row without bytes is not.
    await this.store.putIfAbsent(key, file.buffer, mediaType);
    const id = await runTransaction(this.sequelize, (transaction) =>
      this.addInTransaction(ability, actor, revisionId, { file, fields, mediaType, sha256, key }, transaction),
    );
    return toAttachmentDto((await Attachment.findByPk(id))!);
  }

  private async addInTransaction(
    ability: AppAbility,
    actor: Actor & { id: number },
    revisionId: number,
    upload: CheckedUpload,
    transaction: Transaction,
  ): Promise<number> {
    const revision = await loadRevisionForChange(revisionId, transaction);
    assertMayAdd(ability, revision);
    return addAttachmentRow(this.sequelize, actor, revision, upload, transaction);
  }

  async download(ability: AppAbility, id: number): Promise<{ attachment: AttachmentDto; bytes: Buffer }> {
    forbiddenCheck(ability).throwUnlessCan('read', 'Revision');
    const row = await Attachment.findByPk(id);
    if (!row) throw AppError.notFound(`Attachment ${id}`);
    return { attachment: toAttachmentDto(row), bytes: await this.store.get(row.storageKey) };
  }

  /** Removing a file changes the revision's content hash, like adding one (see `assertMayRemove` for who and when). */
  async remove(ability: AppAbility, actor: Actor & { id: number }, id: number): Promise<void> {
    await runTransaction(this.sequelize, async (transaction) => {
      const row = await Attachment.findByPk(id, { transaction });
      if (!row) throw AppError.notFound(`Attachment ${id}`);
      const revision = await loadRevisionForChange(row.revisionId, transaction);
      assertMayRemove(actor.id, row, revision);
      await removeAttachmentRow(this.sequelize, actor, row, revision, transaction);
    });
  }

  async assertMayAddTo(ability: AppAbility, revisionId: number): Promise<void> {
    assertMayAdd(ability, await loadRevisionForChange(revisionId));
  }
}
