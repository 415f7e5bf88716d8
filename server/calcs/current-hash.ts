import type { Transaction } from 'sequelize';
import { Attachment, Calc, Project, Revision, type Signature } from '../db/models';
import { contentHashOf, hashedContentOf, signedAttachments } from './revision-content';
import { contentKeyOf, memoisedHash } from './content-hash-memo';
import { expandResult } from './stored-result';
import { expandChecklist } from './stored-checklist';
import { lockedModelOf } from '../independent/signed-model';

/** What a revision's content hash covers besides the row itself, read once for every format asked. */
export interface HashSources {
  /** Its number, title, part reference and project code (the hash reads no more of them). */
  calc: Calc & { Project: Project };
  /** The expanded result: expanded only when a hash is computed afresh (not remembered), and then once. */
  expanded: () => Promise<unknown>;
  attachments: Attachment[];
  model: Awaited<ReturnType<typeof lockedModelOf>>;
}

async function hashSourcesOf(
  revision: Revision,
  transaction: Transaction | undefined,
  result: unknown,
  maxFormat: number,
  known: Partial<HashSources> = {},
): Promise<HashSources> {
  const [calc, attachments, model] = await Promise.all([
    known.calc ??
      (Calc.findByPk(revision.calcId, {
        include: [Project],
        attributes: ['id', 'number', 'title', 'partRef', 'projectId'],
        transaction,
      }) as Promise<HashSources['calc']>),
    maxFormat < 2 ? [] : (known.attachments ?? Attachment.findAll({ where: { revisionId: revision.id }, transaction })),
    maxFormat < 3 ? null : known.model !== undefined ? known.model : lockedModelOf(revision.id, transaction),
  ]);
  let expanding: Promise<unknown> | undefined;
  const expanded = () =>
    (expanding ??= result ? Promise.resolve(result) : expandResult(Revision.sequelize!, revision.result, transaction));
  return { calc, expanded, attachments, model };
}

/** The hash in one format: that format's own share of the sources (attachments from 2, the locked model from 3). */
async function hashInFormat(revision: Revision, sources: HashSources, format: number): Promise<string> {
  const { calc } = sources;
  const attachments = format >= 2 ? sources.attachments : [];
  const model = format >= 3 ? sources.model : null;
  const key = contentKeyOf([
    format,
    ...[calc.Project.code, calc.number, calc.title, calc.partRef, revision.label],
    ...[revision.input, revision.result, revision.checklist],
    ...[revision.ruleSet?.code, revision.ruleSet?.version, revision.ruleSet?.contentHash],
    JSON.stringify(signedAttachments(attachments)),
    JSON.stringify(model),
  ]);
  return memoisedHash(key, async () =>
    contentHashOf(
      hashedContentOf(
        calc,
        revision.label,
        JSON.parse(revision.input),
        await sources.expanded(),
        expandChecklist(revision.checklist),
        revision.ruleSet,
        format,
        attachments,
        model,
      ),
    ),
  );
}

/**
 * Recomputes the content hash from what is stored now, so tampering shows as a broken signature.
 * The hash covers the result as the engine returned it, with its units and formulas put back, and
 * (format 2, the default for the revision's own format) the attachment set as stored now. A caller that has
 * just read the calc with its project (a save) passes it in `known`, so it is not read again, and so are the
 * attachments when it knows there are none.
 */
export async function currentHashOf(
  revision: Revision,
  transaction?: Transaction,
  result?: unknown,
  format = revision.contentFormat ?? 1,
  known?: Partial<Pick<HashSources, 'calc' | 'attachments'>>,
): Promise<string | null> {
  if (!revision.result || !revision.checklist) return null;
  return hashInFormat(revision, await hashSourcesOf(revision, transaction, result, format, known), format);
}

/**
 * The current hash in every format a signature of this revision was made in, so each signature
 * is judged by the content it covered: tampering or a changed attachment set shows as broken.
 * `withOwnFormat: false` leaves out the revision's own format when no signature needs it (a plain
 * read of an unsigned revision then reads and hashes nothing: only signatures are judged by it).
 * What the formats share (the calc, its attachments, the locked model) is read once, or not at all when the caller
 * knows it (`known`: a plain read knows the calc, and that there are no attachments or no model when there are none).
 */
export async function currentHashesOf(
  revision: Revision,
  signatures: readonly Signature[],
  transaction?: Transaction,
  result?: unknown,
  withOwnFormat = true,
  known: Partial<HashSources> = {},
): Promise<Map<number, string | null>> {
  const own = withOwnFormat ? [revision.contentFormat ?? 1] : [];
  const formats = [...new Set([...own, ...signatures.map((s) => s.contentFormat ?? 1)])];
  const hashes = new Map<number, string | null>();
  if (!formats.length) return hashes;
  if (!revision.result || !revision.checklist) return new Map(formats.map((f) => [f, null]));
  const sources = await hashSourcesOf(revision, transaction, result, Math.max(...formats), known);
  for (const f of formats) hashes.set(f, await hashInFormat(revision, sources, f));
  return hashes;
}
