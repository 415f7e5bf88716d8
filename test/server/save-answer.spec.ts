import { expectStatus, person, startTestApp, type Session } from '../support/api-harness';
import { createCalc, revisionOf, sign } from '../support/calc-harness';
import { testStandard } from '../support/standard-harness';
import { returnedWithFindingOf } from '../support/findings-harness';
import { pdfBytes, upload } from '../support/upload-harness';
import { Revision } from '../../server/db/models';
import { lockWithContext, withStoredResult } from '../../server/calcs/save-context';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

/*
 * A save answers with the revision as it wrote it, built from what the save read and wrote rather than read back
 * (its standard's row from memory while the row's stamp is unchanged, its people and editors from one statement).
 * Whatever it skipped reading, the answer must be what a GET of the revision returns right after.
 */
async function saveAndRead(s: Session, revisionId: number, change: (input: Record<string, unknown>) => void) {
  const before = await revisionOf(s, revisionId);
  const input = structuredClone(before.input) as Record<string, unknown>;
  change(input);
  const saved = expectStatus(
    await s.put(`/api/revisions/${revisionId}`, { input, lockVersion: before.lockVersion }),
    200,
    'save',
  );
  return { saved: saved.body, read: await revisionOf(s, revisionId) };
}

const retitle = (title: string) => (input: Record<string, unknown>) => {
  input.title = title;
};

describe("a save's answer", () => {
  it('when an author saves a fresh draft twice, then each answer is what a GET returns after it', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);

    // Act
    const first = await saveAndRead(author.session, revisionId, retitle('Head shaft, first save'));
    const second = await saveAndRead(author.session, revisionId, retitle('Head shaft, second save'));

    // Assert
    expect(first.saved).toEqual(first.read);
    expect(second.saved).toEqual(second.read);
    expect(second.saved.editorIds).toEqual([author.user.id]);
    expect(second.saved.author).toEqual({ id: author.user.id, name: author.displayName });
  });

  it('when a returned revision with a finding and a signature is saved, then the answer is what a GET returns', async () => {
    // Arrange
    const t = await returnedWithFindingOf(app);

    // Act
    const { saved, read } = await saveAndRead(t.author.session, t.revisionId, retitle('Answered: chart named'));

    // Assert
    expect(saved.findings).toHaveLength(1);
    expect(saved).toEqual(read);
  });

  it("when the standard's row changes between two saves, then the second answer shows the row as stored", async () => {
    // Arrange
    const author = await person(app, ['author']);
    const standard = await testStandard();
    const { revisionId } = await createCalc(author.session, { ruleSetId: standard.id });
    await saveAndRead(author.session, revisionId, retitle('Before the change'));
    // Behind the app's back, without a new lock version: the stamp's content hash still tells the row changed.
    await sequelize.query(
      "UPDATE rule_sets SET title = 'Retitled standard', content_hash = REPEAT('a', 64) WHERE id = ?",
      {
        replacements: [standard.id],
      },
    );

    // Act
    const { saved, read } = await saveAndRead(author.session, revisionId, retitle('After the change'));

    // Assert
    expect(saved.ruleSet.title).toBe('Retitled standard');
    expect(saved).toEqual(read);
  });

  it('when a draft with an attachment is saved, then the answer is what a GET returns and its hash covers the file', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);
    expectStatus(await upload(author.session, revisionId, pdfBytes(), { kind: 'drawing' }, 'seat.pdf'), 201, 'upload');

    // Act
    const { saved, read } = await saveAndRead(author.session, revisionId, retitle('With the seat drawing'));
    const submitted = await sign(author.session, revisionId, 'authored');

    // Assert
    expect(saved).toEqual(read);
    expect(submitted.status).toBe(200);
    const signatures = (await revisionOf(author.session, revisionId)).signatures;
    expect(signatures.map((x: { isValid: boolean }) => x.isValid)).toEqual([true]);
  });

  it('when a save runs again and finds itself stored, then the row it locked gets the result and checklist as stored', async () => {
    // Arrange: a save locks its row without the two texts it replaces; a run after a lost answer needs them.
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);
    await saveAndRead(author.session, revisionId, retitle('Stored once'));
    const stored = (await Revision.findByPk(revisionId))!;

    // Act
    const found = await sequelize.transaction(async (transaction) => {
      const { revision } = await lockWithContext(revisionId, author.user.id, transaction);
      const before = { result: revision.result, checklist: revision.checklist };
      await withStoredResult(revision, transaction);
      return { before, after: { result: revision.result, checklist: revision.checklist } };
    });

    // Assert
    expect(found.before).toEqual({ result: undefined, checklist: undefined });
    expect(found.after).toEqual({ result: stored.result, checklist: stored.checklist });
    expect(found.after.result).toEqual(expect.any(String));
  });
});
