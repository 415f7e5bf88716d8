import type { AuditLink } from '../../shared/schemas/review-health.schema';

/** The project and UTC period every signal query is bound to, as SQL pieces and audit-screen filters. */
export interface HealthScope {
  projectId: number | null;
  /** Projects the reader may see (from their abilities); null when every project is readable. */
  projectIds: number[] | null;
  from: string;
  to: string;
  start: Date;
  /** Exclusive end: midnight after the last day. */
  end: Date;
}

export function scopeOf(
  projectIds: number[] | null,
  projectId: number | undefined,
  from: string,
  to: string,
): HealthScope {
  const start = new Date(`${from}T00:00:00Z`);
  return {
    projectId: projectId ?? null,
    projectIds,
    from,
    to,
    start,
    end: new Date(Date.parse(`${to}T00:00:00Z`) + 86_400_000),
  };
}

/**
 * `AND c.project_id = ?` when one project is chosen (or `IN` the readable ones); `c` is the calcs alias of each query.
 */
export function projectClause(
  scope: HealthScope,
  column = 'c.project_id',
): { sql: string; values: (number | number[])[] } {
  if (scope.projectId !== null) return { sql: ` AND ${column} = ?`, values: [scope.projectId] };
  if (scope.projectIds !== null)
    return { sql: ` AND ${column} IN (?)`, values: [scope.projectIds.length ? scope.projectIds : [0]] };
  return { sql: '', values: [] };
}

/** The covering indexes of the signals (migrations 20261231-03 and 20261231-07). */
export type RevisionCover =
  | 'revisions_checked_cover'
  | 'revisions_approved_cover'
  | 'revisions_open_approvals'
  | 'revisions_attachments_changed'
  | 'revisions_pair_checks';

/**
 * The period's revisions read from a covering index (the period leads it, the project is in it), never the
 * optimiser's guess at a calc-first plan: the index bounds the work, and nothing is read beyond it.
 */
export function coverFrom(
  scope: HealthScope,
  index: RevisionCover,
): { from: string; project: ReturnType<typeof projectClause> } {
  return { from: `FROM revisions r FORCE INDEX (${index})`, project: projectClause(scope, 'r.project_id') };
}

/** A link to the audit screen with its own filters; only non-empty values become query parameters. */
export function auditLink(label: string, query: Record<string, string | number | null | undefined>): AuditLink {
  const clean: Record<string, string> = {};
  for (const [k, v] of Object.entries(query)) if (v !== null && v !== undefined && v !== '') clean[k] = String(v);
  return { label, query: clean };
}

/** The period as audit filters (days, both ends included), plus the project when one is chosen. */
export function periodFilter(scope: HealthScope): Record<string, string | number | null> {
  return { projectId: scope.projectId, from: scope.from, to: scope.to };
}

export const day = (d: Date | string): string => new Date(d).toISOString().slice(0, 10);

/** "3 minutes", "1 hour 5 minutes", "40 seconds": how long a check took, in words. */
export function durationText(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} second${s === 1 ? '' : 's'}`;
  const minutes = Math.floor(s / 60);
  if (minutes < 60) return `${minutes} minute${minutes === 1 ? '' : 's'}`;
  const hours = Math.floor(minutes / 60);
  const rest = minutes % 60;
  return `${hours} hour${hours === 1 ? '' : 's'}${rest ? ` ${rest} minute${rest === 1 ? '' : 's'}` : ''}`;
}

export const plural = (n: number, word: string, many = `${word}s`): string =>
  `${n.toLocaleString('en-GB')} ${n === 1 ? word : many}`;
