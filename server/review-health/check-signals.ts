import { QueryTypes, type Sequelize } from 'sequelize';
import type { HealthSettings, SignalRow } from '../../shared/schemas/review-health.schema';
import { auditLink, coverFrom, durationText, plural, type HealthScope, type RevisionCover } from './health-scope';
import { afterCursor, keysetPage, limitOf, totalOf, type Listed, type PageAsk } from './signal-page';

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
  total: number;
}

const SECONDS = 'TIMESTAMPDIFF(SECOND, r.submitted_at, r.checked_at)';
const QUICK_ORDER = [{ sql: SECONDS }, { sql: 'r.id' }];

/**
 * Checks signed sooner after submission than the set seconds per checklist row, segment and feature. The sizes
 * recorded at the check signature sit in the covering index, so the period is filtered on index entries alone
 * and only the listed rows are joined to their names.
 */
export async function quickChecks(
  sequelize: Sequelize,
  scope: HealthScope,
  settings: HealthSettings,
  ask: PageAsk,
): Promise<Listed> {
  const { from, project } = coverFrom(scope, 'revisions_checked_cover');
  const after = afterCursor(ask, QUICK_ORDER, 'asc');
  const found = await sequelize.query<QuickRow>(
    `SELECT q.id, q.calcId, r.label, c.number, p.code, a.display_name AS author, k.display_name AS checker,
       q.checkedAt, q.seconds, q.rows, q.segments, q.features, q.total
     FROM (SELECT r.id, r.calc_id AS calcId, r.author_id AS authorId, r.checker_id AS checkerId, r.checked_at AS checkedAt,
             ${SECONDS} AS seconds, r.check_rows AS \`rows\`, r.check_segments AS segments, r.check_features AS features,
             COUNT(*) OVER () AS total
           ${from} WHERE ${CHECKED}${project.sql}
             AND ${SECONDS} < ? * (r.check_rows + r.check_segments + r.check_features) AND ${after.sql}
           ORDER BY seconds ASC, r.id ASC ${limitOf(ask)}) q
       JOIN revisions r ON r.id = q.id JOIN calcs c ON c.id = q.calcId JOIN projects p ON p.id = c.project_id
       JOIN users a ON a.id = q.authorId JOIN users k ON k.id = q.checkerId
     ORDER BY q.seconds ASC, q.id ASC`,
    {
      replacements: [
        scope.start,
        scope.end,
        ...project.values,
        settings.quickCheckSecondsPerItem,
        ...after.replacements,
      ],
      type: QueryTypes.SELECT,
    },
  );
  const { rows, next } = keysetPage(found, ask, (r) => [Number(r.seconds), r.id]);
  return { rows: rows.map(quickRow), total: totalOf(found), next };
}

const quickRow = (r: QuickRow): SignalRow => ({
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
});

export interface PairCount {
  checkerId: number;
  authorId: number;
  checks: number;
  withFindings: number;
  findings: number;
}

/**
 * Checks and findings per author–checker pair in the period: findings the checker raised on the revision they
 * signed, as recorded at the check signature (review-facts.ts); one pass over a covering index (`pairSource`, or
 * `index` where a spec compares the two).
 */
export async function pairCounts(
  sequelize: Sequelize,
  scope: HealthScope,
  index?: 'revisions_checked_cover' | 'revisions_pair_checks',
): Promise<PairCount[]> {
  const { from, project } = coverFrom(scope, index ?? (await pairSource(sequelize, scope)));
  const rows = await sequelize.query<PairCount>(
    `SELECT r.checker_id AS checkerId, r.author_id AS authorId, COUNT(*) AS checks,
       CAST(COALESCE(SUM(r.check_findings > 0), 0) AS UNSIGNED) AS withFindings,
       CAST(COALESCE(SUM(r.check_findings), 0) AS UNSIGNED) AS findings
     ${from} WHERE ${CHECKED}${project.sql} GROUP BY r.checker_id, r.author_id`,
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

/** Past this share of the time since the first check, a period's pairs are counted over the pair-led index. */
export const PAIR_INDEX_SHARE = 0.4;

/**
 * Which index the pair counts read. The period index reads only the period's checks but groups them in a temporary
 * table; the pair-led one (`revisions_pair_checks`) reads every check on record, already in pair order, at about a
 * third of the cost per check (the benchmark library, December 2026). So a period spanning more than two fifths of
 * the time since the first check is read by pair. Either way the counts are the same; only the work differs.
 */
async function pairSource(sequelize: Sequelize, scope: HealthScope): Promise<RevisionCover> {
  const since = await firstCheck(sequelize);
  if (since === null) return 'revisions_checked_cover';
  const span = Math.max(Date.now(), since + 1) - since;
  const covered = Math.min(scope.end.getTime(), Date.now()) - Math.max(scope.start.getTime(), since);
  return covered > PAIR_INDEX_SHARE * span ? 'revisions_pair_checks' : 'revisions_checked_cover';
}

/** When the first check on record was signed (ms), read at most once a minute: it only steers the plan. */
let first: { at: number | null; readAt: number } | null = null;
async function firstCheck(sequelize: Sequelize): Promise<number | null> {
  if (first && Date.now() - first.readAt < 60_000) return first.at;
  const [row] = await sequelize.query<{ at: Date | null }>('SELECT MIN(checked_at) AS at FROM revisions', {
    type: QueryTypes.SELECT,
  });
  first = { at: row.at === null ? null : new Date(row.at).getTime(), readAt: Date.now() };
  return first.at;
}
