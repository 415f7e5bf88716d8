import { subject } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../shared/authz/app-ability';

const ability = (
  id: number,
  roles: Parameters<typeof defineRulesFor>[0] extends infer U ? (U extends { roles: infer R } ? R : never) : never,
) => createAppAbility(defineRulesFor({ id, roles }));

describe('shared abilities', () => {
  it('when a condition names several fields, then all of them must match', () => {
    const checker = ability(7, ['checker']);
    expect(checker.can('check', subject('Revision', { status: 'in_check', authorId: 3 }))).toBe(true);
    expect(checker.can('check', subject('Revision', { status: 'in_check', authorId: 7 }))).toBe(false);
    expect(checker.can('check', subject('Revision', { status: 'draft', authorId: 3 }))).toBe(false);
  });

  it('when an approver checked the revision, then they may not approve it', () => {
    const approver = ability(5, ['approver']);
    expect(approver.can('approve', subject('Revision', { status: 'checked', authorId: 1, checkerId: 2 }))).toBe(true);
    expect(approver.can('approve', subject('Revision', { status: 'checked', authorId: 1, checkerId: 5 }))).toBe(false);
  });

  it('when a role is unknown, then defining rules throws', () => {
    expect(() => defineRulesFor({ id: 1, roles: ['wizard' as never] })).toThrow(/Unknown role/);
  });

  it('when an admin asks, then they may not sign, check or approve anything', () => {
    const admin = ability(9, ['admin']);
    for (const action of ['sign', 'check', 'approve'] as const) {
      expect(admin.can(action, subject('Revision', { status: 'in_check', authorId: 1, checkerId: null }))).toBe(false);
    }
  });
});
