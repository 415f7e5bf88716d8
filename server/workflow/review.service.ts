import type { Sequelize, Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import { Finding, type Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { assertCan, editorIdsOf, loadRevisionForChange } from '../calcs/calc-access';
import { readRevision } from '../calcs/revision-read';
import type { WorkflowService } from './workflow.service';
import { parseRuleSet } from '../rule-sets/rule-set-cache';
import { assertAttachmentFor } from '../attachments/attachment-rules';
import { assertNotBlind } from '../independent/blind-lists';
import { runTransaction } from '../db/transaction';
import { RETURNED_STATE } from '../../shared/workflow/revision-states';
import { checkFindingAnchor } from './finding-anchor';
import type { FindingAnchor } from '../../shared/format/finding-place';

const NO_ANCHOR: FindingAnchor = { clauseRef: null, anchorPath: null };

type Reviewer = Actor & { id: number };

/** The checker's and approver's side: findings, manual items, returning a calc to its author. */
export class ReviewService {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly workflow: WorkflowService,
  ) {}

  async raiseFinding(
    ability: AppAbility,
    actor: Reviewer,
    revisionId: number,
    text: string,
    anchor: FindingAnchor = NO_ANCHOR,
  ): Promise<RevisionDto> {
    await runTransaction(this.sequelize, async (transaction) => {
      const revision = await loadRevisionForChange(revisionId, transaction);
      assertCan(
        ability,
        'return',
        revision,
        'Only an independent checker or approver reviewing this revision can raise findings',
      );
      await this.assertIndependent(actor, revision.calcId, revision.authorId);
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
      const revision = await loadRevisionForChange(finding.revisionId, transaction);
      assertCan(
        ability,
        'return',
        revision,
        'Only an independent checker or approver reviewing this revision can close findings',
      );
      await this.assertIndependent(actor, revision.calcId, revision.authorId);
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
   * Back to the author. With open findings the reason goes with the return (trail and mail) and the
   * author answers the findings; only a return without any becomes a finding itself, so the same
   * point never has to be answered twice.
   */
  async returnToAuthor(
    ability: AppAbility,
    actor: Reviewer,
    revisionId: number,
    reason: string,
    lockVersion: number,
  ): Promise<RevisionDto> {
    await runTransaction(this.sequelize, async (transaction) => {
      const revision = await loadRevisionForChange(revisionId, transaction);
      assertCan(
        ability,
        'return',
        revision,
        'Only an independent checker (in check) or approver (checked) can return this revision',
      );
      await this.assertIndependent(actor, revision.calcId, revision.authorId);
      if (revision.lockVersion !== lockVersion)
        throw AppError.conflict('The revision changed since you opened it; reload it');
      const from = revision.status;
      revision.status = RETURNED_STATE;
      await revision.save({ transaction });
      const open = await Finding.count({ where: { revisionId, status: 'open' }, transaction });
      if (open === 0)
        await Finding.create({ revisionId, text: reason, clauseRef: null, raisedBy: actor.id }, { transaction });
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'revision.returned',
          entityType: 'Revision',
          entityId: revisionId,
          payload: { calcId: revision.calcId, revision: revision.label, from, reason },
        },
        transaction,
      );
      await this.workflow.mail('returned', revision, actor, transaction, reason);
    });
    return readRevision(ability, revisionId);
  }

  async setManualItem(
    ability: AppAbility,
    actor: Reviewer,
    revisionId: number,
    itemId: string,
    done: boolean,
    note: string,
  ): Promise<RevisionDto> {
    await runTransaction(this.sequelize, async (transaction) => {
      const revision = await loadRevisionForChange(revisionId, transaction);
      assertCan(
        ability,
        'check',
        revision,
        'Manual checklist items are ticked by the independent checker while the calc is in check',
      );
      await this.assertIndependent(actor, revision.calcId, revision.authorId);
      await assertNotBlind(ability, revision, transaction);
      assertKnownItem(revision, itemId);
      if (done) await assertAttachmentFor(revision, itemId, transaction);
      const items = JSON.parse(revision.manualItems) as Record<string, unknown>;
      items[itemId] = { done, note, by: actor.name, at: new Date().toISOString() };
      revision.manualItems = JSON.stringify(items);
      await revision.save({ transaction });
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'revision.manual_item',
          entityType: 'Revision',
          entityId: revisionId,
          payload: { itemId, done, note },
        },
        transaction,
      );
    });
    return readRevision(ability, revisionId);
  }

  private async assertIndependent(actor: Reviewer, calcId: number, authorId: number): Promise<void> {
    if (actor.id === authorId || (await editorIdsOf(calcId)).includes(actor.id)) {
      throw new AppError(
        'forbidden',
        403,
        'You edited this calc, so you cannot review it; independence requires someone else',
      );
    }
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

/**
 * Only the manual items the revision's rule set lists can be ticked; anything else would be a tick that checks nothing.
 */
function assertKnownItem(revision: Revision, itemId: string): void {
  const items = revision.ruleSet ? (parseRuleSet(revision.ruleSet).manualItems ?? []) : [];
  if (items.some((i) => i.id === itemId)) return;
  const standard = revision.ruleSet ? `${revision.ruleSet.code} v${revision.ruleSet.version}` : 'the rule set';
  throw new AppError('validation', 400, `"${itemId}" is not a manual item of ${standard}`, {
    fieldErrors: { 'params.itemId': [`is not a manual item of ${standard}`] },
  });
}
