import { randomUUID } from 'node:crypto';
import { startTestApp } from '../support/api-harness';
import { calcTeam, revisionOf, sign, tickAll } from '../support/calc-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

describe('from draft to approved', () => {
  it('when author, checker and approver each sign, then the revision is approved with three valid signatures', async () => {
    const { author, checker, approver, revisionId } = await calcTeam(app);

    const submitted = await sign(author.session, revisionId, 'authored');
    expect(submitted.status).toBe(200);
    expect(submitted.body.status).toBe('in_check');
    await tickAll(checker.session, revisionId);
    const checked = await sign(checker.session, revisionId, 'checked');
    expect(checked.body).toEqual(expect.objectContaining({ status: 'checked' }));
    const approved = await sign(approver.session, revisionId, 'approved');

    expect(approved.status).toBe(200);
    expect(approved.body.status).toBe('approved');
    expect(approved.body.signatures.map((s: { meaning: string; isValid: boolean }) => [s.meaning, s.isValid])).toEqual([
      ['authored', true],
      ['checked', true],
      ['approved', true],
    ]);
  });
});

describe('independence', () => {
  it('when the author tries to check their own calc, then it is refused with the reason', async () => {
    const { author, revisionId } = await calcTeam(app);
    await sign(author.session, revisionId, 'authored');

    const res = await sign(author.session, revisionId, 'checked');

    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/checker role|edited this calc/);
  });

  it('when the checker tries to approve what they checked, then it is refused', async () => {
    const { author, checker, revisionId } = await calcTeam(app);
    await sign(author.session, revisionId, 'authored');
    await tickAll(checker.session, revisionId);
    await sign(checker.session, revisionId, 'checked');

    const res = await sign(checker.session, revisionId, 'approved');

    expect(res.status).toBe(403);
  });
});

describe('signing safeguards', () => {
  it('when the password is wrong, then nothing is signed but the refusal is on record', async () => {
    const { author, revisionId } = await calcTeam(app);

    const res = await sign(author.session, revisionId, 'authored', { password: 'not my password' });

    expect(res.status).toBe(400);
    expect(res.body.fieldErrors.password).toBeDefined();
    expect((await revisionOf(author.session, revisionId)).signatures).toHaveLength(0);
  });

  it('when the same sign request is sent twice, then there is exactly one signature', async () => {
    const { author, revisionId } = await calcTeam(app);
    const key = randomUUID();

    const [a, b] = await Promise.all([
      sign(author.session, revisionId, 'authored', { key }),
      sign(author.session, revisionId, 'authored', { key }),
    ]);

    expect([a.status, b.status]).toEqual([200, 200]);
    expect((await revisionOf(author.session, revisionId)).signatures).toHaveLength(1);
  });
});
