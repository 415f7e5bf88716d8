import { QueryTypes } from 'sequelize';
import { startTestApp } from '../support/api-harness';
import { calcTeam, revisionOf, sign } from '../support/calc-harness';
import { Calc, Project, RuleSetRecord } from '../../server/db/models';
import { parseRuleSet } from '../../server/rule-sets/rule-set-cache';
import { computeRecord, contentHashOf, hashedContentOf } from '../../server/calcs/revision-content';
import { expandChecklist } from '../../server/calcs/stored-checklist';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

async function storedRow(revisionId: number) {
  const [row] = await sequelize.query<{ checklist: string; rows: number }>(
    "SELECT checklist, JSON_LENGTH(checklist, '$.rows') AS `rows` FROM revisions WHERE id = ?",
    { replacements: [revisionId], type: QueryTypes.SELECT },
  );
  return row;
}

/** A saved draft: the team, the answer to the save and the checklist the evaluator gives for its input. */
async function savedDraft() {
  const t = await calcTeam(app);
  const before = await revisionOf(t.author.session, t.revisionId);
  const input = { ...before.input, title: 'Re-saved head shaft' };
  const res = await t.author.session.put(`/api/revisions/${t.revisionId}`, { input, lockVersion: before.lockVersion });
  expect(res.status).toBe(200);
  const record = (await RuleSetRecord.findByPk(res.body.ruleSet.id))!;
  const { checklist } = await computeRecord(input, parseRuleSet(record));
  return { t, saved: res.body, record, evaluated: checklist! };
}

describe('a revision keeps its checklist compactly', () => {
  it('when the author saves, then the row is compact and the answer and its hash are of the checklist as evaluated', async () => {
    // Arrange
    const { t, saved, record, evaluated } = await savedDraft();
    const calc = (await Calc.findByPk(saved.calcId, { include: [Project] })) as Calc & { Project: Project };

    // Act
    const row = await storedRow(t.revisionId);
    const expected = contentHashOf(
      hashedContentOf(calc, saved.label, saved.input, saved.result, evaluated, record, saved.contentFormat, []),
    );

    // Assert
    expect(JSON.parse(row.checklist)).toHaveProperty('storedRows.form', 1);
    expect(row.checklist.length).toBeLessThan(JSON.stringify(evaluated).length / 2);
    expect(Number(row.rows)).toBe(evaluated.rows.length);
    expect(JSON.stringify(saved.checklist)).toBe(JSON.stringify(evaluated));
    expect(JSON.stringify(expandChecklist(row.checklist))).toBe(JSON.stringify(evaluated));
    expect(saved.contentHash).toBe(expected);
  });

  it('when a signed revision has its checklist stored whole (as before this form), then it reads the same and verifies', async () => {
    // Arrange
    const { t } = await savedDraft();
    expect((await sign(t.author.session, t.revisionId, 'authored')).status).toBe(200);
    const compactRead = await revisionOf(t.author.session, t.revisionId);

    // Act
    await sequelize.query('UPDATE revisions SET checklist = ? WHERE id = ?', {
      replacements: [JSON.stringify(compactRead.checklist), t.revisionId],
    });
    const wholeRead = await revisionOf(t.author.session, t.revisionId);

    // Assert
    expect(JSON.parse((await storedRow(t.revisionId)).checklist)).not.toHaveProperty('storedRows');
    expect(JSON.stringify(wholeRead.checklist)).toBe(JSON.stringify(compactRead.checklist));
    expect(wholeRead.signatures.map((s: { isValid: boolean }) => s.isValid)).toEqual([true]);
    expect(compactRead.signatures.map((s: { isValid: boolean }) => s.isValid)).toEqual([true]);
  });
});
