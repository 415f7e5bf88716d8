import { Op } from 'sequelize';
import { CAUTION } from '../../shared/engine';
import type { VerifiedRevision, VerifyResult } from '../../shared/schemas/verify.schema';
import { Calc, Project, Revision, Signature } from '../db/models';
import { REVISION_INCLUDE } from '../calcs/calc-mapping';
import { currentHashesOf } from '../calcs/revision-read';

type Match = VerifiedRevision['match'];

async function describe(revision: Revision, hash: string, match: Match): Promise<VerifiedRevision> {
  const [calc, signatures] = await Promise.all([
    Calc.findByPk(revision.calcId, { include: [Project] }) as Promise<Calc & { Project: Project }>,
    Signature.findAll({ where: { revisionId: revision.id }, order: [['signedAt', 'ASC']] }),
  ]);
  const hashes = await currentHashesOf(revision, signatures);
  const recomputed = hashes.get(revision.contentFormat ?? 1) ?? null;
  return {
    calcId: calc.id,
    revisionId: revision.id,
    projectCode: calc.Project.code,
    calcNumber: calc.number,
    calcTitle: calc.title,
    revision: revision.label,
    state: revision.status,
    verdict: revision.verdict,
    ruleSet: revision.ruleSet ? `${revision.ruleSet.code} v${revision.ruleSet.version}` : '',
    match,
    contentIntact: recomputed !== null && recomputed === revision.contentHash,
    signatures: signatures.map((s) => ({
      printedName: s.printedName,
      role: s.role,
      meaning: s.meaning,
      signedAt: s.signedAt.toISOString(),
      isValid: hashes.get(s.contentFormat ?? 1) === s.contentHash,
      coversThisHash: s.contentHash === hash,
    })),
  };
}

function summary(matches: VerifiedRevision[]): string {
  if (matches.length === 0)
    return 'No revision on record has this hash: the document was not produced from this record, or it was altered.';
  const m = matches[0];
  const what = `${m.projectCode} ${m.calcNumber} rev ${m.revision} (${m.state.replace('_', ' ')})`;
  if (!m.contentIntact)
    return `The hash belongs to ${what}, but the stored content no longer hashes to it: compliance should investigate.`;
  if (m.match === 'earlier')
    return `The hash was signed on ${what}, whose content has changed since; the document shows an earlier state.`;
  const valid = m.signatures.filter((s) => s.isValid).map((s) => s.meaning);
  return `The hash matches ${what} as stored now${valid.length ? `; valid signatures: ${valid.join(', ')}` : '; not signed yet'}.`;
}

/**
 * Looks a record hash up: revisions whose content hashes to it now, and revisions where it was
 * signed before the content changed. Open to anyone signed in: it reveals only what a printed
 * report already shows, and lets a reader of a paper copy trust (or distrust) it.
 */
export async function verifyRecordHash(hash: string): Promise<VerifyResult> {
  const current = await Revision.findAll({
    where: { contentHash: hash },
    include: REVISION_INCLUDE,
    order: [['id', 'ASC']],
  });
  const signedIds = (await Signature.findAll({ where: { contentHash: hash }, attributes: ['revisionId'] })).map(
    (s) => s.revisionId,
  );
  const earlierIds = [...new Set(signedIds)].filter((id) => !current.some((r) => r.id === id));
  const earlier = earlierIds.length
    ? await Revision.findAll({
        where: { id: { [Op.in]: earlierIds } },
        include: REVISION_INCLUDE,
        order: [['id', 'ASC']],
      })
    : [];
  const matches = [
    ...(await Promise.all(current.map((r) => describe(r, hash, 'current')))),
    ...(await Promise.all(earlier.map((r) => describe(r, hash, 'earlier')))),
  ];
  return { hash, found: matches.length > 0, matches, message: summary(matches), caution: CAUTION };
}
