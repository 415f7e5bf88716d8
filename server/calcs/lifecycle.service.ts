import type { Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import { Project, Revision, RuleSetRecord } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { assertCan, loadCalcForChange, loadRevisionForChange, recordEditor } from './calc-access';
import { computeRecord } from './revision-content';
import { readRevision } from './revision-read';
import { parseRuleSet } from '../rule-sets/rule-set-cache';
import { revisionLabel } from './revision-label';
import type { CalcsService } from './calcs.service';
import { stored } from './revision-save';
import { carryOver } from '../attachments/carry-over';
import { runTransaction } from '../db/transaction';
import { WITHDRAWN_STATE, WORKFLOW, type RevisionState } from '../../shared/workflow/revision-states';
import { forbiddenCheck } from '../authz/forbidden-check';

/** Starting and ending revisions: a new revision after approval, or withdrawing a draft. */
export class LifecycleService {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly calcs: CalcsService,
  ) {}

  /**
   * A change to an approved calc is a new revision: a draft copy of the latest one, with a
   * reason for change, checked against the standard's version in effect today.
   */
  async newRevision(
    ability: AppAbility,
    actor: Actor & { id: number },
    calcId: number,
    reasonForChange: string,
    carryAttachments = false,
  ): Promise<RevisionDto> {
    forbiddenCheck(ability).setMessage('Only authors start new revisions').throwUnlessCan('create', 'Calc');
    const id = await runTransaction(this.sequelize, async (transaction) => {
      const calc = await loadCalcForChange(calcId, transaction);
      const latest = await Revision.findOne({
        where: { calcId },
        order: [['seq', 'DESC']],
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      if (!latest || !WORKFLOW[latest.status as RevisionState].allowsNextRevision) {
        throw AppError.conflict(
          `Revision ${latest?.label} is still ${latest?.status.replace('_', ' ')}; finish or withdraw it before starting another`,
        );
      }
      const ruleSet = await this.currentVersionOf(latest.ruleSetId);
      const project = await Project.findByPk(calc.projectId, { transaction });
      const input = JSON.parse(latest.input);
      const computed = await computeRecord(input, parseRuleSet(ruleSet));
      const revision = await Revision.create(
        {
          calcId,
          seq: latest.seq + 1,
          label: revisionLabel(project!.revisionScheme, latest.seq + 1),
          authorId: actor.id,
          ruleSetId: ruleSet.id,
          input: latest.input,
          reasonForChange,
          manualItems: '{}',
          ...stored(computed),
        },
        { transaction },
      );
      const carried = carryAttachments ? await carryOver(latest.id, revision.id, latest.label, actor, transaction) : [];
      await this.calcs.refreshHash(revision, transaction);
      await recordEditor(calcId, actor.id, transaction);
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'revision.created',
          entityType: 'Revision',
          entityId: revision.id,
          payload: {
            calcId,
            revision: revision.label,
            from: latest.label,
            reasonForChange,
            ruleSet: `${ruleSet.code} v${ruleSet.version}`,
            attachmentsCarriedOver: carried,
          },
        },
        transaction,
      );
      return revision.id;
    });
    return readRevision(ability, id);
  }

  async withdraw(
    ability: AppAbility,
    actor: Actor & { id: number },
    revisionId: number,
    reason: string,
    lockVersion: number,
  ): Promise<RevisionDto> {
    await runTransaction(this.sequelize, async (transaction) => {
      const revision = await loadRevisionForChange(revisionId, transaction);
      assertCan(ability, 'update', revision, 'Only the author can withdraw a draft or returned revision');
      if (revision.lockVersion !== lockVersion)
        throw AppError.conflict('The revision changed since you opened it; reload it');
      revision.status = WITHDRAWN_STATE;
      await revision.save({ transaction });
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'revision.withdrawn',
          entityType: 'Revision',
          entityId: revisionId,
          payload: { calcId: revision.calcId, revision: revision.label, reason },
        },
        transaction,
      );
    });
    return readRevision(ability, revisionId);
  }

  /** The effective version of the same standard today, or the one the last revision used. */
  private async currentVersionOf(ruleSetId: number): Promise<RuleSetRecord> {
    const used = await RuleSetRecord.findByPk(ruleSetId);
    const effective = await RuleSetRecord.findOne({
      where: { code: used!.code, status: 'effective' },
      order: [['version', 'DESC']],
    });
    return effective ?? used!;
  }
}
