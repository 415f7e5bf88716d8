import { Pipe, PipeTransform } from '@angular/core';

// Plain-English names for audit actions. The codes stay in the data (and the detail and export); an action without
// a name here would show its code, so a spec (audit-action-label.spec.ts) names every action the server writes.
const LABELS: Record<string, string> = {
  'auth.signed_in': 'signed in',
  'auth.signed_out': 'signed out',
  'auth.sign_in_failed': 'failed sign-in attempt',
  'auth.password_changed': 'changed their password (their other sessions ended)',
  'auth.session_ended': 'ended one of their sessions',
  'auth.second_factor_enrolled': 'set up a one-time code app',
  'auth.second_factor_removed': 'removed their one-time code app',
  'user.created': 'created an account',
  'user.updated': 'changed an account',
  'user.deactivated': 'deactivated an account',
  'user.reactivated': 'reactivated an account',
  'user.role_requested': 'asked for a signing role (awaiting a second person)',
  'user.role_granted': 'gave a role',
  'user.role_refused': 'refused a role request',
  'user.role_request_withdrawn': 'withdrew a role request',
  'user.role_removed': 'removed a role',
  'user.mail_preferences': 'changed their mail choices',
  'project.created': 'created a project',
  'project.updated': 'changed a project',
  'calc.created': 'created a calc',
  'revision.created': 'started a new revision',
  'revision.saved': 'saved content',
  'revision.signed_authored': 'signed as author and submitted for check',
  'revision.signed_checked': 'signed as checked',
  'revision.signed_approved': 'signed as approved',
  'revision.signature_refused': 'was refused a signature',
  'revision.returned': 'returned the calc to its author',
  'revision.withdrawn': 'withdrew a revision',
  'revision.superseded': 'superseded an approved revision',
  'revision.manual_item': 'ticked or unticked a manual checklist item',
  'finding.raised': 'raised a finding',
  'finding.answered': 'answered a finding',
  'finding.closed': 'closed a finding',
  'attachment.added': 'attached a file',
  'attachment.removed': 'removed a file',
  'evidence.exported': 'exported an evidence pack',
  'independent_model.started': 'started an independent model of the calc',
  'independent_model.saved': 'saved their independent model',
  'independent_model.locked': "locked their independent model and compared it with the author's calc",
  'rule_set.loaded': 'loaded a design standard',
  'rule_set.drafted': 'drafted a standard change',
  'rule_set.saved': 'saved a standard draft',
  'rule_set.proposed': 'proposed a standard for confirmation',
  'rule_set.confirmed': 'confirmed a standard',
  'rule_set.confirmation_refused': 'was refused confirming a standard',
  'rule_set.effective': 'made a standard effective',
  'rule_set.retired': 'retired a standard version (a later version took effect)',
  'rule_set.impact_notified': 'notified the impact of a standard change',
  'review_health.settings_changed': 'changed the review-health thresholds',
};

export function auditActionLabel(action: string): string {
  return LABELS[action] ?? action;
}

@Pipe({ name: 'auditActionLabel' })
export class AuditActionLabelPipe implements PipeTransform {
  transform(action: string): string {
    return auditActionLabel(action);
  }
}
