import { ForbiddenError, subject } from '@casl/ability';
import { createAppAbility, defineRulesFor, type AppAbility } from '../../shared/authz/app-ability';
import { forbiddenCheck } from '../../server/authz/forbidden-check';

/** What a check throws (or undefined), as name, message, action, subject type and field. */
function outcome(check: () => void) {
  try {
    check();
    return undefined;
  } catch (e) {
    if (!(e instanceof ForbiddenError)) throw e;
    const { name, message, action, subjectType, field } = e;
    return { name, message, action, subjectType, field };
  }
}

const people: [string, AppAbility][] = [
  ['nobody signed in', createAppAbility(defineRulesFor(null))],
  ['an author', createAppAbility(defineRulesFor({ id: 7, roles: ['author'] }))],
  ['an administrator', createAppAbility(defineRulesFor({ id: 8, roles: ['admin'] }))],
  ['compliance', createAppAbility(defineRulesFor({ id: 9, roles: ['compliance'] }))],
];

describe('a permission check that builds its error only when refused', () => {
  it.each(people)('when %s is checked, then every answer and refusal is the one CASL itself gives', (_who, ability) => {
    const checks: [Parameters<AppAbility['can']>, string | undefined][] = [
      [['read', 'Calc'], undefined],
      [['read', 'AuditEvent'], 'Audit entries are for compliance'],
      [['create', 'User'], undefined],
      [['update', subject('User', { id: 7, roles: [] } as never), 'roles'], undefined],
      [['update', subject('User', { id: 3, roles: [] } as never), 'displayName'], 'Not yours to change'],
      [['impact', 'RuleSet'], 'Impact analysis is for compliance'],
    ];
    for (const [args, message] of checks) {
      const ours = forbiddenCheck(ability);
      const theirs = ForbiddenError.from(ability);
      if (message !== undefined) {
        ours.setMessage(message);
        theirs.setMessage(message);
      }

      expect(outcome(() => ours.throwUnlessCan(...args))).toEqual(outcome(() => theirs.throwUnlessCan(...args)));
    }
  });

  it('when the check is refused, then the error is CASL ForbiddenError, which the error handler answers with 403', () => {
    const thrown = outcome(() => forbiddenCheck(people[1][1]).throwUnlessCan('read', 'AuditEvent'));

    expect(thrown).toMatchObject({ name: 'ForbiddenError', action: 'read', subjectType: 'AuditEvent' });
  });
});
