import type { Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import { Finding, type Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit } from '../audit/audit.service';
import { assertCan, loadRevisionForChange } from '../calcs/calc-access';
import { readRevision } from '../calcs/revision-read';
import type { WorkflowService } from './workflow.service';
import { parseRuleSet } from '../rule-sets/rule-set-cache';
import { assertAttachmentFor } from '../attachments/attachment-rules';
import { assertNotBlind } from '../independent/blind-lists';
import { runTransaction } from '../db/transaction';
import { RETURNED_STATE } from '../../shared/workflow/revision-states';
import { assertIndependentReviewer, loadRevisionForReview, type Reviewer } from './reviewer';

const RETURN_REFUSAL = 'Only an independent checker (in check) or approver (checked) can return this revision';

/** The checker's and approver's side: manual items and returning a calc to its author (findings: FindingsService). */
export class ReviewService {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly workflow: WorkflowService,
  ) {}

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
      const revision = await loadRevisionForReview(ability, actor, revisionId, RETURN_REFUSAL, transaction);
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
      await assertIndependentReviewer(actor, revision.calcId, revision.authorId);
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
