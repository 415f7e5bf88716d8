import { Pipe, PipeTransform } from '@angular/core';

// Plain-English names for audit actions; unknown actions fall back to their code.
const LABELS: Record<string, string> = {
  'auth.signed_in': 'signed in',
  'auth.signed_out': 'signed out',
  'auth.sign_in_failed': 'failed sign-in attempt',
  'auth.password_changed': 'changed their password (their other sessions ended)',
  'auth.session_ended': 'ended one of their sessions',
  'user.created': 'created an account',
  'user.updated': 'changed an account',
  'user.deactivated': 'deactivated an account',
  'user.reactivated': 'reactivated an account',
  'user.role_requested': 'asked for a signing role (awaiting a second person)',
  'user.role_granted': 'gave a role',
  'user.role_refused': 'refused a role request',
  'user.role_request_withdrawn': 'withdrew a role request',
  'user.role_removed': 'removed a role',
  'project.created': 'created a project',
  'project.updated': 'changed a project',
};

@Pipe({ name: 'auditActionLabel' })
export class AuditActionLabelPipe implements PipeTransform {
  transform(action: string): string {
    return LABELS[action] ?? action;
  }
}
