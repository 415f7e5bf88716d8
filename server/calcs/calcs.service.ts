import { ForbiddenError } from '@casl/ability';
import type { Sequelize, Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { CalcDto, RevisionDto } from '../../shared/schemas/calc-dto';
import type { CreateCalcRequest, SaveRevisionRequest } from '../../shared/schemas/revision.schema';
import { EDITABLE_STATES } from '../../shared/schemas/revision.schema';
import { Calc, Project, Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { loadRuleSet, parseRuleSet } from '../rule-sets/rule-set-cache';
import { REVISION_INCLUDE, toCalcDto } from './calc-mapping';
import { assertCan, attachRuleSet, loadRevision, recordEditor } from './calc-access';
import { CONTENT_FORMAT, computeRecord } from './revision-content';
import { currentHashOf, readRevision } from './revision-read';
import { jsonDiff } from './content-diff';
import { revisionLabel } from './revision-label';
import { outcomeOf } from '../../shared/schemas/outcome';
import { stringifyFinite } from '../../shared/json/finite-json';
import { assertProjectOpen } from '../projects/project-open';
import { runTransaction } from '../db/transaction';
import { compactResult, registerEngineMetadata } from './stored-result';
import { blindRevisionIds } from '../independent/blind-lists';
import { timed } from '../http/server-timing';

/** Calcs and the content of their revisions. Workflow transitions live in server/workflow. */
export class CalcsService {
  constructor(private readonly sequelize: Sequelize) {}

  async get(ability: AppAbility, id: number): Promise<CalcDto> {
    ForbiddenError.from(ability).throwUnlessCan('read', 'Calc');
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
  async latestRevision(ability: AppAbility, calcId: number): Promise<RevisionDto> {
    ForbiddenError.from(ability).throwUnlessCan('read', 'Calc');
    const latest = await Revision.findOne({ where: { calcId }, order: [['seq', 'DESC']], attributes: ['id'] });
    if (!latest) throw AppError.notFound(`Calc ${calcId}`);
    return readRevision(ability, latest.id);
  }

  async create(ability: AppAbility, actor: Actor & { id: number }, dto: CreateCalcRequest): Promise<CalcDto> {
    ForbiddenError.from(ability).setMessage('Only authors start calcs').throwUnlessCan('create', 'Calc');
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
    if (await Calc.findOne({ where: { projectId: dto.projectId, number: dto.number } })) {
      throw new AppError('conflict', 409, `Calc number ${dto.number} is already used in ${project.code}`, {
        fieldErrors: { number: ['is already used in this project'] },
      });
    }
    const computed = await computeRecord(dto.input, doc);
    await registerEngineMetadata(this.sequelize);
    const calcId = await runTransaction(this.sequelize, async (transaction) => {
      const calc = await Calc.create(
        { projectId: project.id, number: dto.number, title: dto.title, partRef: dto.partRef, createdBy: actor.id },
        { transaction },
      );
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

  /** Saves the author's input. A stale `lockVersion` is a 409 carrying the stored version, never an overwrite. */
  async save(
    ability: AppAbility,
    actor: Actor & { id: number },
    revisionId: number,
    dto: SaveRevisionRequest,
  ): Promise<RevisionDto> {
    // Before the transaction: the first call of a process writes on a connection of its own, and inside it
    // twenty saves holding every pooled connection would each wait for a twenty-first (the pool's time-out).
    await registerEngineMetadata(this.sequelize);
    await runTransaction(
      this.sequelize,
      async (transaction, attempt) => {
        const revision = await timed('lock', () => loadRevision(revisionId, transaction));
        // A run after a COMMIT whose answer was lost: this exact save is already stored.
        if (attempt > 1 && revision.lockVersion === dto.lockVersion + 1 && revision.input === JSON.stringify(dto.input))
          return;
        // Checked after the replay above (not by loadRevisionForChange): a replayed save answers as the first did.
        const projectId = await assertProjectOpen(revision.calcId, transaction);
        if (!EDITABLE_STATES.includes(revision.status)) {
          throw new AppError(
            'read_only',
            409,
            `Revision ${revision.label} is ${revision.status.replace('_', ' ')} and cannot be edited; start a new revision to change it`,
          );
        }
        assertCan(ability, 'update', revision, 'Only the author of this revision can edit it');
        if (revision.lockVersion !== dto.lockVersion) {
          const current = await readRevision(ability, revisionId, transaction);
          throw new AppError('conflict', 409, 'This revision was saved elsewhere since you opened it', { current });
        }
        const ruleSetId = dto.ruleSetId ?? revision.ruleSetId;
        // The revision's own standard came with it (document and version included): read again only to switch.
        const { record, doc } =
          ruleSetId === revision.ruleSetId && revision.ruleSet
            ? { record: revision.ruleSet, doc: parseRuleSet(revision.ruleSet) }
            : await loadRuleSet(ruleSetId, transaction);
        if (ruleSetId !== revision.ruleSetId && record.status !== 'effective') {
          throw new AppError('validation', 400, 'Only an effective standard can be chosen', {
            fieldErrors: { ruleSetId: ['is not an effective version'] },
          });
        }
        const computed = await timed('engine', () => computeRecord(dto.input, doc));
        const diff = jsonDiff(
          JSON.parse(revision.input),
          dto.input,
          `${revision.label}@${revision.lockVersion}`,
          `${revision.label}@${revision.lockVersion + 1}`,
        );
        revision.set({
          input: JSON.stringify(dto.input),
          ruleSetId,
          lockVersion: revision.lockVersion + 1,
          ...stored(computed),
        });
        // The hash is taken from the values about to be stored, so the row is written once: each
        // write of a revision also runs the summary and search-term triggers of its calc.
        if (ruleSetId !== revision.ruleSet?.id) attachRuleSet(revision, record);
        await registerEngineMetadata(this.sequelize);
        revision.contentFormat = CONTENT_FORMAT;
        revision.contentHash = await timed('digest', () => currentHashOf(revision, transaction));
        await timed('write', () => revision.save({ transaction }));
        await timed('editor', () => recordEditor(revision.calcId, actor.id, transaction));
        await timed('audit', () =>
          appendAudit(
            this.sequelize,
            actor,
            {
              action: 'revision.saved',
              entityType: 'Revision',
              entityId: revision.id,
              payload: {
                calcId: revision.calcId,
                revision: revision.label,
                lockVersion: revision.lockVersion,
                verdict: revision.verdict,
                ruleSet: `${record.code} v${record.version}`,
              },
              diff,
              scope: { calcId: revision.calcId, projectId: projectId ?? null },
            },
            transaction,
          ),
        );
      },
      { idempotent: true },
    );
    return timed('answer', () => readRevision(ability, revisionId));
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

export function stored(c: Awaited<ReturnType<typeof computeRecord>>) {
  return {
    result: compactResult(c.result),
    checklist: c.checklist ? stringifyFinite(c.checklist) : null,
    verdict: c.verdict,
    outcome: JSON.stringify(outcomeOf(c.checklist)),
  };
}
