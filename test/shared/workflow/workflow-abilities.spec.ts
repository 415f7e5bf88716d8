import { subject } from '@casl/ability';
import { ACTIONS, createAppAbility, defineRulesFor, type AppRawRule } from '../../../shared/authz/app-ability';
import { ROLES, type Role } from '../../../shared/authz/roles';
import { REVISION_STATES } from '../../../shared/schemas/revision.schema';
import { handWrittenRulesFor } from './hand-written-rules';

const sortKeys = (v: unknown): unknown =>
  v && typeof v === 'object' && !Array.isArray(v)
    ? Object.fromEntries(
        Object.entries(v)
          .sort(([a], [b]) => a.localeCompare(b))
          .map(([k, x]) => [k, sortKeys(x)]),
      )
    : v;
const list = <T>(v: T | T[] | undefined): (T | undefined)[] => (Array.isArray(v) ? v : [v]);

/** One line per (action, subject) pair, so rules split or joined differently still compare equal. */
function normalise(rules: AppRawRule[]): string[] {
  const lines = rules.flatMap((r) =>
    list(r.action).flatMap((action) =>
      list(r.subject).map((s) =>
        JSON.stringify(
          sortKeys({
            action,
            subject: s,
            conditions: r.conditions ?? null,
            fields: r.fields ?? null,
            inverted: !!r.inverted,
          }),
        ),
      ),
    ),
  );
  return [...new Set(lines)].sort();
}

const ROLE_SETS: Role[][] = Array.from({ length: 2 ** ROLES.length }, (_, mask) =>
  ROLES.filter((_, i) => mask & (1 << i)),
);

describe('abilities derived from the workflow table', () => {
  it.each(ROLE_SETS.map((roles) => [roles.join('+') || 'no role', roles]))(
    'when the person holds %s, then the rules equal the hand-written ones',
    (_, roles) => {
      const user = { id: 7, roles: roles as Role[] };
      expect(normalise(defineRulesFor(user))).toEqual(normalise(handWrittenRulesFor(user)));
    },
  );

  it('when every role, state and relation is tried, then each action is allowed exactly as before', () => {
    const people = [1, 2, 3];
    const differences: string[] = [];
    for (const roles of ROLE_SETS) {
      const derived = createAppAbility(defineRulesFor({ id: 1, roles }));
      const written = createAppAbility(handWrittenRulesFor({ id: 1, roles }));
      for (const status of REVISION_STATES)
        for (const authorId of people)
          for (const checkerId of [null, ...people]) {
            const revision = subject('Revision', { status, authorId, checkerId });
            for (const action of ACTIONS) {
              if (derived.can(action, revision) !== written.can(action, revision)) {
                differences.push(`${roles.join('+')} ${action} ${status} author ${authorId} checker ${checkerId}`);
              }
            }
          }
    }
    expect(differences).toEqual([]);
  });
});
