import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { Role } from '../../shared/authz/roles';
import type { SignRequest } from '../../shared/schemas/revision.schema';
import { roleFor } from '../../shared/workflow/signatures';
import { Signature, type Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { currentHashOf } from '../calcs/revision-read';
import type { SignedAttachment } from '../calcs/revision-content';

export interface Signer extends Actor {
  id: number;
  roles: readonly Role[];
}

/** What one signature covers, as `signedContentFor` gives it. */
export interface SignedContent {
  hash: string;
  format: number;
  attachments: SignedAttachment[];
}

/**
 * True when this request (same key, revision and signer) has already signed: it answers as the first did. The same
 * key on another signature is a 409.
 */
export async function isReplayedSignature(
  signer: Signer,
  revisionId: number,
  dto: SignRequest,
  transaction: Transaction,
): Promise<boolean> {
  const earlier = await Signature.findOne({ where: { idempotencyKey: dto.idempotencyKey }, transaction });
  if (earlier && earlier.revisionId === revisionId && earlier.userId === signer.id) return true;
  if (earlier)
    throw AppError.conflict('This signing request key was already used for another signature; reload and sign again');
  return false;
}

/** The content hash recomputed under the transaction; a mismatch with the recorded one refuses the signature. */
export async function assertContentIntact(revision: Revision, transaction: Transaction): Promise<string> {
  const hash = await currentHashOf(revision, transaction);
  if (!hash || hash !== revision.contentHash)
    throw new AppError(
      'integrity',
      409,
      'The stored content does not match its recorded hash; signing is refused and compliance should investigate',
    );
  return hash;
}

/** The signature's time, read from the database's clock (UTC, to the millisecond). */
export async function databaseNow(sequelize: Sequelize, transaction: Transaction): Promise<Date> {
  const [{ now }] = await sequelize.query<{ now: Date }>('SELECT UTC_TIMESTAMP(3) AS now', {
    type: QueryTypes.SELECT,
    transaction,
  });
  return new Date(now);
}

export async function insertSignature(
  signer: Signer,
  revisionId: number,
  dto: SignRequest,
  signed: SignedContent,
  signedAt: Date,
  transaction: Transaction,
): Promise<void> {
  await Signature.create(
    {
      revisionId,
      userId: signer.id,
      printedName: signer.name,
      role: roleFor(dto.meaning),
      meaning: dto.meaning,
      signedAt,
      contentHash: signed.hash,
      contentFormat: signed.format,
      attachments: JSON.stringify(signed.attachments),
      idempotencyKey: dto.idempotencyKey,
    },
    { transaction },
  );
}

export async function auditSignature(
  sequelize: Sequelize,
  signer: Signer,
  revision: Revision,
  dto: SignRequest,
  signed: SignedContent,
  transaction: Transaction,
): Promise<void> {
  await appendAudit(
    sequelize,
    signer,
    {
      action: `revision.signed_${dto.meaning}`,
      entityType: 'Revision',
      entityId: revision.id,
      payload: {
        calcId: revision.calcId,
        revision: revision.label,
        meaning: dto.meaning,
        contentHash: signed.hash,
        attachments: signed.attachments,
        state: revision.status,
      },
    },
    transaction,
  );
}
