import type { Sequelize, Transaction } from 'sequelize';
import type { SignRequest } from '../../shared/schemas/revision.schema';
import { Finding, User, type Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit } from '../audit/audit.service';
import { verifyPassword } from '../auth/password';
import { secondFactorRefusal } from '../auth/second-factor';
import { editorIdsOf } from '../calcs/calc-access';
import { expandChecklist } from '../calcs/stored-checklist';
import { parseRuleSet } from '../rule-sets/rule-set-cache';
import { independentModelBlockerFor } from '../independent/signing-blocker';
import { signingBlocker, type Meaning } from './independence';
import type { Signer } from './signature-record';

/**
 * Refuses a signature the workflow table does not allow: wrong state or person, open findings or manual items,
 * rows that could not be evaluated, an independent model not yet agreed. 403 with the reason in words.
 */
export async function assertMaySign(
  meaning: Meaning,
  signer: Signer,
  revision: Revision,
  transaction?: Transaction,
): Promise<void> {
  const findings = await Finding.findAll({ where: { revisionId: revision.id }, transaction });
  const manual = JSON.parse(revision.manualItems) as Record<string, { done: boolean }>;
  const items = revision.ruleSet ? (parseRuleSet(revision.ruleSet).manualItems ?? []) : [];
  const blocker = signingBlocker(meaning, {
    actor: signer,
    revision: {
      status: revision.status,
      authorId: revision.authorId,
      checkerId: revision.checkerId,
      hasResult: revision.result !== null,
      verdict: revision.verdict,
      errorRows: errorRowsOf(revision.checklist),
    },
    editorIds: await editorIdsOf(revision.calcId, transaction),
    openFindings: findings.filter((f) => f.status === 'open').length,
    unresolvedFindings: findings.filter((f) => f.status !== 'closed').length,
    openManualItems: items.filter((i) => !manual[i.id]?.done).length,
  });
  const modelBlocker = blocker ?? (await independentModelBlockerFor(meaning, signer.id, revision, transaction));
  if (modelBlocker) throw new AppError('forbidden', 403, modelBlocker);
}

/**
 * The signer's password (and one-time code where enrolled). A refusal is an audit entry of its own, outside the
 * signature's transaction, so review-health can count refused attempts even though nothing was signed.
 */
export async function checkSigningPassword(
  sequelize: Sequelize,
  signer: Signer,
  revisionId: number,
  dto: SignRequest,
): Promise<void> {
  const user = await User.scope('withPassword').findByPk(signer.id);
  const passwordRight = user !== null && (await verifyPassword(user.passwordHash, dto.password));
  const refusal = passwordRight ? secondFactorRefusal(user, dto.oneTimeCode) : null;
  if (passwordRight && !refusal) return;
  await appendAudit(sequelize, signer, {
    action: 'revision.signature_refused',
    entityType: 'Revision',
    entityId: revisionId,
    payload: { meaning: dto.meaning, reason: refusal ? refusal.reason : 'wrong password' },
  });
  if (refusal) throw refusal.error;
  throw new AppError('validation', 400, 'Password is not correct; nothing was signed', {
    fieldErrors: { password: ['is not correct'] },
  });
}

/** Rows that could not be evaluated; a stored checklist that cannot be read counts as one. */
function errorRowsOf(checklist: string | null): number {
  if (checklist === null) return 0;
  try {
    const rows = (expandChecklist(checklist) as { rows?: { status?: unknown }[] }).rows;
    return Array.isArray(rows) ? rows.filter((r) => r?.status === 'error').length : 1;
  } catch {
    return 1;
  }
}
