import type { SessionUser } from '../../../../../shared/schemas/auth.schema';
import type { FindingDto, RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { planActions } from './revision-actions';

const AUTHOR = 1;
const CHECKER = 2;
const APPROVER = 3;
const person = (id: number, roles: string[]) =>
  ({ id, username: `p${id}`, displayName: `Person ${id}`, roles }) as unknown as SessionUser;
const finding = (status: FindingDto['status']) => ({ id: 1, status }) as FindingDto;

function revision(over: Partial<RevisionDto> = {}): RevisionDto {
  return {
    id: 7,
    calcId: 3,
    status: 'draft',
    verdict: 'compliant',
    result: {},
    findings: [],
    manualItems: {},
    editorIds: [AUTHOR],
    author: { id: AUTHOR, name: 'Morwenna Hale' },
    checker: null,
    checklist: { rows: [], manual: [] },
    ...over,
  } as unknown as RevisionDto;
}
const actionsOf = (r: RevisionDto, me: SessionUser | null, isLatest = true) =>
  [...planActions(r, me, isLatest).actions].sort();

describe('the buttons a revision offers, read from the workflow table', () => {
  it.each([
    ['the author, on a clean draft', revision(), person(AUTHOR, ['author']), ['edit', 'submit', 'withdraw']],
    [
      'the author, with an open finding',
      revision({ status: 'returned', findings: [finding('open')] }),
      person(AUTHOR, ['author']),
      ['edit', 'withdraw'],
    ],
    ['the author, with input errors', revision({ result: null }), person(AUTHOR, ['author']), ['edit', 'withdraw']],
    ['another author, on a draft', revision(), person(9, ['author']), []],
    [
      'a checker, in check',
      revision({ status: 'in_check' }),
      person(CHECKER, ['checker']),
      ['raise-finding', 'return', 'sign-checked'],
    ],
    [
      'a checker, in check with open manual items',
      revision({ status: 'in_check', checklist: { rows: [], manual: [{ id: 'm1' }] } }),
      person(CHECKER, ['checker']),
      ['raise-finding', 'return', 'sign-checked'],
    ],
    [
      'a checker, on a failing calc',
      revision({ status: 'in_check', verdict: 'not-compliant' }),
      person(CHECKER, ['checker']),
      ['raise-finding', 'return'],
    ],
    [
      'a checker who edited the calc',
      revision({ status: 'in_check', editorIds: [AUTHOR, CHECKER] }),
      person(CHECKER, ['checker']),
      [],
    ],
    [
      'the author holding the checker role',
      revision({ status: 'in_check' }),
      person(AUTHOR, ['author', 'checker']),
      [],
    ],
    [
      'an approver, checked',
      revision({ status: 'checked', checker: { id: CHECKER, name: 'C' } }),
      person(APPROVER, ['approver']),
      ['approve', 'raise-finding', 'return'],
    ],
    [
      'an approver, with an answered finding',
      revision({ status: 'checked', findings: [finding('answered')] }),
      person(APPROVER, ['approver']),
      ['raise-finding', 'return'],
    ],
    [
      'the checker holding the approver role',
      revision({ status: 'checked', checker: { id: CHECKER, name: 'C' } }),
      person(CHECKER, ['approver']),
      [],
    ],
    [
      'an author, on the latest approved revision',
      revision({ status: 'approved' }),
      person(9, ['author']),
      ['new-revision'],
    ],
    [
      'an author, on the latest withdrawn revision',
      revision({ status: 'withdrawn' }),
      person(9, ['author']),
      ['new-revision'],
    ],
    ['an author, on a superseded revision', revision({ status: 'superseded' }), person(9, ['author']), []],
    ['a checker, on the latest approved revision', revision({ status: 'approved' }), person(CHECKER, ['checker']), []],
  ] as [string, RevisionDto, SessionUser, string[]][])('when %s, then the buttons are %j', (_, r, me, expected) => {
    expect(actionsOf(r, me)).toEqual(expected);
  });

  it('when an approved revision is not the latest, then no new revision is offered from it', () => {
    expect(actionsOf(revision({ status: 'approved' }), person(9, ['author']), false)).toEqual([]);
  });

  it('when nobody is signed in, then nothing is offered', () => {
    expect(planActions(revision(), null, true)).toEqual({ actions: new Set(), nextStep: '' });
  });

  it('when the person may not act, then the next step says why, in the words the screens use', () => {
    const checked = revision({ status: 'checked', checker: { id: CHECKER, name: 'C' } });
    expect(planActions(checked, person(CHECKER, ['approver']), true).nextStep).toBe(
      'Waiting for approval by someone other than its checker.',
    );
    // The checker who just signed, holding no approver role, is told the same.
    expect(planActions(checked, person(CHECKER, ['checker']), true).nextStep).toBe(
      'Waiting for approval by someone other than its checker.',
    );
    expect(
      planActions(revision({ status: 'in_check', editorIds: [AUTHOR, CHECKER] }), person(CHECKER, ['checker']), true)
        .nextStep,
    ).toBe('Waiting for an independent check. You edited this calc, so you cannot check it.');
    expect(planActions(revision(), person(9, ['author']), true).nextStep).toBe('With its author, Morwenna Hale.');
    expect(planActions(revision({ status: 'approved' }), person(9, ['author']), true).nextStep).toMatch(/^Released\./);
    expect(planActions(revision({ status: 'superseded' }), person(9, ['author']), true).nextStep).toBe(
      'This revision is superseded.',
    );
  });
});
