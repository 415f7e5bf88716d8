import type { ParamMap } from '@angular/router';
import type { AuditListParams } from './audit-api';

/** The audit list's filters: what the address may name, and the entity types and action groups offered. */

export const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;

/** The audit filters named in the address; anything malformed is left out (the server validates the rest). */
export function filtersFromUrl(q: ParamMap): Omit<AuditListParams, 'size' | 'after'> {
  const id = (key: string) => (/^[1-9]\d{0,14}$/.test(q.get(key) ?? '') ? Number(q.get(key)) : null);
  const text = (key: string, pattern = /^[\w.]{0,64}$/) => (pattern.test(q.get(key) ?? '') ? (q.get(key) ?? '') : '');
  return {
    entityType: text('entityType'),
    action: text('action'),
    projectId: id('projectId'),
    calcId: id('calcId'),
    userId: id('userId'),
    from: text('from', ISO_DAY),
    to: text('to', ISO_DAY),
  };
}

export const AUDIT_ENTITY_TYPES = ['', 'User', 'Project', 'Calc', 'Revision', 'RuleSet'];

/** Action filters by prefix: a group ('revision.') or one action ('revision.signed_checked'). */
export const AUDIT_ACTION_FILTERS = [
  { value: '', label: 'Any action' },
  { value: 'auth.', label: 'Sign-in and passwords' },
  { value: 'user.', label: 'Accounts and roles' },
  { value: 'calc.', label: 'Calcs created' },
  { value: 'revision.saved', label: 'Content saved' },
  { value: 'revision.signed', label: 'Signatures' },
  { value: 'revision.', label: 'Any revision event' },
  { value: 'finding.', label: 'Findings' },
  { value: 'rule_set.', label: 'Standards' },
  { value: 'attachment.', label: 'Attachments' },
  { value: 'independent_model.', label: 'Independent models' },
  { value: 'evidence.', label: 'Evidence packs' },
  { value: 'revision.signed_checked', label: 'Check signatures' },
  { value: 'revision.signed_approved', label: 'Approval signatures' },
  { value: 'revision.signed_authored', label: 'Submissions' },
  { value: 'revision.signature_refused', label: 'Refused signatures' },
  { value: 'review_health.', label: 'Review-health settings' },
];
