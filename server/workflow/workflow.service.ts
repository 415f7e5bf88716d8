import { QueryTypes, Op, type Sequelize, type Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { Role } from '../../shared/authz/roles';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import type { SignRequest } from '../../shared/schemas/revision.schema';
import { Calc, Project, Revision, Signature } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { timed } from '../http/server-timing';
import { editorIdsOf, loadRevision, loadRevisionForChange } from '../calcs/calc-access';
import { currentHashOf, readRevision } from '../calcs/revision-read';
import type { Meaning } from './independence';
import { assertMaySign, checkSigningPassword } from './signing-checks';
import { SIGNATURES, roleFor } from '../../shared/workflow/signatures';
import { SUPERSEDED_STATE } from '../../shared/workflow/revision-states';
import { signedContentFor } from './signed-content';
import { queueHandOverMail, type HandOverFacts } from './hand-over-mail';
import { assertProjectOpen } from '../projects/project-open';
import { runTransaction } from '../db/transaction';
import { recordApprovalFacts, recordCheckFacts } from '../review-health/review-facts';

export interface Signer extends Actor {
  id: number;
  roles: readonly Role[];
}

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
    await timed('checks', async () => {
      const retried = await Signature.findOne({ where: { idempotencyKey: dto.idempotencyKey } });
      if (retried) return;
      const revision = await loadRevisionForChange(revisionId);
      await assertMaySign(dto.meaning, signer, revision);
    });
    await timed('password', () => checkSigningPassword(this.sequelize, signer, revisionId, dto));
    await timed('write', () => this.signInTransaction(signer, revisionId, dto));
    return readRevision(ability, revisionId);
  }

  private async signInTransaction(signer: Signer, revisionId: number, dto: SignRequest): Promise<void> {
    await runTransaction(
      this.sequelize,
      async (transaction) => {
        const revision = await loadRevision(revisionId, transaction);
        // A retried request with the same key has already done its work: answer as the first did.
        const earlier = await Signature.findOne({ where: { idempotencyKey: dto.idempotencyKey }, transaction });
        if (earlier && earlier.revisionId === revisionId && earlier.userId === signer.id) return;
        if (earlier)
          throw AppError.conflict(
            'This signing request key was already used for another signature; reload and sign again',
          );
        // Checked after the replay above: a replayed signature answers as the first request did.
        await assertProjectOpen(revision.calcId, transaction);
        if (revision.lockVersion !== dto.lockVersion)
          throw AppError.conflict('The revision changed since you opened it; review the new content before signing');
        await assertMaySign(dto.meaning, signer, revision, transaction);
        const hash = await timed('integrity', () => currentHashOf(revision, transaction));
        if (!hash || hash !== revision.contentHash)
          throw new AppError(
            'integrity',
            409,
            'The stored content does not match its recorded hash; signing is refused and compliance should investigate',
          );
        const [{ now }] = await this.sequelize.query<{ now: Date }>('SELECT UTC_TIMESTAMP(3) AS now', {
          type: QueryTypes.SELECT,
          transaction,
        });
        const known = { format: revision.contentFormat ?? 1, hash };
        const signed = await timed('content', () => signedContentFor(revision, transaction, known));
        await Signature.create(
          {
            revisionId,
            userId: signer.id,
            printedName: signer.name,
            role: roleFor(dto.meaning),
            meaning: dto.meaning,
            signedAt: new Date(now),
            contentHash: signed.hash,
            contentFormat: signed.format,
            attachments: JSON.stringify(signed.attachments),
            idempotencyKey: dto.idempotencyKey,
          },
          { transaction },
        );
        await timed('advance', () => this.advance(revision, dto.meaning, signer, new Date(now), transaction));
        await timed('facts', async () => {
          if (dto.meaning === 'checked') await recordCheckFacts(this.sequelize, revisionId, transaction);
          if (dto.meaning === 'approved')
            await recordApprovalFacts(this.sequelize, revisionId, JSON.stringify(signed.attachments), transaction);
        });
        await appendAudit(
          this.sequelize,
          signer,
          {
            action: `revision.signed_${dto.meaning}`,
            entityType: 'Revision',
            entityId: revisionId,
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
        await timed('mail', () => this.mail(SIGNATURES[dto.meaning].event, revision, signer, transaction));
      },
      { idempotent: true },
    ); // a second run finds its own signature by the idempotency key
  }

  /** The state change and stamps a signature makes, as the workflow table gives them. */
  private async advance(
    revision: Revision,
    meaning: Meaning,
    signer: Signer,
    at: Date,
    transaction: Transaction,
  ): Promise<void> {
    const { to, stamp, supersedesOlder } = SIGNATURES[meaning];
    revision.status = to;
    revision[stamp.at] = at;
    if (stamp.by) revision[stamp.by] = signer.id;
    await revision.save({ transaction });
    if (supersedesOlder) await this.supersedeOlder(revision, signer, transaction);
  }

  /** Approving a revision supersedes every earlier approved revision of the same calc. */
  private async supersedeOlder(revision: Revision, signer: Signer, transaction: Transaction): Promise<void> {
    const older = await Revision.findAll({
      where: { calcId: revision.calcId, status: revision.status, id: { [Op.ne]: revision.id } },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    for (const r of older) {
      r.status = SUPERSEDED_STATE;
      await r.save({ transaction });
      await appendAudit(
        this.sequelize,
        signer,
        {
          action: 'revision.superseded',
          entityType: 'Revision',
          entityId: r.id,
          payload: { calcId: r.calcId, revision: r.label, supersededBy: revision.label },
        },
        transaction,
      );
    }
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
