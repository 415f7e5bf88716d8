import { ForbiddenError } from '@casl/ability';
import { Op, type Sequelize } from 'sequelize';
import { evaluateValidInput, validateCalcInput } from '../../shared/engine';
import { applyRuleSetMethods, diffRuleSets, evaluateChecklist, evaluateChecklistSync, type Checklist, type RuleSet } from '../../shared/rules';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { ImpactReport, ImpactRow } from '../../shared/schemas/rule-set.schema';
import { Calc, Project, Revision, RuleSetRecord } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { enqueueMail, emailsOfRole } from '../mail/outbox';
import { loadRuleSet } from './rule-set-cache';
import { readRevision } from '../calcs/revision-read';

type Row = Checklist['rows'][number];
const BATCH = 500;

function mandatoryOutcome(checklist: Checklist | null): Map<string, { status: string; title: string; location: string }> {
  const out = new Map<string, { status: string; title: string; location: string }>();
  for (const row of (checklist?.rows ?? []) as Row[]) {
    if (row.severity !== 'mandatory') continue;
    const location = row.location?.label ?? `${row.location?.scope ?? ''} ${row.location?.index ?? ''}`.trim();
    out.set(`${row.clauseId}|${location}`, { status: row.status, title: row.clauseTitle, location });
  }
  return out;
}

/** Clause rows whose mandatory outcome differs between the stored and the new checklist. */
function changedClauses(before: Checklist | null, after: Checklist | null): ImpactRow['clauses'] {
  const a = mandatoryOutcome(before);
  const b = mandatoryOutcome(after);
  const keys = new Set([...a.keys(), ...b.keys()]);
  return [...keys].flatMap((key) => {
    const x = a.get(key);
    const y = b.get(key);
    if ((x?.status ?? 'absent') === (y?.status ?? 'absent')) return [];
    return [{ clauseId: key.split('|')[0], title: (y ?? x)!.title, location: (y ?? x)!.location, before: x?.status ?? 'absent', after: y?.status ?? 'absent' }];
  });
}

/** Impact analysis: which approved calcs would change verdict under another version of a standard. */
export class ImpactService {
  constructor(private readonly sequelize: Sequelize) {}

  async analyse(ability: AppAbility, ruleSetId: number): Promise<ImpactReport> {
    ForbiddenError.from(ability).setMessage('Impact analysis is for compliance').throwUnlessCan('impact', 'RuleSet');
    return this.run(ruleSetId);
  }

  private async run(ruleSetId: number): Promise<ImpactReport> {
    const started = Date.now();
    const { record, doc } = await loadRuleSet(ruleSetId);
    const rows: ImpactRow[] = [];
    let evaluated = 0;
    for (let lastId = 0; ;) {
      const batch = await Revision.findAll({
        where: { status: 'approved', id: { [Op.gt]: lastId } },
        include: [{ model: Calc, include: [Project] }], order: [['id', 'ASC']], limit: BATCH,
      });
      if (batch.length === 0) break;
      lastId = batch[batch.length - 1].id;
      for (const revision of batch) {
        evaluated++;
        const row = await this.compare(revision as Revision & { Calc: Calc & { Project: Project } }, doc);
        if (row) rows.push(row);
      }
    }
    return { ruleSet: { id: record.id, code: record.code, version: record.version }, evaluated, changed: rows.length, rows, elapsedMs: Date.now() - started };
  }

  private async compare(revision: Revision & { Calc: Calc & { Project: Project } }, doc: RuleSet): Promise<ImpactRow | null> {
    const before = revision.checklist ? (JSON.parse(revision.checklist) as Checklist) : null;
    let after: Checklist | null = null;
    const validated = validateCalcInput(JSON.parse(revision.input));
    if (validated.ok) {
      const input = applyRuleSetMethods(validated.value, doc);
      // The synchronous evaluator gives the same rows as json-rules-engine (tested in shared/rules) at bulk speed.
      after = evaluateChecklistSync(input, evaluateValidInput(input), doc);
    }
    const clauses = changedClauses(before, after);
    const verdictChanged = (before?.verdict ?? null) !== (after?.verdict ?? null);
    if (!verdictChanged && clauses.length === 0) return null;
    const c = revision.Calc;
    return {
      calcId: c.id, revisionId: revision.id, projectCode: c.Project.code, number: c.number, title: c.title, revision: revision.label,
      before: before?.verdict ?? null, after: after?.verdict ?? null, clauses,
    };
  }

  async csv(ability: AppAbility, ruleSetId: number): Promise<string> {
    const report = await this.analyse(ability, ruleSetId);
    const quote = (v: unknown) => `"${String(v ?? '').replace(/"/g, '""')}"`;
    const header = ['project', 'calc', 'title', 'revision', 'verdict before', 'verdict after', 'clauses that change'];
    const lines = report.rows.map((r) => [r.projectCode, r.number, r.title, r.revision, r.before, r.after,
      r.clauses.map((c) => `${c.clauseId} ${c.location}: ${c.before}→${c.after}`).join('; ')].map(quote).join(','));
    return [`# Impact of ${report.ruleSet.code} v${report.ruleSet.version} on approved calcs; ${report.evaluated} evaluated, ${report.changed} change. Supports, never replaces, engineering judgement.`,
      header.map(quote).join(','), ...lines].join('\r\n');
  }

  async diff(ability: AppAbility, fromId: number, toId: number) {
    ForbiddenError.from(ability).throwUnlessCan('read', 'RuleSet');
    const [a, b] = await Promise.all([loadRuleSet(fromId), loadRuleSet(toId)]);
    return { from: { id: a.record.id, code: a.record.code, version: a.record.version }, to: { id: b.record.id, code: b.record.code, version: b.record.version }, changes: diffRuleSets(a.doc, b.doc) };
  }

  /** "Try it": evaluate a draft (or any version) against one revision's input, without storing anything. */
  async tryIt(ability: AppAbility, ruleSetId: number, revisionId: number) {
    ForbiddenError.from(ability).throwUnlessCan('read', 'RuleSet');
    const { record, doc } = await loadRuleSet(ruleSetId);
    const revision = await readRevision(ability, revisionId);
    const validated = validateCalcInput(revision.input);
    if (!validated.ok) throw new AppError('validation', 400, `Revision ${revision.label} has input errors and cannot be evaluated`, { fieldErrors: { revisionId: validated.issues.map((i) => `${i.path}: ${i.message}`) } });
    const input = applyRuleSetMethods(validated.value, doc);
    const checklist = await evaluateChecklist(input, evaluateValidInput(input), doc);
    return { ruleSet: { id: record.id, code: record.code, version: record.version }, revision: { id: revision.id, label: revision.label }, checklist, before: revision.checklist };
  }

  /** After a version becomes effective: tell compliance when approved calcs would now change verdict. */
  async notifyIfAffected(actor: Actor & { id: number }, ruleSetId: number): Promise<void> {
    const record = await RuleSetRecord.findByPk(ruleSetId);
    if (!record) return;
    const report = await this.run(record.id);
    if (report.changed === 0) return;
    await this.sequelize.transaction(async (transaction) => {
      const list = report.rows.slice(0, 50).map((r) => `- ${r.projectCode} ${r.number} rev ${r.revision}: ${r.before} → ${r.after}`).join('\n');
      await enqueueMail(await emailsOfRole('compliance', [], transaction), {
        event: 'impact', subject: `${record.code} v${record.version} changes the verdict of ${report.changed} approved calc(s)`,
        body: `${record.code} v${record.version} is now effective. Re-evaluated ${report.evaluated} approved calcs; ${report.changed} change:\n\n${list}\n\nTorquetrail supports, and never replaces, the judgement of a qualified engineer; local codes and licensed practice govern.`,
      }, transaction);
      await appendAudit(this.sequelize, actor, { action: 'rule_set.impact_notified', entityType: 'RuleSet', entityId: record.id, payload: { changed: report.changed, evaluated: report.evaluated } }, transaction);
    });
  }
}
