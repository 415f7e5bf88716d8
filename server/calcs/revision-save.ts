import type { Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import type { SaveRevisionRequest } from '../../shared/schemas/revision.schema';
import { EDITABLE_STATES } from '../../shared/schemas/revision.schema';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { loadRuleSet, parseRuleSet } from '../rule-sets/rule-set-cache';
import { assertCan, attachRuleSet, recordEditor } from './calc-access';
import { CONTENT_FORMAT, computeRecord } from './revision-content';
import { currentHashOf, readRevision } from './revision-read';
import { jsonDiff } from './content-diff';
import { outcomeOf } from '../../shared/schemas/outcome';
import { runTransaction } from '../db/transaction';
import { compactResult, expandResult, registerEngineMetadata } from './stored-result';
import { compactChecklist } from './stored-checklist';
import { lockWithContext, withEditor, withStoredResult } from './save-context';
import { assertOpen } from '../projects/project-open';
import { rememberValidation } from './content-hash-memo';
import { timed } from '../http/server-timing';
import { plainUpdate } from '../db/plain-update';
import type { RevisionForm } from '../../shared/schemas/revision-form';

/** Saves the author's input. A stale `lockVersion` is a 409 carrying the stored version, never an overwrite. */
export async function saveRevision(
  sequelize: Sequelize,
  ability: AppAbility,
  actor: Actor & { id: number },
  revisionId: number,
  dto: SaveRevisionRequest,
  form: RevisionForm = 'full',
): Promise<RevisionDto> {
  // Before the transaction: the first call of a process writes on a connection of its own, and inside it
  // twenty saves holding every pooled connection would each wait for a twenty-first (the pool's time-out).
  await registerEngineMetadata(sequelize);
  const inputText = JSON.stringify(dto.input);
  const saved = await runTransaction(
    sequelize,
    async (transaction, attempt) => {
      const { revision, context } = await timed('lock', () => lockWithContext(revisionId, actor.id, transaction));
      // A run after a COMMIT whose answer was lost: this exact save is already stored.
      if (attempt > 1 && revision.lockVersion === dto.lockVersion + 1 && revision.input === inputText) {
        const result = await expandResult(
          sequelize,
          (await withStoredResult(revision, transaction)).result,
          transaction,
        );
        return { revision, result, editorIds: context.editorIds, has: context.has };
      }
      // Checked after the replay above (not by loadRevisionForChange): a replayed save answers as the first did.
      const projectId = assertOpen(context.project);
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
      // The answer names the input's issues: the engine run has just validated this very text.
      rememberValidation(inputText, computed.schemaIssues);
      const diff = jsonDiff(
        JSON.parse(revision.input),
        dto.input,
        `${revision.label}@${revision.lockVersion}`,
        `${revision.label}@${revision.lockVersion + 1}`,
      );
      revision.set({
        input: inputText,
        ruleSetId,
        lockVersion: revision.lockVersion + 1,
        ...stored(computed),
      });
      // The hash is taken from the values about to be stored, so the row is written once: each
      // write of a revision also runs the summary and search-term triggers of its calc.
      if (ruleSetId !== revision.ruleSet?.id) attachRuleSet(revision, record);
      await registerEngineMetadata(sequelize);
      revision.contentFormat = CONTENT_FORMAT;
      // Expanded once: the hash covers it and the answer shows it.
      const result = await expandResult(sequelize, revision.result, transaction);
      revision.contentHash = await timed('digest', () =>
        currentHashOf(revision, transaction, result, CONTENT_FORMAT, {
          calc: context.calc,
          attachments: context.has.attachments ? undefined : [],
        }),
      );
      await timed('write', () => plainUpdate(revision, transaction));
      if (!context.edited) await timed('editor', () => recordEditor(revision.calcId, actor.id, transaction));
      const editorIds = context.edited ? context.editorIds : withEditor(context.editorIds, actor.id);
      await timed('audit', () =>
        appendAudit(
          sequelize,
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
            commits: true,
          },
          transaction,
        ),
      );
      return { revision, result, editorIds, has: context.has, written: true };
    },
    { idempotent: true },
  );
  // The row as written (the save holds it with its standard, people and editors): the answer reads only what hangs
  // off the revision (signatures, findings, the independent model).
  return timed('answer', () => readRevision(ability, revisionId, undefined, saved, form));
}

export function stored(c: Awaited<ReturnType<typeof computeRecord>>) {
  return {
    result: compactResult(c.result),
    checklist: compactChecklist(c.checklist),
    verdict: c.verdict,
    outcome: JSON.stringify(outcomeOf(c.checklist)),
  };
}
