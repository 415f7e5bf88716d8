import { SIGNING_ROLES, type Role } from '../../../shared/authz/roles';
import {
  MEANINGS,
  REVISION_STATES,
  SIGNING_BLOCKERS,
  signingBlocker,
  signingBlockers,
  type SigningContext,
} from '../../../shared/workflow';
import { handWrittenSigningBlocker } from './hand-written-blockers';

/** A small deterministic generator, so a failure names a case that can be run again. */
function generator(seed: number) {
  let s = seed;
  const next = () => (s = (s * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
  return <T>(xs: readonly T[]): T => xs[Math.floor(next() * xs.length)];
}

function randomContext(pick: ReturnType<typeof generator>): SigningContext {
  const roles = SIGNING_ROLES.filter(() => pick([true, false]));
  const openFindings = pick([0, 1, 2]);
  return {
    actor: { id: pick([1, 2, 3]), roles: roles as Role[] },
    revision: {
      status: pick(REVISION_STATES),
      authorId: 1,
      checkerId: pick([null, 2, 3]),
      hasResult: pick([true, false]),
      verdict: pick(['compliant', 'not-compliant', null]),
      errorRows: pick([0, 0, 2]),
    },
    editorIds: pick([[1], [1, 3]]),
    openFindings,
    unresolvedFindings: openFindings + pick([0, 1]),
    openManualItems: pick([0, 0, 1]),
  };
}

describe('signing blockers from the workflow table', () => {
  it("when 20,000 varied contexts are tried, then the first blocker is the hand-written rules' answer, word for word", () => {
    const pick = generator(14);
    const differences: string[] = [];
    for (let i = 0; i < 20_000; i++) {
      const c = randomContext(pick);
      for (const meaning of MEANINGS) {
        const [now, before] = [signingBlocker(meaning, c), handWrittenSigningBlocker(meaning, c)];
        if (now !== before) differences.push(`${meaning} ${JSON.stringify(c)}: ${now} ≠ ${before}`);
      }
    }
    expect(differences.slice(0, 5)).toEqual([]);
  });

  it('when the list is read, then ids are unique and every entry applies to some meaning', () => {
    expect(new Set(SIGNING_BLOCKERS.map((b) => b.id)).size).toBe(SIGNING_BLOCKERS.length);
    for (const b of SIGNING_BLOCKERS) expect(b.meanings.length).toBeGreaterThan(0);
  });

  it('when a checker asks only about content, then every reason is listed in order, and who signs is left out', () => {
    const c: SigningContext = {
      actor: { id: 1, roles: [] },
      editorIds: [1],
      revision: {
        status: 'draft',
        authorId: 1,
        checkerId: null,
        hasResult: true,
        verdict: 'not-compliant',
        errorRows: 0,
      },
      openFindings: 1,
      unresolvedFindings: 1,
      openManualItems: 2,
    };
    expect(signingBlockers('checked', c, 'content').map((b) => b.blocker.id)).toEqual([
      'verdict',
      'manual-items',
      'open-findings',
    ]);
    expect(signingBlockers('checked', c).map((b) => b.blocker.id)).toEqual([
      'role',
      'state',
      'independence',
      'verdict',
      'manual-items',
      'open-findings',
    ]);
  });
});
