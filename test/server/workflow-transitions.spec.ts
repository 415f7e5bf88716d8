import { randomUUID } from 'node:crypto';
import { startTestApp, TEST_PASSWORD } from '../support/api-harness';
import {
  advanceTo, auditOf, createCalc, lastAuditId, person, revisionOf, sign, tickAll, type Meaning, type Session, type Team,
} from '../support/calc-harness';
import type { Role } from '../../shared/authz/roles';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());
// Each step signs in or signs with a password (Argon2) on a shared two-core machine: allow whole workflows.
jest.setTimeout(60_000);

/**
 * Who tries. "author" and "author+checker" are the revision's own author; every other actor is an
 * independent holder of the named role who never touched the calc, so a refusal can only come
 * from the role or the state, never from a hidden edit.
 */
const ACTORS = ['author', 'author+checker', 'other author', 'checker', 'approver', 'compliance', 'admin'] as const;
type Who = (typeof ACTORS)[number];
const ROLES_OF: Record<Who, Role[]> = {
  author: ['author'], 'author+checker': ['author', 'checker'], 'other author': ['author'],
  checker: ['checker'], approver: ['approver'], compliance: ['compliance'], admin: ['admin'],
};
const isOwnAuthor = (who: Who) => who === 'author' || who === 'author+checker';

type From = 'draft' | 'in_check' | 'checked';
interface Transition {
  name: string; from: From; to: string; allowed: readonly Who[]; audit: string;
  /** `lockVersion` is read by the author: admins may not read revisions, yet must get a well-formed request refused. */
  act: (s: Session, revisionId: number, lockVersion: number) => Promise<{ status: number; body: { message?: string; status?: string } }>;
  /** What a refusal says, given who tried. */
  refusal: (who: Who) => RegExp;
}

const RETURN_REFUSAL = /Only an independent checker \(in check\) or approver \(checked\) can return/;
const signRefusal = (role: Role) => (who: Who) => {
  if (!ROLES_OF[who].includes(role)) return new RegExp(`needs the ${role} role`);
  if (role === 'author') return /Only the author of this revision can sign it as authored/;
  return /You edited this calc.*independence requires someone else/;
};
const lockVersionOf = async (s: Session, id: number) => (await revisionOf(s, id)).lockVersion as number;
const signAs = (meaning: Meaning) => (s: Session, id: number, lockVersion: number) =>
  s.post(`/api/revisions/${id}/sign`, { password: TEST_PASSWORD, meaning, idempotencyKey: randomUUID(), lockVersion });
const returnIt = (s: Session, id: number, lockVersion: number) => s.post(`/api/revisions/${id}/return`, { reason: 'Keyseat factor needs a source', lockVersion });

const TRANSITIONS: Transition[] = [
  { name: 'submit (sign as authored)', from: 'draft', to: 'in_check', allowed: ['author', 'author+checker'], audit: 'revision.signed_authored',
    act: signAs('authored'), refusal: signRefusal('author') },
  { name: 'sign as checked', from: 'in_check', to: 'checked', allowed: ['checker'], audit: 'revision.signed_checked',
    act: signAs('checked'), refusal: signRefusal('checker') },
  { name: 'sign as approved', from: 'checked', to: 'approved', allowed: ['approver'], audit: 'revision.signed_approved',
    act: signAs('approved'), refusal: signRefusal('approver') },
  { name: 'return an in-check revision', from: 'in_check', to: 'returned', allowed: ['checker'], audit: 'revision.returned',
    act: returnIt, refusal: () => RETURN_REFUSAL },
  { name: 'return a checked revision', from: 'checked', to: 'returned', allowed: ['approver'], audit: 'revision.returned',
    act: returnIt, refusal: () => RETURN_REFUSAL },
  { name: 'withdraw a draft', from: 'draft', to: 'withdrawn', allowed: ['author', 'author+checker'], audit: 'revision.withdrawn',
    act: (s, id, lockVersion) => s.post(`/api/revisions/${id}/withdraw`, { reason: 'Duplicate of another calc', lockVersion }),
    refusal: () => /Only the author can withdraw a draft or returned revision/ },
];

// Admins may not read revisions at all, so every call reads back through the author's session.
async function scene(who: Who) {
  const author = who === 'author+checker' ? await person(app, ['author', 'checker'], 'authchk') : await person(app, ['author']);
  const team: Team = { author: author.session, checker: (await person(app, ['checker'])).session, approver: (await person(app, ['approver'])).session };
  const actor = isOwnAuthor(who) ? author : await person(app, ROLES_OF[who], who.replace(/\W/g, ''));
  const { revisionId } = await createCalc(author.session);
  return { team, actor, revisionId };
}

async function arrange(from: From, team: Team, revisionId: number): Promise<void> {
  if (from !== 'draft') await advanceTo(from, team, revisionId);
  // Manual items are the checker's; ticking them first means a refused check is refused for who tries, not for open items.
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
        expect(audit).toEqual([expect.objectContaining({ action: t.audit, actorId: actor.user.id, actorName: actor.displayName })]);
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

describe('what an allowed transition records', () => {
  it('when each of the three signs, then each signature carries that person\'s printed name, role and meaning, and each step its own time', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const checker = await person(app, ['checker']);
    const approver = await person(app, ['approver']);
    const { revisionId } = await createCalc(author.session);

    // Act
    await advanceTo('approved', { author: author.session, checker: checker.session, approver: approver.session }, revisionId);

    // Assert
    const r = await revisionOf(author.session, revisionId);
    expect(r.signatures.map((s: { printedName: string; role: string; meaning: string }) => [s.printedName, s.role, s.meaning])).toEqual([
      [author.displayName, 'author', 'authored'], [checker.displayName, 'checker', 'checked'], [approver.displayName, 'approver', 'approved'],
    ]);
    expect([r.author.id, r.checker.id, r.approver.id]).toEqual([author.user.id, checker.user.id, approver.user.id]);
    // Each step keeps its own time: signing later never overwrites when the calc was submitted.
    expect([r.submittedAt, r.checkedAt, r.approvedAt]).toEqual(r.signatures.map((s: { signedAt: string }) => s.signedAt));
  });

  it.each([
    ['checker', 'in_check'], ['approver', 'checked'],
  ] as const)('when the %s returns a revision, then the reason becomes an open finding they raised', async (role, from) => {
    // Arrange
    const author = await person(app, ['author']);
    const team: Team = { author: author.session, checker: (await person(app, ['checker'])).session, approver: (await person(app, ['approver'])).session };
    const returner = await person(app, [role]);
    const { revisionId } = await createCalc(author.session);
    await arrange(from, team, revisionId);

    // Act
    const res = await returner.session.post(`/api/revisions/${revisionId}/return`, { reason: 'Cite the chart behind Kts at the gear keyseat', lockVersion: await lockVersionOf(author.session, revisionId) });

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('returned');
    expect(res.body.findings).toEqual([expect.objectContaining({
      text: 'Cite the chart behind Kts at the gear keyseat', status: 'open', raisedBy: { id: returner.user.id, name: returner.displayName },
    })]);
  });

  it('when the author withdraws a returned revision, then it is withdrawn', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const checker = await person(app, ['checker']);
    const { revisionId } = await createCalc(author.session);
    await advanceTo('in_check', { author: author.session, checker: checker.session, approver: checker.session }, revisionId);
    await checker.session.post(`/api/revisions/${revisionId}/return`, { reason: 'Wrong load case', lockVersion: await lockVersionOf(author.session, revisionId) });

    // Act
    const res = await author.session.post(`/api/revisions/${revisionId}/withdraw`, { reason: 'Replaced by a new calc', lockVersion: await lockVersionOf(author.session, revisionId) });

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('withdrawn');
  });
});

describe('wrong state', () => {
  const CASES: { name: string; from: From | 'approved'; who: 'author' | 'checker' | 'approver'; act: (s: Session, id: number) => ReturnType<Transition['act']>; message: RegExp }[] = [
    { name: 'the author submits a revision already in check', from: 'in_check', who: 'author', act: (s, id) => sign(s, id, 'authored'), message: /in check revision cannot be signed as authored/ },
    { name: 'a checker signs a draft as checked', from: 'draft', who: 'checker', act: (s, id) => sign(s, id, 'checked'), message: /draft revision cannot be signed as checked/ },
    { name: 'an approver approves a revision still in check', from: 'in_check', who: 'approver', act: (s, id) => sign(s, id, 'approved'), message: /in check revision cannot be signed as approved/ },
    { name: 'an approver approves an approved revision again', from: 'approved', who: 'approver', act: (s, id) => sign(s, id, 'approved'), message: /approved revision cannot be signed as approved/ },
    { name: 'a checker returns a draft', from: 'draft', who: 'checker', act: async (s, id) => s.post(`/api/revisions/${id}/return`, { reason: 'Not ready yet', lockVersion: 0 }), message: RETURN_REFUSAL },
    { name: 'the author withdraws a revision in check', from: 'in_check', who: 'author', act: async (s, id) => s.post(`/api/revisions/${id}/withdraw`, { reason: 'Changed my mind', lockVersion: 0 }), message: /Only the author can withdraw a draft or returned revision/ },
  ];

  it.each(CASES)('when $name, then it is refused with 403 and a message naming the state', async ({ from, who, act, message }) => {
    // Arrange
    const author = await person(app, ['author']);
    const team: Team = { author: author.session, checker: (await person(app, ['checker'])).session, approver: (await person(app, ['approver'])).session };
    const { revisionId } = await createCalc(author.session);
    if (from !== 'draft') await advanceTo(from, team, revisionId);

    // Act
    const res = await act(team[who], revisionId);

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(message);
    expect((await revisionOf(author.session, revisionId)).status).toBe(from);
  });

  it('when a signature is sent with an old lockVersion, then it is refused with 409 and nothing is signed', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);
    const stale = await lockVersionOf(author.session, revisionId);
    await author.session.put(`/api/revisions/${revisionId}`, { input: (await revisionOf(author.session, revisionId)).input, lockVersion: stale });

    // Act
    const res = await author.session.post(`/api/revisions/${revisionId}/sign`, { password: TEST_PASSWORD, meaning: 'authored', idempotencyKey: randomUUID(), lockVersion: stale });

    // Assert
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/changed since you opened it/);
    expect((await revisionOf(author.session, revisionId)).signatures).toEqual([]);
  });
});

describe('nobody signs for someone else', () => {
  it.each(['printedName', 'userId', 'role'])('when a sign request names a %s, then it is refused with 400 naming that field', async (field) => {
    // Arrange
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);

    // Act
    const res = await author.session.post(`/api/revisions/${revisionId}/sign`, {
      password: TEST_PASSWORD, meaning: 'authored', idempotencyKey: randomUUID(), lockVersion: 0, [field]: field === 'userId' ? 1 : 'Someone Else',
    });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors[field]).toEqual(['is not an accepted field']);
    expect((await revisionOf(author.session, revisionId)).signatures).toEqual([]);
  });
});
