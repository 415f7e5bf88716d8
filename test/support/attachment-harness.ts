import { Revision, Attachment } from '../../server/db/models';
import { loadRevision } from '../../server/calcs/calc-access';
import { refreshAfterAttachmentChange } from '../../server/workflow/signed-content';
import { runTransaction } from '../../server/db/transaction';

type ManualRow = { requiresAttachment?: string | null };

/**
 * Gives a revision one attachment row of each kind its manual items require, so workflow tests
 * can tick them. Rows only (the bytes are not needed to tick); attachments.spec.ts tests uploads.
 * The attachment set is signed content, so the revision's hash follows it as an upload's would.
 */
export async function attachRequiredFiles(revisionId: number, manual: ManualRow[]): Promise<void> {
  const kinds = [...new Set(manual.map((m) => m.requiresAttachment).filter((k): k is Attachment['kind'] => !!k))];
  if (kinds.length === 0) return;
  const revision = await Revision.findByPk(revisionId);
  if (!revision) return;
  let added = 0;
  for (const kind of kinds) {
    if (await Attachment.count({ where: { revisionId, kind } })) continue;
    added += 1;
    await Attachment.create({
      revisionId,
      kind,
      fileName: `${kind}.pdf`,
      mediaType: 'application/pdf',
      sizeBytes: 4,
      sha256: '0'.repeat(64),
      storageKey: 'test-fixture/no-bytes',
      uploadedBy: revision.authorId,
      uploadedByName: 'test harness',
    });
  }
  if (added === 0) return;
  // Run again on a deadlock, as the product's own writes are: other spec files write beside this one.
  await runTransaction(Revision.sequelize!, async (transaction) =>
    refreshAfterAttachmentChange(await loadRevision(revisionId, transaction), transaction),
  );
}
