import { placeOf } from '../../shared/engine/field-places';
import { ForbiddenError } from '@casl/ability';
import { Op, type Sequelize } from 'sequelize';
import { CAUTION, evaluateValidInput, validateCalcInput } from '../../shared/engine';
import { applyRuleSetMethods, diffRuleSets, evaluateChecklist, type RuleSet } from '../../shared/rules';
import type { OutcomeSummary } from '../../shared/schemas/outcome';
import { outcomeUnder, storedOutcome } from './impact-compare';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { ImpactReport, ImpactRow } from '../../shared/schemas/rule-set.schema';
import { Calc, Project, Revision, RuleSetRecord } from '../db/models';
import { AppError } from '../errors/app-error';
import { toCsv, type CsvColumn } from '../http/csv';
import { appendAudit, type Actor } from '../audit/audit.service';
import { enqueueMail, emailsOfRole } from '../mail/outbox';
import { appLink } from '../mail/links';
import { loadRuleSet } from './rule-set-cache';
import { readRevision } from '../calcs/revision-read';
import { runTransaction } from '../db/transaction';

const BATCH = 1000;

/**
 * Mandatory rows that fail under one version but not under the other, each with its clause title
 * (from the new version where it exists there). Keys are "clause|location|status".
 */
export function changedClauses(before: OutcomeSummary, after: OutcomeSummary, doc: RuleSet): ImpactRow['clauses'] {
  const strip = (key: string) => key.split('|').slice(0, 2).join('|');
  const was = new Map(before.failing.map((k) => [strip(k), k.split('|')[2]]));
  const now = new Map(after.failing.map((k) => [strip(k), k.split('|')[2]]));
  const titles = new Map(doc.clauses.map((c) => [c.id, c.title]));
  return [...new Set([...was.keys(), ...now.keys()])]
    .filter((k) => was.has(k) !== now.has(k))
    .map((k) => {
      const [clauseId, location] = k.split('|');
      return {
        clauseId,
        location,
        title: titles.get(clauseId) ?? '(not in this version)',
        before: was.get(k) ?? 'pass',
        after: now.get(k) ?? 'pass',
      };
    });
}

/** Impact analysis: which approved calcs would change verdict under another version of a standard. */
/** Impact CSV columns: titles and clause texts are people's words, so the CSV writer neutralises them. */
const IMPACT_COLUMNS: CsvColumn<ImpactRow>[] = [
  { header: 'project', value: (r) => r.projectCode },
  { header: 'calc', value: (r) => r.number },
  { header: 'title', value: (r) => r.title },
  { header: 'revision', value: (r) => r.revision },
  { header: 'approved at (UTC, ISO 8601)', value: (r) => r.approvedAt },
  { header: 'verdict before', value: (r) => r.before },
  { header: 'verdict after', value: (r) => r.after },
  { header: 'clauses that change (count)', value: (r) => r.clauses.length, numeric: true },
  {
    header: 'clauses that change',
    value: (r) => r.clauses.map((c) => `${c.clauseId} ${c.location}: ${c.before}→${c.after}`).join('; '),
  },
];

export class ImpactService {
  constructor(private readonly sequelize: Sequelize) {}

  async analyse(ability: AppAbility, ruleSetId: number): Promise<ImpactReport> {
    ForbiddenError.from(ability).setMessage('Impact analysis is for compliance').throwUnlessCan('impact', 'RuleSet');
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
    for (let lastId = 0; ;) {
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
      if (batch.length === 0) break;
      lastId = batch[batch.length - 1].id;
      for (const revision of batch) {
        evaluated++;
        const row = this.compare(revision as Revision & { Calc: Calc & { Project: Project } }, doc);
        if (row) rows.push(row);
      }
    }
    return {
      ruleSet: { id: record.id, code: record.code, version: record.version },
      evaluated,
      changed: rows.length,
      rows,
      elapsedMs: Date.now() - started,
    };
  }

  /** A row when the verdict changes; the clauses behind it are the mandatory rows that flip. */
  private compare(revision: Revision & { Calc: Calc & { Project: Project } }, doc: RuleSet): ImpactRow | null {
    const before = storedOutcome(revision.outcome, revision.verdict);
    const after = outcomeUnder(JSON.parse(revision.input), doc);
    if (before.verdict === after.verdict) return null;
    const c = revision.Calc;
    return {
      calcId: c.id,
      revisionId: revision.id,
      projectCode: c.Project.code,
      number: c.number,
      title: c.title,
      revision: revision.label,
      approvedAt: revision.approvedAt ? revision.approvedAt.toISOString() : null,
      before: before.verdict,
      after: after.verdict,
      clauses: changedClauses(before, after, doc),
    };
  }

  async csv(ability: AppAbility, ruleSetId: number): Promise<string> {
    const report = await this.analyse(ability, ruleSetId);
    // Header first so spreadsheet tools read the columns; the summary and the caution close the file.
    const summary = `${report.evaluated} approved revisions re-evaluated under ${report.ruleSet.code} v${report.ruleSet.version}; ${report.changed} change verdict`;
    return toCsv(IMPACT_COLUMNS, report.rows, [summary, CAUTION]);
  }

  async diff(ability: AppAbility, fromId: number, toId: number) {
    ForbiddenError.from(ability).throwUnlessCan('read', 'RuleSet');
    const [a, b] = await Promise.all([loadRuleSet(fromId), loadRuleSet(toId)]);
    return {
      from: { id: a.record.id, code: a.record.code, version: a.record.version },
      to: { id: b.record.id, code: b.record.code, version: b.record.version },
      changes: diffRuleSets(a.doc, b.doc),
    };
  }

  /** "Try it": evaluate a draft (or any version) against one revision's input, without storing anything. */
  async tryIt(ability: AppAbility, ruleSetId: number, revisionId: number) {
    ForbiddenError.from(ability).throwUnlessCan('read', 'RuleSet');
    const { record, doc } = await loadRuleSet(ruleSetId);
    const revision = await readRevision(ability, revisionId);
    const validated = validateCalcInput(revision.input);
    if (!validated.ok)
      throw new AppError('validation', 400, `Revision ${revision.label} has input errors and cannot be evaluated`, {
        fieldErrors: { revisionId: validated.issues.map((i) => `${placeOf(i.path)}: ${i.message}`) },
      });
    const input = applyRuleSetMethods(validated.value, doc);
    const checklist = await evaluateChecklist(input, evaluateValidInput(input), doc);
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
      const list = report.rows
        .slice(0, 50)
        .map((r) => `- ${r.projectCode} ${r.number} rev ${r.revision}: ${r.before} → ${r.after}`)
        .join('\n');
      await enqueueMail(
        await emailsOfRole('compliance', [], transaction),
        {
          event: 'impact',
          subject: `${record.code} v${record.version} changes the verdict of ${report.changed} approved calc(s)`,
          body: `${record.code} v${record.version} is now effective (${actor.id === null ? `in force from its effective date, ${record.effectiveDate}` : `confirmed by ${actor.name}`}). Re-evaluated ${report.evaluated} approved calcs; ${report.changed} change:\n\n${list}\n\nImpact report: ${appLink(`/rule-sets/${record.id}`)}\n\n${CAUTION}`,
        },
        transaction,
      );
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
