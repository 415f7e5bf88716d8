import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { validateCalcInput, type CalcInput } from '../../shared/engine';
import { compareModels, describeDifference, type Comparison } from '../../shared/verification';
import { Finding, type IndependentModel, type Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { expandResult } from '../calcs/stored-result';
import { expandChecklist } from '../calcs/stored-checklist';
import { needOf } from './blind';
import { authorModelHash, modelContentOf, modelHashOf } from './model-hash';

type Checker = Actor & { id: number };

function validInput(text: string, whose: string): CalcInput {
  const v = validateCalcInput(JSON.parse(text));
  if (!v.ok)
    throw new AppError('validation', 400, `${whose} has input errors; fix them before locking`, {
      fieldErrors: Object.fromEntries(v.issues.map((i) => [`input.${i.path}`, [i.message]])),
    });
  return v.value;
}

/** The author's model against the checker's, within the standard's tolerances (shared/verification). */
export async function compareWithAuthor(
  sequelize: Sequelize,
  revision: Revision,
  model: IndependentModel,
  transaction: Transaction,
): Promise<Comparison> {
  const tolerances = needOf(revision).tolerances!;
  const checkerInput = validInput(model.input, 'Your independent model');
  if (!model.result || !model.checklist)
    throw new AppError(
      'validation',
      400,
      'Your independent model could not be evaluated; fix its input before locking',
      { fieldErrors: { input: ['could not be evaluated'] } },
    );
  const authorResult = await expandResult(sequelize, revision.result, transaction);
  const checker = await modelContentOf(model, transaction);
  if (!authorResult || !revision.checklist) throw AppError.conflict("The author's calc has no result to compare with");
  return compareModels(
    {
      input: validInput(revision.input, "The author's calc"),
      result: authorResult,
      checklist: expandChecklist(revision.checklist)!,
    },
    {
      input: checkerInput,
      result: checker.result!,
      checklist: checker.checklist!,
    },
    tolerances,
  );
}

/**
 * Locks the model and records the comparison: every difference becomes an open finding on its
 * row (an input difference anchored to its input) with both values, for the author to answer;
 * an agreeing comparison is recorded as such. Never changed afterwards.
 */
export async function lockAndCompare(
  sequelize: Sequelize,
  actor: Checker,
  revision: Revision,
  model: IndependentModel,
  transaction: Transaction,
): Promise<void> {
  const comparison = await compareWithAuthor(sequelize, revision, model, transaction);
  const authorHash = await authorModelHash(revision, transaction);
  if (!authorHash) throw AppError.conflict("The author's calc has no result to compare with");
  const [{ now }] = await sequelize.query<{ now: Date }>('SELECT UTC_TIMESTAMP(3) AS now', {
    type: QueryTypes.SELECT,
    transaction,
  });
  const findingIds: number[] = [];
  for (const row of comparison.rows.filter((r) => !r.agrees)) {
    const text = `Independent model differs. ${describeDifference(row)}. Answer with the reason, or correct the calc and say so.`;
    // An input difference is anchored to its input; a result or clause difference names its row in the text.
    const anchorPath = row.section === 'input' ? row.key.slice(0, 120) : null;
    const finding = await Finding.create(
      { revisionId: revision.id, clauseRef: null, anchorPath, text, raisedBy: actor.id },
      { transaction },
    );
    findingIds.push(finding.id);
  }
  await model.update(
    {
      lockedAt: new Date(now),
      modelHash: await modelHashOf(model, transaction),
      authorHash,
      comparison: JSON.stringify(comparison),
      agrees: comparison.agrees,
      findingIds: JSON.stringify(findingIds),
    },
    { transaction },
  );
  const differences = comparison.rows
    .filter((r) => !r.agrees)
    .map((r) => ({ key: r.key, author: r.author, checker: r.checker }));
  await appendAudit(
    sequelize,
    actor,
    {
      action: 'independent_model.locked',
      entityType: 'Revision',
      entityId: revision.id,
      payload: {
        calcId: revision.calcId,
        revision: revision.label,
        modelId: model.id,
        modelHash: model.modelHash,
        authorHash,
        agrees: comparison.agrees,
        compared: comparison.inputs.compared + comparison.results.compared,
        differences,
        findingIds,
      },
    },
    transaction,
  );
}
