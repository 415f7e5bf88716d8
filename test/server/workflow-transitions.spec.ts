import { randomUUID } from 'node:crypto';
import { startTestApp, TEST_PASSWORD, person, type Session } from '../support/api-harness';
import { advanceTo, createCalc, revisionOf, tickAll, type Meaning, type Team } from '../support/calc-harness';
import { auditOf, lastAuditId } from '../support/audit-harness';
import type { Role } from '../../shared/authz/roles';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

/**
 * Who tries. "author" and "author+checker" are the revision's own author; every other actor is an
 * independent holder of the named role who never touched the calc, so a refusal can only come
 * from the role or the state, never from a hidden edit.
 */
const ACTORS = ['author', 'author+checker', 'other author', 'checker', 'approver', 'compliance', 'admin'] as const;
type Who = (typeof ACTORS)[number];
const ROLES_OF: Record<Who, Role[]> = {
  author: ['author'],
  'author+checker': ['author', 'checker'],
  'other author': ['author'],
  checker: ['checker'],
  approver: ['approver'],
  compliance: ['compliance'],
  admin: ['admin'],
};
const isOwnAuthor = (who: Who) => who === 'author' || who === 'author+checker';

type From = 'draft' | 'in_check' | 'checked';
interface Transition {
  name: string;
  from: From;
  to: string;
  allowed: readonly Who[];
  audit: string;
  /** `lockVersion` is read by the author: admins may not read revisions, yet must get a well-formed request refused. */
  act: (
    s: Session,
    revisionId: number,
    lockVersion: number,
  ) => Promise<{ status: number; body: { message?: string; status?: string } }>;
  /** What a refusal says, given who tried. */
  refusal: (who: Who) => RegExp;
}

const RETURN_REFUSAL = /Only an independent checker \(in check\) or approver \(checked\) can return/;
const signRefusal = (role: Role) => (who: Who) => {
  if (!ROLES_OF[who].includes(role)) return new RegExp(`needs the ${role} role`);
  if (role === 'author') return /Only the author of this revision can sign it as authored/;
  return /You edited this calc.*independence requires someone else/;
};
const signAs = (meaning: Meaning) => (s: Session, id: number, lockVersion: number) =>
  s.post(`/api/revisions/${id}/sign`, { password: TEST_PASSWORD, meaning, idempotencyKey: randomUUID(), lockVersion });
const returnIt = (s: Session, id: number, lockVersion: number) =>
  s.post(`/api/revisions/${id}/return`, { reason: 'Keyseat factor needs a source', lockVersion });

const TRANSITIONS: Transition[] = [
  {
    name: 'submit (sign as authored)',
    from: 'draft',
    to: 'in_check',
    allowed: ['author', 'author+checker'],
    audit: 'revision.signed_authored',
    act: signAs('authored'),
    refusal: signRefusal('author'),
  },
  {
    name: 'sign as checked',
    from: 'in_check',
    to: 'checked',
    allowed: ['checker'],
    audit: 'revision.signed_checked',
    act: signAs('checked'),
    refusal: signRefusal('checker'),
  },
  {
    name: 'sign as approved',
    from: 'checked',
    to: 'approved',
    allowed: ['approver'],
    audit: 'revision.signed_approved',
    act: signAs('approved'),
    refusal: signRefusal('approver'),
  },
  {
    name: 'return an in-check revision',
    from: 'in_check',
    to: 'returned',
    allowed: ['checker'],
    audit: 'revision.returned',
    act: returnIt,
    refusal: () => RETURN_REFUSAL,
  },
  {
    name: 'return a checked revision',
    from: 'checked',
    to: 'returned',
    allowed: ['approver'],
    audit: 'revision.returned',
    act: returnIt,
    refusal: () => RETURN_REFUSAL,
  },
  {
    name: 'withdraw a draft',
    from: 'draft',
    to: 'withdrawn',
    allowed: ['author', 'author+checker'],
    audit: 'revision.withdrawn',
    act: (s, id, lockVersion) =>
      s.post(`/api/revisions/${id}/withdraw`, { reason: 'Duplicate of another calc', lockVersion }),
    refusal: () => /Only the author can withdraw a draft or returned revision/,
  },
];

// Admins may not read revisions at all, so every call reads back through the author's session.
async function scene(who: Who) {
  const author =
    who === 'author+checker' ? await person(app, ['author', 'checker'], 'authchk') : await person(app, ['author']);
  const team: Team = {
    author: author.session,
    checker: (await person(app, ['checker'])).session,
    approver: (await person(app, ['approver'])).session,
  };
  const actor = isOwnAuthor(who) ? author : await person(app, ROLES_OF[who], who.replace(/\W/g, ''));
  const { revisionId } = await createCalc(author.session);
  return { team, actor, revisionId };
}

async function arrange(from: From, team: Team, revisionId: number): Promise<void> {
  if (from !== 'draft') await advanceTo(from, team, revisionId);
  // Manual items are the checker's; ticking them first means a refused check is refused for who tries, not for open
  // items.
  if (from === 'in_check') await tickAll(team.checker, revisionId);
}

describe.each(ACTORS)('as %s', (who) => {
  for (const t of TRANSITIONS) {
    const isAllowed = t.allowed.includes(who);
    it(`when the ${who} tries to ${t.name}, then ${isAllowed ? `it becomes ${t.to}` : 'it is refused with 403 and nothing changes'}`, async () => {
      // Arrange
      const { team, actor, revisionId } = await scene(who);
      await arrange(t.from, team, revisionId);
      const before = await revisionOf(team.author, revisionId);
      const since = await lastAuditId();

      // Act
      const res = await t.act(actor.session, revisionId, before.lockVersion);

      // Assert
      const after = await revisionOf(team.author, revisionId);
      const audit = await auditOf('Revision', revisionId, since);
      if (isAllowed) {
        expect(res.status).toBe(200);
        expect(after.status).toBe(t.to);
        expect(audit).toEqual([
          expect.objectContaining({ action: t.audit, actorId: actor.user.id, actorName: actor.displayName }),
        ]);
      } else {
        expect(res.status).toBe(403);
        expect(res.body.message).toMatch(t.refusal(who));
        expect(after.status).toBe(t.from);
        expect(after.signatures).toHaveLength(before.signatures.length);
        expect(after.findings).toHaveLength(before.findings.length);
        expect(audit).toEqual([]);
      }
    });
  }
});
