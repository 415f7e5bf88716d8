import { Pipe, PipeTransform } from '@angular/core';

// Plain-English names for audit actions; unknown actions fall back to their code.
const LABELS: Record<string, string> = {
  'auth.signed_in': 'signed in',
  'auth.signed_out': 'signed out',
  'auth.sign_in_failed': 'failed sign-in attempt',
  'auth.password_changed': 'changed their password',
  'user.created': 'created an account',
  'user.updated': 'changed an account',
  'user.deactivated': 'deactivated an account',
  'user.reactivated': 'reactivated an account',
  'project.created': 'created a project',
  'project.updated': 'changed a project',
};

@Pipe({ name: 'auditActionLabel' })
export class AuditActionLabelPipe implements PipeTransform {
  transform(action: string): string {
    return LABELS[action] ?? action;
  }
}
