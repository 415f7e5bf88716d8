import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { startTestApp, TEST_PASSWORD, person } from '../support/api-harness';
import { advanceTo, createCalc, revisionOf, sign, tickAll, type Team } from '../support/calc-harness';
import { auditOf, lastAuditId } from '../support/audit-harness';
import { mailAbout } from '../support/mail-harness';
import { testStandard } from '../support/standard-harness';
import { CLOCK_SLACK_MS } from '../support/wall-clock';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

interface SignatureView {
  printedName: string;
  role: string;
  meaning: string;
  signedAt: string;
  contentHash: string;
  isValid: boolean;
}

async function team(ruleSetId?: number) {
  const author = await person(app, ['author']);
  const checker = await person(app, ['checker']);
  const approver = await person(app, ['approver']);
  const created = await createCalc(author.session, { ruleSetId });
  const sessions: Team = { author: author.session, checker: checker.session, approver: approver.session };
  return { author, checker, approver, sessions, ...created };
}

/** What someone with database access but no business in the app might do: change a stored input. */
async function tamperWithInput(revisionId: number): Promise<void> {
  const [row] = await sequelize.query<{ input: string }>('SELECT input FROM revisions WHERE id = ?', {
    replacements: [revisionId],
    type: QueryTypes.SELECT,
  });
  const input = JSON.parse(row.input);
  input.segments[1].od = input.segments[1].od + 5;
  await sequelize.query('UPDATE revisions SET input = ? WHERE id = ?', {
    replacements: [JSON.stringify(input), revisionId],
  });
}

describe('the password', () => {
  it('when the password is wrong, then it is 400 naming password, nothing is signed, and the refusal is audited', async () => {
    // Arrange
    const t = await team();
    const since = await lastAuditId();

    // Act
    const res = await sign(t.author.session, t.revisionId, 'authored', { password: 'not my password' });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ password: ['is not correct'] });
    expect(res.body.message).toMatch(/nothing was signed/);
    const r = await revisionOf(t.author.session, t.revisionId);
    expect([r.status, r.signatures]).toEqual(['draft', []]);
    expect(await auditOf('Revision', t.revisionId, since)).toEqual([
      expect.objectContaining({
        action: 'revision.signature_refused',
        actorId: t.author.user.id,
        payload: { meaning: 'authored', reason: 'wrong password' },
      }),
    ]);
    expect(await mailAbout(t.project.code)).toEqual([]);
  });

  it('when the password is missing, then it is 400 naming password', async () => {
    // Arrange
    const t = await team();

    // Act
    const res = await t.author.session.post(`/api/revisions/${t.revisionId}/sign`, {
      meaning: 'authored',
      idempotencyKey: randomUUID(),
      lockVersion: 0,
    });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors.password).toEqual(['is required']);
  });
});

describe('what is said first', () => {
  it('when the checker signs with manual items open, then the reason is the one error, whatever password was typed', async () => {
    // Arrange
    const t = await team();
    await advanceTo('in_check', t.sessions, t.revisionId);

    // Act
    const withRight = await sign(t.checker.session, t.revisionId, 'checked');
    const withWrong = await sign(t.checker.session, t.revisionId, 'checked', { password: 'not my password' });

    // Assert
    for (const res of [withRight, withWrong]) {
      expect(res.status).toBe(403);
      expect(res.body.message).toMatch(/Tick the \d+ open manual checklist item/);
      expect(res.body.fieldErrors ?? {}).toEqual({});
    }
  });
});

describe('idempotency', () => {
  it('when the same sign request is sent twice at once, then both answer 200 and there is exactly one signature, one audit entry and one mail each', async () => {
    // Arrange
    const t = await team();
    const key = randomUUID();
    const since = await lastAuditId();

    // Act
    const [a, b] = await Promise.all([
      sign(t.author.session, t.revisionId, 'authored', { key }),
      sign(t.author.session, t.revisionId, 'authored', { key }),
    ]);

    // Assert
    expect([a.status, b.status]).toEqual([200, 200]);
    expect([a.body.status, b.body.status]).toEqual(['in_check', 'in_check']);
    expect((await revisionOf(t.author.session, t.revisionId)).signatures).toHaveLength(1);
    expect((await auditOf('Revision', t.revisionId, since)).map((e) => e.action)).toEqual(['revision.signed_authored']);
    const recipients = (await mailAbout(t.project.code, 'submitted')).map((m) => m.recipient);
    expect(new Set(recipients).size).toBe(recipients.length);
    expect(recipients).toContain(t.checker.email);
  });

  it('when a signed request is retried later with the same key, then it answers as the first did and signs nothing more', async () => {
    // Arrange
    const t = await team();
    const key = randomUUID();
    const first = await sign(t.author.session, t.revisionId, 'authored', { key });

    // Act
    const retry = await t.author.session.post(`/api/revisions/${t.revisionId}/sign`, {
      password: TEST_PASSWORD,
      meaning: 'authored',
      idempotencyKey: key,
      lockVersion: 0,
    });

    // Assert
    expect([first.status, retry.status]).toEqual([200, 200]);
    expect(retry.body.signatures).toEqual(first.body.signatures);
  });

  it('when a key already used is sent for another revision, then it is 409 and that revision is not signed', async () => {
    // Arrange
    const t = await team();
    const other = await createCalc(t.author.session);
    const key = randomUUID();
    await sign(t.author.session, t.revisionId, 'authored', { key });

    // Act
    const res = await sign(t.author.session, other.revisionId, 'authored', { key });

    // Assert
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/This signing request key was already used for another signature/);
    const r = await revisionOf(t.author.session, other.revisionId);
    expect([r.status, r.signatures]).toEqual(['draft', []]);
  });
});

describe('what a signature records', () => {
  it("when the author signs, then the signature holds their printed name, role, meaning, the server's UTC time and the content hash", async () => {
    // Arrange
    const t = await team();
    const before = Date.now();

    // Act
    const res = await sign(t.author.session, t.revisionId, 'authored');

    // Assert
    const after = Date.now();
    expect(res.status).toBe(200);
    const [s] = res.body.signatures as SignatureView[];
    expect(s).toEqual(
      expect.objectContaining({
        printedName: t.author.displayName,
        role: 'author',
        meaning: 'authored',
        contentHash: res.body.contentHash,
        isValid: true,
      }),
    );
    expect(s.contentHash).toMatch(/^[0-9a-f]{64}$/);
    expect(s.signedAt).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
    // Signed while the request ran, give or take the wall clock: a time service may step it between readings.
    expect(Date.parse(s.signedAt)).toBeGreaterThanOrEqual(before - CLOCK_SLACK_MS);
    expect(Date.parse(s.signedAt)).toBeLessThanOrEqual(after + CLOCK_SLACK_MS);
  });
});

describe('tampering', () => {
  it('when a stored input of an approved revision is changed in the database, then every signature shows as no longer valid', async () => {
    // Arrange
    const t = await team();
    await advanceTo('approved', t.sessions, t.revisionId);
    const signed = await revisionOf(t.author.session, t.revisionId);

    // Act
    await tamperWithInput(t.revisionId);

    // Assert
    const r = await revisionOf(t.author.session, t.revisionId);
    expect(signed.signatures.map((s: SignatureView) => s.isValid)).toEqual([true, true, true]);
    expect(r.signatures.map((s: SignatureView) => s.isValid)).toEqual([false, false, false]);
    expect(r.signatures.map((s: SignatureView) => s.contentHash)).toEqual(
      signed.signatures.map((s: SignatureView) => s.contentHash),
    );
  });

  it('when a stored input of a revision in check is changed in the database, then signing it is refused with an integrity message', async () => {
    // Arrange
    const t = await team();
    await advanceTo('in_check', t.sessions, t.revisionId);
    await tickAll(t.checker.session, t.revisionId);
    await tamperWithInput(t.revisionId);
    const since = await lastAuditId();

    // Act
    const res = await sign(t.checker.session, t.revisionId, 'checked');

    // Assert
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('integrity');
    expect(res.body.message).toMatch(/does not match its recorded hash; signing is refused/);
    const r = await revisionOf(t.author.session, t.revisionId);
    expect(r.status).toBe('in_check');
    expect(r.signatures.map((s: SignatureView) => [s.meaning, s.isValid])).toEqual([['authored', false]]);
    expect(await auditOf('Revision', t.revisionId, since)).toEqual([]);
    expect(await mailAbout(t.project.code, 'checked')).toEqual([]);
  });

  // What a signature covers besides the revision row: the calc's identity, its project's code and its standard's.
  // The read that shows the revision takes them in one statement and the standard from memory while its stamp holds.
  it.each([
    ['the calc title', 'UPDATE calcs SET title = CONCAT(title, ?) WHERE id = ?', 'calc'],
    ["the project's code", 'UPDATE projects SET code = CONCAT(code, ?) WHERE id = ?', 'project'],
    [
      "the standard's code, its lock version and content hash unchanged",
      'UPDATE rule_sets SET code = CONCAT(code, ?) WHERE id = ?',
      'standard',
    ],
  ] as const)(
    'when %s of an approved revision is changed in the database, then every signature shows as no longer valid',
    async (_what, sql, row) => {
      // Arrange: a standard of its own, so changing it touches no other test's calcs
      const standard = await testStandard();
      const t = await team(standard.id);
      await advanceTo('approved', t.sessions, t.revisionId);
      const signed = await revisionOf(t.author.session, t.revisionId);

      // Act
      const id = { calc: t.calcId, project: t.project.id, standard: standard.id }[row];
      await sequelize.query(sql, { replacements: ['-X', id] });

      // Assert
      const r = await revisionOf(t.author.session, t.revisionId);
      expect(signed.signatures.map((s: SignatureView) => s.isValid)).toEqual([true, true, true]);
      expect(r.signatures.map((s: SignatureView) => s.isValid)).toEqual([false, false, false]);
      expect(r.ruleSet.code).toBe(row === 'standard' ? `${standard.code}-X` : standard.code);
    },
  );
});
