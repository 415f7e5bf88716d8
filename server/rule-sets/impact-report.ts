import { CAUTION } from '../../shared/engine';
import type { ImpactReport, ImpactRow } from '../../shared/schemas/rule-set.schema';
import type { RuleSetRecord } from '../db/models';
import { toCsv, type CsvColumn } from '../http/csv';
import type { Actor } from '../audit/audit.service';
import { appLink } from '../mail/links';

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

/** The impact report as CSV: header first so spreadsheet tools read the columns; the summary and caution close it. */
export function impactCsv(report: ImpactReport): string {
  const { code, version } = report.ruleSet;
  const summary =
    `${report.evaluated} approved revisions re-evaluated under ${code} v${version}; ` +
    `${report.changed} change verdict`;
  return toCsv(IMPACT_COLUMNS, report.rows, [summary, CAUTION]);
}

/** The mail compliance gets when a version that changes approved verdicts becomes effective (first 50 listed). */
export function impactMail(
  record: RuleSetRecord,
  report: ImpactReport,
  actor: Actor,
): { subject: string; body: string } {
  const list = report.rows
    .slice(0, 50)
    .map((r) => `- ${r.projectCode} ${r.number} rev ${r.revision}: ${r.before} → ${r.after}`)
    .join('\n');
  const how =
    actor.id === null ? `in force from its effective date, ${record.effectiveDate}` : `confirmed by ${actor.name}`;
  const subject = `${record.code} v${record.version} changes the verdict of ${report.changed} approved calc(s)`;
  const body = [
    `${record.code} v${record.version} is now effective (${how}). ` +
      `Re-evaluated ${report.evaluated} approved calcs; ${report.changed} change:`,
    '',
    list,
    '',
    `Impact report: ${appLink(`/rule-sets/${record.id}`)}`,
    '',
    CAUTION,
  ].join('\n');
  return { subject, body };
}
