import { UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { CalcDto, RevisionDto } from '../../shared/schemas/calc-dto';
import type { CreateCalcRequest, SaveRevisionRequest } from '../../shared/schemas/revision.schema';
import { Calc, Project, Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { loadRuleSet } from '../rule-sets/rule-set-cache';
import { REVISION_INCLUDE, toCalcDto } from './calc-mapping';
import { recordEditor } from './calc-access';
import { CONTENT_FORMAT, computeRecord } from './revision-content';
import { currentHashOf, readRevision } from './revision-read';
import { saveRevision, stored } from './revision-save';
import { revisionLabel } from './revision-label';
import { runTransaction } from '../db/transaction';
import { registerEngineMetadata } from './stored-result';
import { blindRevisionIds } from '../independent/blind-lists';
import type { RevisionForm } from '../../shared/schemas/revision-form';
import { forbiddenCheck } from '../authz/forbidden-check';

// A save's stored columns: scripts and specs import them from here.
export { stored } from './revision-save';

/** Calcs and the content of their revisions. Workflow transitions live in server/workflow. */
export class CalcsService {
  constructor(private readonly sequelize: Sequelize) {}

  async get(ability: AppAbility, id: number): Promise<CalcDto> {
    forbiddenCheck(ability).throwUnlessCan('read', 'Calc');
    const calc = await Calc.findByPk(id, { include: [Project] });
    if (!calc) throw AppError.notFound(`Calc ${id}`);
    // The history lists revisions: their input, result and checklist texts stay in the database.
    const revisions = await Revision.findAll({
      where: { calcId: id },
      attributes: { exclude: ['input', 'result', 'checklist', 'manualItems', 'outcome'] },
      include: REVISION_INCLUDE.map((i) =>
        i.as === 'ruleSet' ? { ...i, attributes: ['id', 'code', 'version', 'title'] } : i,
      ),
    });
    const blind = await blindRevisionIds(
      ability,
      revisions.map((r) => ({ revisionId: r.id, ruleSetId: r.ruleSetId, authorId: r.authorId, status: r.status })),
    );
    for (const r of revisions) if (blind.has(r.id)) r.verdict = null; // shown only, never saved
    return toCalcDto(calc, revisions);
  }

  /**
   * The calc's newest revision, read as `GET /api/revisions/:id` reads it: the calc page asks for it beside the
   * calc instead of after it, so the two reads no longer wait for each other.
   */
  async latestRevision(ability: AppAbility, calcId: number, form: RevisionForm = 'full'): Promise<RevisionDto> {
    forbiddenCheck(ability).throwUnlessCan('read', 'Calc');
    const latest = await Revision.findOne({ where: { calcId }, order: [['seq', 'DESC']], attributes: ['id'] });
    if (!latest) throw AppError.notFound(`Calc ${calcId}`);
    return readRevision(ability, latest.id, undefined, undefined, form);
  }

  async create(ability: AppAbility, actor: Actor & { id: number }, dto: CreateCalcRequest): Promise<CalcDto> {
    forbiddenCheck(ability).setMessage('Only authors start calcs').throwUnlessCan('create', 'Calc');
    const project = await Project.findByPk(dto.projectId);
    if (!project || project.status !== 'active') {
      throw new AppError('validation', 400, 'Choose an active project', {
        fieldErrors: { projectId: [project ? 'is archived' : 'does not exist'] },
      });
    }
    const { record, doc } = await loadRuleSet(dto.ruleSetId);
    if (record.status !== 'effective') {
      throw new AppError('validation', 400, `${record.code} v${record.version} is not in effect`, {
        fieldErrors: { ruleSetId: ['is not an effective version'] },
      });
    }
    const numberTaken = () =>
      new AppError('conflict', 409, `Calc number ${dto.number} is already used in ${project.code}`, {
        fieldErrors: { number: ['is already used in this project'] },
      });
    if (await Calc.findOne({ where: { projectId: dto.projectId, number: dto.number } })) throw numberTaken();
    const computed = await computeRecord(dto.input, doc);
    await registerEngineMetadata(this.sequelize);
    const calcId = await runTransaction(this.sequelize, async (transaction) => {
      // The check above reads outside the transaction: a create racing this one, or one committed on another
      // database node whose write this node has not applied yet (a failover), is found by the unique key instead.
      const calc = await Calc.create(
        { projectId: project.id, number: dto.number, title: dto.title, partRef: dto.partRef, createdBy: actor.id },
        { transaction },
      ).catch((err: unknown) => {
        throw err instanceof UniqueConstraintError ? numberTaken() : err;
      });
      const revision = await Revision.create(
        {
          calcId: calc.id,
          seq: 0,
          label: revisionLabel(project.revisionScheme, 0),
          authorId: actor.id,
          ruleSetId: record.id,
          input: JSON.stringify(dto.input),
          reasonForChange: 'First issue',
          manualItems: '{}',
          ...stored(computed),
        },
        { transaction },
      );
      await this.refreshHash(revision, transaction);
      await recordEditor(calc.id, actor.id, transaction);
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'calc.created',
          entityType: 'Calc',
          entityId: calc.id,
          payload: {
            project: project.code,
            number: dto.number,
            title: dto.title,
            revision: revision.label,
            ruleSet: `${record.code} v${record.version}`,
          },
        },
        transaction,
      );
      return calc.id;
    });
    return this.get(ability, calcId);
  }

  /**
   * Saves the author's input. A stale `lockVersion` is a 409 carrying the stored version, never an overwrite. The
   * answer is the revision as saved, in the form asked for (the browser's: result and checklist as stored).
   */
  save(
    ability: AppAbility,
    actor: Actor & { id: number },
    revisionId: number,
    dto: SaveRevisionRequest,
    form: RevisionForm = 'full',
  ) {
    return saveRevision(this.sequelize, ability, actor, revisionId, dto, form);
  }

  async refreshHash(revision: Revision, transaction: Transaction): Promise<void> {
    if (!revision.ruleSet) await revision.reload({ include: REVISION_INCLUDE, transaction });
    await registerEngineMetadata(this.sequelize);
    // Any edit moves a revision to the current content format (attachments included).
    revision.contentFormat = CONTENT_FORMAT;
    revision.contentHash = await currentHashOf(revision, transaction);
    await revision.save({ transaction });
  }
}
