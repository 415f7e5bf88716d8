import { startTestApp, person, type Session } from '../support/api-harness';
import {
  advanceTo,
  calcTeam,
  createCalc,
  effectiveRuleSetId,
  fixtureInput,
  revisionOf,
  sign,
  tickAll,
} from '../support/calc-harness';
import { auditOf } from '../support/audit-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Input = Record<string, unknown> & { title: string };

/**
 * One writer as the client behaves: save from what it last saw; on 409 take the `current`
 * revision the server sent back, re-apply its own change to it and save again.
 */
async function writeUntilSaved(
  s: Session,
  revisionId: number,
  mark: string,
  seen: { input: Input; lockVersion: number },
) {
  let base = seen;
  for (let attempt = 1; attempt <= 20; attempt++) {
    const res = await s.put(`/api/revisions/${revisionId}`, {
      input: { ...base.input, title: `${base.input.title} ${mark}` },
      lockVersion: base.lockVersion,
    });
    if (res.status === 200) return { attempts: attempt, lockVersion: res.body.lockVersion as number };
    if (res.status !== 409 || !res.body.current)
      throw new Error(`save ${mark}: ${res.status} ${JSON.stringify(res.body)}`);
    base = res.body.current;
  }
  throw new Error(`save ${mark} never got through`);
}

describe('two saves from the same version', () => {
  it('when two saves start from the same lockVersion, then exactly one wins and the other gets 409 with the stored revision', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);
    const start = await revisionOf(author.session, revisionId);
    const save = (title: string) =>
      author.session.put(`/api/revisions/${revisionId}`, {
        input: { ...start.input, title },
        lockVersion: start.lockVersion,
      });

    // Act
    const results = await Promise.all([save('Edited in tab one'), save('Edited in tab two')]);

    // Assert
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409]);
    const winner = results.find((r) => r.status === 200)!;
    const loser = results.find((r) => r.status === 409)!;
    expect(loser.body.message).toBe('This revision was saved elsewhere since you opened it');
    expect(loser.body.current).toEqual(
      expect.objectContaining({ id: revisionId, lockVersion: start.lockVersion + 1, input: winner.body.input }),
    );
    const stored = await revisionOf(author.session, revisionId);
    expect([stored.lockVersion, stored.input.title]).toEqual([start.lockVersion + 1, winner.body.input.title]);
  });
});

describe('many writers', () => {
  it('when six writers save at once and rebase on each 409, then no save is lost and each has its own audited diff', async () => {
    // Arrange
    const N = 6;
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);
    const start = await revisionOf(author.session, revisionId);
    const marks = Array.from({ length: N }, (_v, i) => `[w${i}]`);

    // Act
    const outcomes = await Promise.all(marks.map((mark) => writeUntilSaved(author.session, revisionId, mark, start)));

    // Assert
    const stored = await revisionOf(author.session, revisionId);
    expect(stored.lockVersion).toBe(start.lockVersion + N);
    for (const mark of marks) expect(stored.input.title).toContain(mark);
    expect(outcomes.map((o) => o.lockVersion).sort((a, b) => a - b)).toEqual(
      Array.from({ length: N }, (_v, i) => start.lockVersion + i + 1),
    );
    const saved = (await auditOf('Revision', revisionId)).filter((e) => e.action === 'revision.saved');
    expect(saved).toHaveLength(N);
    expect(saved.map((e) => e.payload.lockVersion)).toEqual(outcomes.map((o) => o.lockVersion).sort((a, b) => a - b));
    for (const e of saved) expect(e.diff).toMatch(/^\+\s+"title": ".*\[w\d\]",?$/m);
  });
});

describe('one calc number asked for at once', () => {
  it('when eight creates of the same number race, then one is made and the rest are told the number is used', async () => {
    // Arrange: a project and an author; the check before the transaction cannot see a create still in flight
    const t = await calcTeam(app);
    const number = `C-RACE-${Date.now() % 100_000}`;
    const body = {
      projectId: t.project.id,
      number,
      title: 'Racing head shaft',
      partRef: 'DRG-2',
      ruleSetId: await effectiveRuleSetId(),
      input: fixtureInput(),
    };

    // Act
    const answers = await Promise.all(Array.from({ length: 8 }, () => t.author.session.post('/api/calcs', body)));

    // Assert: never the index's own name, always the field as the form names it
    expect(answers.filter((r) => r.status === 201)).toHaveLength(1);
    for (const r of answers.filter((a) => a.status !== 201)) {
      expect(r.status).toBe(409);
      expect(r.body.fieldErrors).toEqual({ number: ['is already used in this project'] });
    }
  });
});

describe('two signatures at once', () => {
  it('when two independent checkers sign the same revision at once, then exactly one signature is recorded and the other is refused', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const [first, second] = [await person(app, ['checker']), await person(app, ['checker'])];
    const { revisionId } = await createCalc(author.session);
    await advanceTo(
      'in_check',
      { author: author.session, checker: first.session, approver: first.session },
      revisionId,
    );
    await tickAll(first.session, revisionId);

    // Act
    const results = await Promise.all([
      sign(first.session, revisionId, 'checked'),
      sign(second.session, revisionId, 'checked'),
    ]);

    // Assert
    expect(results.map((r) => r.status).sort()).toEqual([200, 403]);
    expect(results.find((r) => r.status === 403)!.body.message).toMatch(
      /A checked revision cannot be signed as checked/,
    );
    const stored = await revisionOf(author.session, revisionId);
    expect(stored.signatures.filter((s: { meaning: string }) => s.meaning === 'checked')).toHaveLength(1);
    expect((await auditOf('Revision', revisionId)).filter((e) => e.action === 'revision.signed_checked')).toHaveLength(
      1,
    );
  });
});

describe('refusals that protect the stored revision', () => {
  it('when a save has no lockVersion, then it is 400 naming lockVersion', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);

    // Act
    const res = await author.session.put(`/api/revisions/${revisionId}`, { input: { title: 'No version' } });

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ lockVersion: ['is required (the version you started from)'] });
  });

  it("when another author saves someone else's draft, then it is refused with 403 and the draft is unchanged", async () => {
    // Arrange
    const author = await person(app, ['author']);
    const other = await person(app, ['author'], 'other');
    const { revisionId } = await createCalc(author.session);
    const before = await revisionOf(author.session, revisionId);

    // Act
    const res = await other.session.put(`/api/revisions/${revisionId}`, {
      input: { ...before.input, title: 'Not mine' },
      lockVersion: before.lockVersion,
    });

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toBe('Only the author of this revision can edit it');
    expect((await revisionOf(author.session, revisionId)).lockVersion).toBe(before.lockVersion);
  });
});
