import { randomUUID } from 'node:crypto';
import { Revision, Signature } from '../../server/db/models';
import { TEST_PASSWORD, startTestApp } from '../support/api-harness';
import { attachRequiredFiles } from '../support/attachment-harness';
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

  it("when a twin request commits between a retry's reads of the revision and of its key, then the retry answers 200", async () => {
    // Arrange: the retry's two reads before its transaction, in whichever order the service makes them; the second
    // waits until the twin (same key) has committed its signature. Reading the key first found nothing, then read
    // the revision already moved on, and refused the retry as out of turn (403 here, a 409 once in a fresh clone).
    const { author, revisionId } = await calcTeam(app);
    await attachRequiredFiles(revisionId, (await revisionOf(author.session, revisionId)).checklist?.manual ?? []);
    const body = {
      password: TEST_PASSWORD,
      meaning: 'authored',
      idempotencyKey: randomUUID(),
      lockVersion: (await revisionOf(author.session, revisionId)).lockVersion,
    };
    const reads: string[] = [];
    let reachedSecond!: () => void;
    const secondRead = new Promise<void>((resolve) => (reachedSecond = resolve));
    let twinDone!: () => void;
    const twinCommitted = new Promise<void>((resolve) => (twinDone = resolve));
    const pauseSecond = async (name: string) => {
      if (reads.length >= 2) return;
      reads.push(name);
      if (reads.length < 2) return;
      reachedSecond();
      await twinCommitted;
    };
    type Options = { transaction?: unknown; where?: { idempotencyKey?: string } } | undefined;
    const findByPk = Revision.findByPk.bind(Revision) as (id: unknown, o: Options) => Promise<unknown>;
    const findOne = Signature.findOne.bind(Signature) as (o: Options) => Promise<unknown>;
    const spies = [
      jest.spyOn(Revision, 'findByPk').mockImplementation((async (id: unknown, o: Options) => {
        if (id === revisionId && !o?.transaction) await pauseSecond('revision');
        return findByPk(id, o);
      }) as never),
      jest.spyOn(Signature, 'findOne').mockImplementation((async (o: Options) => {
        if (o?.where?.idempotencyKey === body.idempotencyKey && !o.transaction) await pauseSecond('key');
        return findOne(o);
      }) as never),
    ];

    try {
      // Act
      const retry = author.session.post(`/api/revisions/${revisionId}/sign`, body).then((res) => res);
      await secondRead;
      const twin = await author.session.post(`/api/revisions/${revisionId}/sign`, body);
      twinDone();

      // Assert
      expect([twin.status, (await retry).status]).toEqual([200, 200]);
      expect(reads).toEqual(['revision', 'key']);
      expect((await revisionOf(author.session, revisionId)).signatures).toHaveLength(1);
    } finally {
      for (const spy of spies) spy.mockRestore();
    }
  });
});
