import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import { QueryTypes } from 'sequelize';
import { fixtureInput, sign, tickAll } from '../support/calc-harness';
import { expectStatus, startTestApp } from '../support/api-harness';
import { lockModel, modelStandardId, modelTeam, modelUrl, revisionOf, saveModel } from '../support/model-harness';
import { IndependentModel, RuleSetRecord } from '../../server/db/models';
import { parseRuleSet } from '../../server/rule-sets/rule-set-cache';
import { computeRecord } from '../../server/calcs/revision-content';
import { expandChecklist } from '../../server/calcs/stored-checklist';
import { modelHashOf } from '../../server/independent/model-hash';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Row = { result: string; checklist: string };
const rowOf = async (revisionId: number) =>
  (
    await sequelize.query<Row & { input: string }>(
      'SELECT input, result, checklist FROM independent_models WHERE revision_id = ?',
      {
        replacements: [revisionId],
        type: QueryTypes.SELECT,
      },
    )
  )[0];
const rewrite = (revisionId: number, row: Row) =>
  sequelize.query('UPDATE independent_models SET result = ?, checklist = ? WHERE revision_id = ?', {
    replacements: [row.result, row.checklist, revisionId],
  });

/** The checker's model as evaluated, the row the code before compact storage wrote for it, and that code's hash. */
async function evaluated(input: Record<string, unknown>) {
  const record = (await RuleSetRecord.findByPk(await modelStandardId()))!;
  const { result, checklist } = await computeRecord(input, parseRuleSet(record));
  const whole: Row = { result: JSON.stringify(result), checklist: JSON.stringify(checklist) };
  const content = { input, result: JSON.parse(whole.result), checklist: JSON.parse(whole.checklist) };
  const hash = createHash('sha256').update(canonicalize(content)!).digest('hex');
  return { result: result!, checklist: checklist!, whole, hash };
}

/** A model saved and locked by the checker, who then signs as checked (a format 3 signature covers its hash). */
async function signedModel() {
  const t = await modelTeam(app);
  const input = fixtureInput();
  const saved = await saveModel(t.checker.session, t.revisionId, input);
  const row = await rowOf(t.revisionId);
  const locked = await lockModel(t.checker.session, t.revisionId);
  await tickAll(t.checker.session, t.revisionId);
  expectStatus(await sign(t.checker.session, t.revisionId, 'checked'), 200, 'sign as checked');
  return { t, saved, row, locked, before: await evaluated(input) };
}

/** What a reader of the revision sees of the model: its recomputed hash and whether each signature holds. */
async function verified(t: Awaited<ReturnType<typeof modelTeam>>) {
  const rev = await revisionOf(t.author.session, t.revisionId);
  const signatures = rev.signatures.map((s: { meaning: string; contentFormat: number; isValid: boolean }) => [
    s.meaning,
    s.contentFormat,
    s.isValid,
  ]);
  return { modelHash: rev.verification.signed.modelHash, signatures };
}

describe('an independent model keeps its result and checklist compactly, as a revision does', () => {
  it('when the checker saves and locks, then the row is compact, the answer and hash as evaluated', async () => {
    // Arrange
    const { saved, row, locked, before } = await signedModel();

    // Act
    const stored = { result: JSON.parse(row.result), checklist: JSON.parse(row.checklist) };

    // Assert
    expect(stored.checklist).toHaveProperty('storedRows.form', 1);
    expect(stored.result).not.toHaveProperty('fields');
    expect(stored.result).not.toHaveProperty('methods');
    expect(row.checklist.length).toBeLessThan(before.whole.checklist.length / 2);
    expect(row.result.length).toBeLessThan(before.whole.result.length);
    expect(JSON.stringify(expandChecklist(row.checklist))).toBe(before.whole.checklist);
    expect(JSON.stringify(saved.checklist)).toBe(before.whole.checklist);
    expect(saved.result).toEqual(JSON.parse(before.whole.result));
    expect(locked.modelHash).toBe(before.hash);
    expect(await modelHashOf(row)).toBe(before.hash);
  });

  it('when a signed model is rewritten whole (as before), then it reads, hashes and verifies the same', async () => {
    // Arrange
    const { t, locked, before } = await signedModel();
    const compactModel = expectStatus(await t.checker.session.get(modelUrl(t.revisionId)), 200, 'read model').body;
    const compactSeen = await verified(t);

    // Act
    await rewrite(t.revisionId, before.whole);
    const wholeModel = expectStatus(await t.checker.session.get(modelUrl(t.revisionId)), 200, 'read model').body;
    const wholeSeen = await verified(t);

    // Assert
    expect(JSON.parse((await rowOf(t.revisionId)).checklist)).not.toHaveProperty('storedRows');
    expect(compactSeen).toEqual({
      modelHash: before.hash,
      signatures: [
        ['authored', 2, true],
        ['checked', 3, true],
      ],
    });
    expect(wholeSeen).toEqual(compactSeen);
    expect(JSON.stringify(wholeModel.checklist)).toBe(JSON.stringify(compactModel.checklist));
    expect(wholeModel.result).toEqual(compactModel.result);
    expect(JSON.stringify(wholeModel.result)).toBe(before.whole.result);
    expect(await modelHashOf((await IndependentModel.findOne({ where: { revisionId: t.revisionId } }))!)).toBe(
      locked.modelHash,
    );
  });

  it('when a text of a compact checklist is changed, then the hash and the checked signature break', async () => {
    // Arrange
    const { t, row, before } = await signedModel();
    const checklist = JSON.parse(row.checklist) as { storedRows: { strings: string[] } };
    checklist.storedRows.strings[0] += ' (edited)';

    // Act
    await rewrite(t.revisionId, { result: row.result, checklist: JSON.stringify(checklist) });
    const seen = await verified(t);

    // Assert
    expect(seen.modelHash).not.toBe(before.hash);
    expect(seen.signatures).toEqual([
      ['authored', 2, true],
      ['checked', 3, false],
    ]);
  });
});
