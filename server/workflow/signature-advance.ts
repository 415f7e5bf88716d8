import { Op, type Sequelize, type Transaction } from 'sequelize';
import { SIGNATURES } from '../../shared/workflow/signatures';
import { SUPERSEDED_STATE } from '../../shared/workflow/revision-states';
import { Revision } from '../db/models';
import { appendAudit } from '../audit/audit.service';
import type { Meaning } from './independence';
import type { Signer } from './signature-record';

/** The state change and stamps a signature makes, as the workflow table gives them. */
export async function advanceBySignature(
  sequelize: Sequelize,
  revision: Revision,
  meaning: Meaning,
  signer: Signer,
  at: Date,
  transaction: Transaction,
): Promise<void> {
  const { to, stamp, supersedesOlder } = SIGNATURES[meaning];
  revision.status = to;
  revision[stamp.at] = at;
  if (stamp.by) revision[stamp.by] = signer.id;
  await revision.save({ transaction });
  if (supersedesOlder) await supersedeOlder(sequelize, revision, signer, transaction);
}

/** Approving a revision supersedes every earlier approved revision of the same calc. */
async function supersedeOlder(
  sequelize: Sequelize,
  revision: Revision,
  signer: Signer,
  transaction: Transaction,
): Promise<void> {
  const older = await Revision.findAll({
    where: { calcId: revision.calcId, status: revision.status, id: { [Op.ne]: revision.id } },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  for (const r of older) {
    r.status = SUPERSEDED_STATE;
    await r.save({ transaction });
    await appendAudit(
      sequelize,
      signer,
      {
        action: 'revision.superseded',
        entityType: 'Revision',
        entityId: r.id,
        payload: { calcId: r.calcId, revision: r.label, supersededBy: revision.label },
      },
      transaction,
    );
  }
}
