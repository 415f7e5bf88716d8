import type { Sequelize, Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { IndependentModelDto } from '../../shared/schemas/independent-model.schema';
import { IndependentModel, Revision, User } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { loadRevision } from '../calcs/calc-access';
import { computeRecord } from '../calcs/revision-content';
import { compactResult, registerEngineMetadata } from '../calcs/stored-result';
import { compactChecklist } from '../calcs/stored-checklist';
import { parseRuleSet } from '../rule-sets/rule-set-cache';
import { assertProjectOpen } from '../projects/project-open';
import { runTransaction } from '../db/transaction';
import { isBlind, modelOfRevision, needOf } from './blind';
import { viewerOf } from './viewer';
import { toModelDto } from './model-dto';
import { assertModelReader, assertModelWriter } from './model-rules';
import { lockAndCompare } from './model-lock';
import { forbiddenCheck } from '../authz/forbidden-check';

type Checker = Actor & { id: number };

const nameOf = async (id: number, transaction?: Transaction) =>
  (await User.findByPk(id, { attributes: ['displayName'], transaction }))?.displayName ?? 'unknown';

/** The checker's independent model of a revision: read, save (autosave like the author's editor), lock. */
export class IndependentModelService {
  constructor(private readonly sequelize: Sequelize) {}

  async read(ability: AppAbility, revisionId: number): Promise<IndependentModelDto> {
    const revision = await loadRevision(revisionId);
    forbiddenCheck(ability).throwUnlessCan('read', 'Revision');
    const model = await modelOfRevision(revisionId);
    if (!model) throw AppError.notFound(`The independent model of revision ${revision.label}`);
    const viewer = viewerOf(ability);
    assertModelReader(viewer.id, isBlind(viewer, revision, needOf(revision), model), model);
    return toModelDto(model, await nameOf(model.checkerId));
  }

  async save(
    ability: AppAbility,
    actor: Checker,
    revisionId: number,
    input: Record<string, unknown>,
    lockVersion: number,
  ): Promise<IndependentModelDto> {
    // The result is stored without the engine version's units and formulas (as a revision's is): they are
    // recorded first, outside the transaction (server/calcs/revision-save.ts says why).
    await registerEngineMetadata(this.sequelize);
    const id = await runTransaction(this.sequelize, async (transaction) => {
      const revision = await loadRevision(revisionId, transaction);
      await assertProjectOpen(revision.calcId, transaction);
      const model = await IndependentModel.findOne({
        where: { revisionId },
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      await assertModelWriter(ability, actor, revision, model, transaction);
      if ((model?.lockVersion ?? 0) !== lockVersion)
        throw AppError.conflict('The independent model changed since you opened it (another tab?); reload it');
      const record = await computeRecord(input, parseRuleSet(revision.ruleSet!));
      const values = {
        input: JSON.stringify(input),
        result: compactResult(record.result),
        checklist: compactChecklist(record.checklist),
        verdict: record.verdict,
      };
      const saved = model
        ? await model.update({ ...values, lockVersion: model.lockVersion + 1 }, { transaction })
        : await IndependentModel.create(
            { revisionId, checkerId: actor.id, ...values, lockVersion: 1 },
            { transaction },
          );
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: model ? 'independent_model.saved' : 'independent_model.started',
          entityType: 'Revision',
          entityId: revisionId,
          payload: {
            calcId: revision.calcId,
            revision: revision.label,
            modelId: saved.id,
            lockVersion: saved.lockVersion,
            verdict: record.verdict,
          },
        },
        transaction,
      );
      return saved.id;
    });
    return this.readOwn(id);
  }

  async lock(
    ability: AppAbility,
    actor: Checker,
    revisionId: number,
    lockVersion: number,
  ): Promise<IndependentModelDto> {
    const id = await runTransaction(this.sequelize, async (transaction) => {
      const revision = await loadRevision(revisionId, transaction);
      await assertProjectOpen(revision.calcId, transaction);
      const model = await IndependentModel.findOne({
        where: { revisionId },
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      if (!model) throw AppError.notFound(`The independent model of revision ${revision.label}`);
      await assertModelWriter(ability, actor, revision, model, transaction);
      if (model.lockVersion !== lockVersion)
        throw AppError.conflict('The independent model changed since you opened it; reload it before locking');
      await lockAndCompare(this.sequelize, actor, revision as Revision, model, transaction);
      return model.id;
    });
    return this.readOwn(id);
  }

  private async readOwn(id: number): Promise<IndependentModelDto> {
    const model = (await IndependentModel.findByPk(id))!;
    return toModelDto(model, await nameOf(model.checkerId));
  }
}
