import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { auditActionLabel } from './audit-action-label';
import { AUDIT_ACTION_FILTERS } from '../features/audit/audit-filters';
import { MEANINGS } from '../../../shared/workflow/revision-states';

// Every action code the server writes reaches the audit trail's "What" column: each needs words of its own there,
// or the screen would show an internal code. The codes are read from the server's source, as written.
const serverDir = path.join(__dirname, '../../../server');
const GROUPS = 'auth|user|project|calc|revision|finding|attachment|evidence|rule_set|independent_model|review_health';
const CODE = new RegExp(`'((?:${GROUPS})\\.[a-z_]+)'`, 'g');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? sourceFiles(path.join(dir, e.name)) : e.name.endsWith('.ts') ? [path.join(dir, e.name)] : [],
  );
}

function actionCodesInServer(): string[] {
  const codes = new Set<string>(MEANINGS.map((m) => `revision.signed_${m}`));
  for (const file of sourceFiles(serverDir)) {
    for (const [, code] of readFileSync(file, 'utf8').matchAll(CODE)) codes.add(code);
  }
  // A filter prefix (the audit links of review-health signals use 'revision.signed') is not an action.
  for (const f of AUDIT_ACTION_FILTERS) codes.delete(f.value);
  return [...codes].sort();
}

describe('audit action words', () => {
  it('given every action code the server writes, then each has words of its own, not its code', () => {
    const codes = actionCodesInServer();
    expect(codes.length).toBeGreaterThan(40);
    expect(codes.filter((code) => auditActionLabel(code) === code)).toEqual([]);
  });

  it('given an action the page has no words for, then its code shows rather than nothing', () => {
    expect(auditActionLabel('something.new')).toBe('something.new');
  });
});
