import { QueryTypes, type Sequelize } from 'sequelize';
import type { HealthSettings, SignalRow } from '../../shared/schemas/review-health.schema';
import { auditLink, durationText, plural, projectClause, ROW_CAP, type HealthScope } from './health-scope';

// Checks that count: the revision still holds the content its checker signed.
const CHECKED = `r.checked_at >= ? AND r.checked_at < ? AND r.status IN ('checked', 'approved', 'superseded')`;

interface QuickRow {
  id: number;
  calcId: number;
  label: string;
  number: string;
  code: string;
  author: string;
  checker: string;
  checkedAt: Date;
  seconds: number;
  rows: number;
  segments: number;
  features: number;
}

/** Checks signed sooner after submission than the set seconds per checklist row, segment and feature. */
export async function quickChecks(
  sequelize: Sequelize,
  scope: HealthScope,
  settings: HealthSettings,
): Promise<SignalRow[]> {
  const project = projectClause(scope);
  const rows = await sequelize.query<QuickRow>(
    `SELECT r.id, r.calc_id AS calcId, r.label, c.number, p.code, a.display_name AS author, k.display_name AS checker,
       r.checked_at AS checkedAt, TIMESTAMPDIFF(SECOND, r.submitted_at, r.checked_at) AS seconds,
       z.checklist_rows AS \`rows\`, z.segments, z.features
     FROM revisions r JOIN calcs c ON c.id = r.calc_id JOIN projects p ON p.id = c.project_id
       JOIN review_sizes z ON z.revision_id = r.id AND z.checked_at = r.checked_at JOIN users a ON a.id = r.author_id JOIN users k ON k.id = r.checker_id
     WHERE ${CHECKED}${project.sql}
       AND TIMESTAMPDIFF(SECOND, r.submitted_at, r.checked_at) < ? * (z.checklist_rows + z.segments + z.features)
     ORDER BY seconds ASC, r.id ASC LIMIT ${ROW_CAP + 1}`,
    {
      replacements: [scope.start, scope.end, ...project.values, settings.quickCheckSecondsPerItem],
      type: QueryTypes.SELECT,
    },
  );
  return rows.map((r) => ({
    signal: 'quick-check',
    fact: `Checked in ${durationText(Number(r.seconds))}: ${plural(Number(r.rows), 'checklist row')}, ${plural(Number(r.segments), 'segment')}, ${plural(Number(r.features), 'feature')}`,
    projectCode: r.code,
    calcId: r.calcId,
    calcNumber: r.number,
    revision: r.label,
    people: `checker ${r.checker}; author ${r.author}`,
    at: new Date(r.checkedAt).toISOString(),
    measure: Math.round(Number(r.seconds) / 6) / 10,
    evidence: [auditLink('Submission and check signatures', { calcId: r.calcId, action: 'revision.signed' })],
  }));
}

export interface PairCount {
  checkerId: number;
  authorId: number;
  checks: number;
  withFindings: number;
  findings: number;
}

/**
 * Checks and findings per author–checker pair in the period: findings the checker raised on the revision they signed.
 */
export async function pairCounts(sequelize: Sequelize, scope: HealthScope): Promise<PairCount[]> {
  const project = projectClause(scope);
  const rows = await sequelize.query<PairCount>(
    `SELECT t.checkerId, t.authorId, COUNT(*) AS checks, SUM(t.n > 0) AS withFindings, SUM(t.n) AS findings
     FROM (SELECT r.checker_id AS checkerId, r.author_id AS authorId,
             (SELECT COUNT(*) FROM findings f WHERE f.revision_id = r.id AND f.raised_by = r.checker_id) AS n
           FROM revisions r JOIN calcs c ON c.id = r.calc_id WHERE ${CHECKED}${project.sql}) t
     GROUP BY t.checkerId, t.authorId`,
    { replacements: [scope.start, scope.end, ...project.values], type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    checkerId: r.checkerId,
    authorId: r.authorId,
    checks: Number(r.checks),
    withFindings: Number(r.withFindings),
    findings: Number(r.findings),
  }));
}
