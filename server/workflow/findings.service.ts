import type { Sequelize, Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import type { FindingAnchor } from '../../shared/format/finding-place';
import { Finding } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit } from '../audit/audit.service';
import { assertCan, loadRevisionForChange } from '../calcs/calc-access';
import { readRevision } from '../calcs/revision-read';
import { runTransaction } from '../db/transaction';
import { checkFindingAnchor } from './finding-anchor';
import { loadRevisionForReview, type Reviewer } from './reviewer';

const NO_ANCHOR: FindingAnchor = { clauseRef: null, anchorPath: null };
const RAISE_REFUSAL = 'Only an independent checker or approver reviewing this revision can raise findings';
const CLOSE_REFUSAL = 'Only an independent checker or approver reviewing this revision can close findings';

/**
 * Findings: a reviewer raises one on a clause row or a named input, the author answers it once, a reviewer closes
 * it. Each step is one transaction with its audit entry.
 */
export class FindingsService {
  constructor(private readonly sequelize: Sequelize) {}

  async raiseFinding(
    ability: AppAbility,
    actor: Reviewer,
    revisionId: number,
    text: string,
    anchor: FindingAnchor = NO_ANCHOR,
  ): Promise<RevisionDto> {
    await runTransaction(this.sequelize, async (transaction) => {
      const revision = await loadRevisionForReview(ability, actor, revisionId, RAISE_REFUSAL, transaction);
      const { clauseRef, anchorPath } = checkFindingAnchor(revision, anchor);
      const finding = await Finding.create(
        { revisionId, text, clauseRef, anchorPath, raisedBy: actor.id },
        { transaction },
      );
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'finding.raised',
          entityType: 'Revision',
          entityId: revisionId,
          payload: { findingId: finding.id, clauseRef, anchorPath, text },
        },
        transaction,
      );
    });
    return readRevision(ability, revisionId);
  }

  async answerFinding(ability: AppAbility, actor: Reviewer, findingId: number, answer: string): Promise<RevisionDto> {
    const revisionId = await runTransaction(this.sequelize, async (transaction) => {
      const finding = await this.loadFinding(findingId, transaction);
      const revision = await loadRevisionForChange(finding.revisionId, transaction);
      assertCan(ability, 'update', revision, 'Only the author of a returned or draft revision answers its findings');
      if (finding.status === 'closed') throw AppError.conflict('This finding is already closed');
      // One answer per finding: a second click or a second tab must not put two answers on the record.
      if (finding.status === 'answered')
        throw AppError.conflict(
          `Finding F${finding.id} is already answered; a reviewer closes it or raises a new finding`,
        );
      Object.assign(finding, { answer, answeredBy: actor.id, answeredAt: new Date(), status: 'answered' });
      await finding.save({ transaction });
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'finding.answered', entityType: 'Revision', entityId: revision.id, payload: { findingId, answer } },
        transaction,
      );
      return revision.id;
    });
    return readRevision(ability, revisionId);
  }

  async closeFinding(ability: AppAbility, actor: Reviewer, findingId: number): Promise<RevisionDto> {
    const revisionId = await runTransaction(this.sequelize, async (transaction) => {
      const finding = await this.loadFinding(findingId, transaction);
      const revision = await loadRevisionForReview(ability, actor, finding.revisionId, CLOSE_REFUSAL, transaction);
      if (finding.status !== 'answered') throw AppError.conflict('A finding is closed once its author has answered it');
      Object.assign(finding, { status: 'closed', closedBy: actor.id, closedAt: new Date() });
      await finding.save({ transaction });
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'finding.closed', entityType: 'Revision', entityId: revision.id, payload: { findingId } },
        transaction,
      );
      return revision.id;
    });
    return readRevision(ability, revisionId);
  }

  /**
   * Locked for the rest of the transaction, so two concurrent answers or closes queue instead of both passing the
   * check.
   */
  private async loadFinding(id: number, transaction: Transaction): Promise<Finding> {
    const finding = await Finding.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!finding) throw AppError.notFound(`Finding ${id}`);
    return finding;
  }
}
