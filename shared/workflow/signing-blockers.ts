import type { Role } from '../authz/roles';
import { RELATION } from './relations';
import { MEANINGS, type Meaning, type RevisionState } from './revision-states';
import { roleFor, statesSignedAs } from './signatures';

/** What the revision shows about its content; the client can read all of it from the revision it has. */
export interface ContentFacts {
  revision: {
    status: RevisionState;
    authorId: number;
    checkerId: number | null;
    hasResult: boolean;
    verdict: string | null;
    errorRows: number;
  };
  openFindings: number;
  unresolvedFindings: number;
  openManualItems: number;
}

export interface SigningContext extends ContentFacts {
  actor: { id: number; roles: readonly Role[] };
  editorIds: readonly number[];
}

/**
 * One reason a signature is refused. `gate` entries are about who signs and when (the client's
 * buttons already follow them: see revision-actions.ts); `content` entries are about the revision
 * and are shown to the signer before any password is asked for. `hidesAction`: while it blocks,
 * the client does not offer the signature at all (rather than explaining in the dialog).
 */
export interface SigningBlocker {
  id: string;
  meanings: readonly Meaning[];
  kind: 'gate' | 'content';
  hidesAction: boolean;
  blocks(c: SigningContext, meaning: Meaning): string | null;
}

const REVIEW: readonly Meaning[] = ['checked', 'approved'];
const gate = (id: string, meanings: readonly Meaning[], blocks: SigningBlocker['blocks']): SigningBlocker => ({
  id,
  meanings,
  kind: 'gate',
  hidesAction: true,
  blocks,
});
const content = (
  id: string,
  meanings: readonly Meaning[],
  hidesAction: boolean,
  blocks: SigningBlocker['blocks'],
): SigningBlocker => ({ id, meanings, kind: 'content', hidesAction, blocks });

/**
 * Separation of duties, enforced on the server whatever the client shows: nobody checks or
 * approves a calc they ever edited, a checker never approves what they checked, and a signature is
 * always the signer's own. The server refuses with the first entry that blocks, in this order.
 */
export const SIGNING_BLOCKERS: readonly SigningBlocker[] = [
  gate('role', MEANINGS, (c, m) =>
    c.actor.roles.includes(roleFor(m)) ? null : `Signing as ${m} needs the ${roleFor(m)} role`,
  ),
  gate('state', MEANINGS, ({ revision: r }, m) =>
    statesSignedAs(m).includes(r.status) ? null : `A ${r.status.replace('_', ' ')} revision cannot be signed as ${m}`,
  ),
  // Whatever its severity, a row that could not be evaluated is a check nobody has made.
  content('unevaluated-rows', MEANINGS, true, ({ revision: r }) =>
    r.errorRows > 0
      ? `${r.errorRows} checklist row(s) could not be evaluated; nobody can sign this revision until every row has a result`
      : null,
  ),
  gate('own-work', ['authored'], (c) =>
    c.actor.id === c.revision.authorId ? null : 'Only the author of this revision can sign it as authored',
  ),
  content('no-result', ['authored'], true, (c) =>
    c.revision.hasResult ? null : 'The calc has input errors; fix them before submitting',
  ),
  content('answer-findings', ['authored'], true, (c) =>
    c.openFindings > 0 ? `Answer the ${c.openFindings} open finding(s) before resubmitting` : null,
  ),
  gate('independence', REVIEW, (c, m) =>
    RELATION.independent.holds(c.actor.id, partiesOf(c))
      ? null
      : `You edited this calc, so you cannot sign it as ${m}; independence requires someone else`,
  ),
  // A calc that fails a mandatory clause goes back to its author; nobody vouches for it.
  content('verdict', REVIEW, true, ({ revision: r }, m) =>
    r.verdict === 'compliant'
      ? null
      : `The calc does not meet its standard (${r.verdict ?? 'not evaluated'}); return it to the author instead of signing it as ${m}`,
  ),
  content('manual-items', ['checked'], false, (c) =>
    c.openManualItems > 0 ? `Tick the ${c.openManualItems} open manual checklist item(s) first` : null,
  ),
  content('open-findings', ['checked'], false, (c) =>
    c.openFindings > 0 ? 'Open findings remain: return the calc to its author instead' : null,
  ),
  gate('not-own-check', ['approved'], (c) =>
    c.actor.id === c.revision.checkerId ? 'You checked this revision, so you cannot also approve it' : null,
  ),
  content('unresolved-findings', ['approved'], true, (c) =>
    c.unresolvedFindings > 0 ? `Approval is refused while ${c.unresolvedFindings} finding(s) are not closed` : null,
  ),
];

function partiesOf(c: SigningContext) {
  return { authorId: c.revision.authorId, checkerId: c.revision.checkerId, editorIds: c.editorIds };
}

/** Every reason that applies, in order; pass `kind` to ask only about the content. */
export function signingBlockers(
  meaning: Meaning,
  c: SigningContext,
  kind?: SigningBlocker['kind'],
): { blocker: SigningBlocker; message: string }[] {
  return SIGNING_BLOCKERS.filter((b) => b.meanings.includes(meaning) && (!kind || b.kind === kind))
    .map((blocker) => ({ blocker, message: blocker.blocks(c, meaning) }))
    .filter((x): x is { blocker: SigningBlocker; message: string } => x.message !== null);
}

/** Why this person may not sign with this meaning now, or null when they may: the server's answer. */
export function signingBlocker(meaning: Meaning, c: SigningContext): string | null {
  return signingBlockers(meaning, c)[0]?.message ?? null;
}
