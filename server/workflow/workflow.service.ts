import type { Sequelize, Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import type { SignRequest } from '../../shared/schemas/revision.schema';
import { Calc, Project, Signature, type Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import type { Actor } from '../audit/audit.service';
import { timed } from '../http/server-timing';
import { editorIdsOf, loadRevision } from '../calcs/calc-access';
import { readRevision } from '../calcs/revision-read';
import { assertMaySign, checkSigningPassword } from './signing-checks';
import { SIGNATURES } from '../../shared/workflow/signatures';
import { signedContentFor } from './signed-content';
import { queueHandOverMail, type HandOverFacts } from './hand-over-mail';
import { assertProjectOpen } from '../projects/project-open';
import { runTransaction } from '../db/transaction';
import { recordApprovalFacts, recordCheckFacts } from '../review-health/review-facts';
import {
  assertContentIntact,
  auditSignature,
  databaseNow,
  insertSignature,
  isReplayedSignature,
  type SignedContent,
  type Signer,
} from './signature-record';
import { advanceBySignature } from './signature-advance';

/**
 * Sign-off. Each signature is one transaction: lock the revision, re-check state, independence
 * and content hash, insert the signature, the state change, the audit entry and the mail, commit.
 */
export class WorkflowService {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly baseUrl: string,
  ) {}

  async sign(ability: AppAbility, signer: Signer, revisionId: number, dto: SignRequest): Promise<RevisionDto> {
    // Why the signature cannot happen comes first, so a blocked signer never sees "wrong password"
    // beside it; the same check runs again under the transaction below.
    // A retried request (same key) skips this: the revision has already moved on by its own signature.
    // Server-Timing names the phases of a signature: checks, password, write (integrity, content, advance, facts,
    // mail, the audit chain), then the read of the revision.
    // The revision is read before the key is looked for: a twin request (same key) that commits in between has then
    // left its signature for the look-up to find; in the other order a retry could miss the key, then read the revision
    // its twin had moved on, and be refused as a signature out of turn (a 409 once in a fresh-clone test run).
    await timed('checks', async () => {
      const revision = await loadRevision(revisionId);
      const retried = await Signature.findOne({ where: { idempotencyKey: dto.idempotencyKey } });
      if (retried) return;
      await assertProjectOpen(revision.calcId);
      await assertMaySign(dto.meaning, signer, revision);
    });
    await timed('password', () => checkSigningPassword(this.sequelize, signer, revisionId, dto));
    // a second run of the transaction finds its own signature by the idempotency key
    await timed('write', () =>
      runTransaction(this.sequelize, (t) => this.signInTransaction(signer, revisionId, dto, t), { idempotent: true }),
    );
    return readRevision(ability, revisionId);
  }

  private async signInTransaction(
    signer: Signer,
    revisionId: number,
    dto: SignRequest,
    transaction: Transaction,
  ): Promise<void> {
    const revision = await loadRevision(revisionId, transaction);
    if (await isReplayedSignature(signer, revisionId, dto, transaction)) return;
    // Checked after the replay above: a replayed signature answers as the first request did.
    await assertProjectOpen(revision.calcId, transaction);
    if (revision.lockVersion !== dto.lockVersion)
      throw AppError.conflict('The revision changed since you opened it; review the new content before signing');
    await assertMaySign(dto.meaning, signer, revision, transaction);
    const hash = await timed('integrity', () => assertContentIntact(revision, transaction));
    const now = await databaseNow(this.sequelize, transaction);
    const known = { format: revision.contentFormat ?? 1, hash };
    const signed = await timed('content', () => signedContentFor(revision, transaction, known));
    await insertSignature(signer, revisionId, dto, signed, now, transaction);
    await timed('advance', () => advanceBySignature(this.sequelize, revision, dto.meaning, signer, now, transaction));
    await timed('facts', () => this.recordFacts(revisionId, dto, signed, transaction));
    await auditSignature(this.sequelize, signer, revision, dto, signed, transaction);
    await timed('mail', () => this.mail(SIGNATURES[dto.meaning].event, revision, signer, transaction));
  }

  /** The review-health facts a check or an approval leaves behind. */
  private async recordFacts(
    revisionId: number,
    dto: SignRequest,
    signed: SignedContent,
    transaction: Transaction,
  ): Promise<void> {
    if (dto.meaning === 'checked') await recordCheckFacts(this.sequelize, revisionId, transaction);
    if (dto.meaning === 'approved')
      await recordApprovalFacts(this.sequelize, revisionId, JSON.stringify(signed.attachments), transaction);
  }

  async mail(
    event: HandOverFacts['event'],
    revision: Revision,
    actor: Actor,
    transaction: Transaction,
    reason?: string,
  ): Promise<void> {
    const calc = (await Calc.findByPk(revision.calcId, { include: [Project], transaction })) as Calc & {
      Project: Project;
    };
    await queueHandOverMail(
      {
        event,
        calcId: calc.id,
        calcNumber: calc.number,
        calcTitle: calc.title,
        projectCode: calc.Project.code,
        revision: revision.label,
        actorName: actor.name,
        authorId: revision.authorId,
        checkerId: revision.checkerId,
        editorIds: await editorIdsOf(calc.id, transaction),
        reason,
        baseUrl: this.baseUrl,
      },
      transaction,
    );
  }
}
