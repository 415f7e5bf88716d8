import { placeOf } from '../../shared/engine/field-places';
import { Op, type Sequelize } from 'sequelize';
import { evaluateValidInput, validateCalcInput } from '../../shared/engine';
import { applyRuleSetMethods, diffRuleSets, evaluateChecklistSync } from '../../shared/rules';
import { impactRowOf, type ScannedRevision } from './impact-compare';
import { impactCsv, impactMail } from './impact-report';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { ImpactReport, ImpactRow } from '../../shared/schemas/rule-set.schema';
import { Calc, Project, Revision, RuleSetRecord } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { enqueueMail, emailsOfRole } from '../mail/outbox';
import { loadRuleSet } from './rule-set-cache';
import { readRevision } from '../calcs/revision-read';
import { runTransaction } from '../db/transaction';
import { forbiddenCheck } from '../authz/forbidden-check';

const BATCH = 1000;

/** Impact analysis: which approved calcs would change verdict under another version of a standard. */
export class ImpactService {
  constructor(private readonly sequelize: Sequelize) {}

  async analyse(ability: AppAbility, ruleSetId: number): Promise<ImpactReport> {
    forbiddenCheck(ability).setMessage('Impact analysis is for compliance').throwUnlessCan('impact', 'RuleSet');
    return this.run(ruleSetId);
  }

  private async run(ruleSetId: number): Promise<ImpactReport> {
    const started = Date.now();
    const { record, doc } = await loadRuleSet(ruleSetId);
    // A version of a standard governs only the calcs checked against that standard, not every approved calc.
    const versionIds = (await RuleSetRecord.findAll({ attributes: ['id'], where: { code: record.code } })).map(
      (r) => r.id,
    );
    const rows: ImpactRow[] = [];
    let evaluated = 0;
    for (let batch = await approvedBatch(versionIds, 0); batch.length > 0;) {
      evaluated += batch.length;
      for (const revision of batch) {
        const row = impactRowOf(revision, doc);
        if (row) rows.push(row);
      }
      batch = await approvedBatch(versionIds, batch[batch.length - 1].id);
    }
    return {
      ruleSet: { id: record.id, code: record.code, version: record.version },
      evaluated,
      changed: rows.length,
      rows,
      elapsedMs: Date.now() - started,
    };
  }

  async csv(ability: AppAbility, ruleSetId: number): Promise<string> {
    return impactCsv(await this.analyse(ability, ruleSetId));
  }

  async diff(ability: AppAbility, fromId: number, toId: number) {
    forbiddenCheck(ability).throwUnlessCan('read', 'RuleSet');
    const [a, b] = await Promise.all([loadRuleSet(fromId), loadRuleSet(toId)]);
    return {
      from: { id: a.record.id, code: a.record.code, version: a.record.version },
      to: { id: b.record.id, code: b.record.code, version: b.record.version },
      changes: diffRuleSets(a.doc, b.doc),
    };
  }

  /** "Try it": evaluate a draft (or any version) against one revision's input, without storing anything. */
  async tryIt(ability: AppAbility, ruleSetId: number, revisionId: number) {
    forbiddenCheck(ability).throwUnlessCan('read', 'RuleSet');
    const { record, doc } = await loadRuleSet(ruleSetId);
    const revision = await readRevision(ability, revisionId);
    const validated = validateCalcInput(revision.input);
    if (!validated.ok)
      throw new AppError('validation', 400, `Revision ${revision.label} has input errors and cannot be evaluated`, {
        fieldErrors: { revisionId: validated.issues.map((i) => `${placeOf(i.path)}: ${i.message}`) },
      });
    const input = applyRuleSetMethods(validated.value, doc);
    const checklist = evaluateChecklistSync(input, evaluateValidInput(input), doc);
    return {
      ruleSet: { id: record.id, code: record.code, version: record.version },
      revision: { id: revision.id, label: revision.label },
      checklist,
      before: revision.checklist,
    };
  }

  /** After a version becomes effective: tell compliance when approved calcs would now change verdict. */
  async notifyIfAffected(actor: Actor, ruleSetId: number): Promise<void> {
    const record = await RuleSetRecord.findByPk(ruleSetId);
    if (!record) return;
    const report = await this.run(record.id);
    if (report.changed === 0) return;
    await runTransaction(this.sequelize, async (transaction) => {
      const to = await emailsOfRole('compliance', [], transaction);
      await enqueueMail(to, { event: 'impact', ...impactMail(record, report, actor) }, transaction);
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'rule_set.impact_notified',
          entityType: 'RuleSet',
          entityId: record.id,
          payload: { changed: report.changed, evaluated: report.evaluated },
        },
        transaction,
      );
    });
  }
}

/** The next approved revisions after `lastId` under any of the versions, read in id order a batch at a time. */
async function approvedBatch(versionIds: number[], lastId: number): Promise<ScannedRevision[]> {
  // Only the input and the compact outcome are read: full results and checklists are large.
  const batch = await Revision.findAll({
    attributes: ['id', 'calcId', 'label', 'input', 'verdict', 'outcome', 'approvedAt'],
    where: { status: 'approved', ruleSetId: { [Op.in]: versionIds }, id: { [Op.gt]: lastId } },
    include: [
      { model: Calc, attributes: ['id', 'number', 'title'], include: [{ model: Project, attributes: ['code'] }] },
    ],
    order: [['id', 'ASC']],
    limit: BATCH,
  });
  return batch as ScannedRevision[];
}
