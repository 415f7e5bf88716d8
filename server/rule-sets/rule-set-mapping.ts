import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import type { RuleSetDto, RuleSetSummary } from '../../shared/schemas/rule-set.schema';
import type { RuleSetRecord } from '../db/models';

export function documentHash(doc: unknown): string {
  return createHash('sha256')
    .update(canonicalize(doc) ?? '')
    .digest('hex');
}

export function toRuleSetSummary(r: RuleSetRecord, names: Map<number, string> = new Map()): RuleSetSummary {
  return {
    id: r.id,
    code: r.code,
    version: r.version,
    title: r.title,
    status: r.status,
    effectiveDate: r.effectiveDate,
    contentHash: r.contentHash,
    lockVersion: r.lockVersion,
    proposedBy: r.proposedBy ? (names.get(r.proposedBy) ?? null) : null,
    confirmedBy: r.confirmedBy ? (names.get(r.confirmedBy) ?? null) : null,
    updatedAt: r.updatedAt.toISOString(),
  };
}

export function toRuleSetDto(r: RuleSetRecord, names?: Map<number, string>): RuleSetDto {
  return { ...toRuleSetSummary(r, names), document: JSON.parse(r.document) };
}
