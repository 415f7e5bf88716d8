import { ROLES } from '../../../shared/authz/roles';
import { QUEUE_KEYS, QUEUE_LABELS } from '../../../shared/schemas/queue.schema';
import {
  CLOSED_STATES,
  EDITABLE_STATES,
  MEANINGS,
  QUEUES,
  RELATIONS,
  RETURNED_STATE,
  REVISION_STATES,
  SIGNATURES,
  STATE_LABELS,
  SUPERSEDED_STATE,
  WITHDRAWN_STATE,
  WORKFLOW,
  roleFor,
  statesAllowing,
  statesSignedAs,
  type RevisionState,
} from '../../../shared/workflow';

/** Where each state can lead: signatures, returning, withdrawing, and superseding a released revision. */
function nextStates(state: RevisionState): RevisionState[] {
  const turn = WORKFLOW[state].turn;
  const next: RevisionState[] = [];
  if (turn) next.push(SIGNATURES[turn.signs].to);
  if (turn?.may.includes('return')) next.push(RETURNED_STATE);
  if (turn?.may.includes('update')) next.push(WITHDRAWN_STATE);
  if (SIGNATURES.approved.to === state) next.push(SUPERSEDED_STATE);
  return next;
}

describe('the workflow table', () => {
  it('when walked from a new draft, then every state is reachable', () => {
    const seen = new Set<RevisionState>(['draft']);
    const queue: RevisionState[] = ['draft'];
    while (queue.length)
      for (const next of nextStates(queue.shift()!)) {
        if (!seen.has(next)) {
          queue.push(next);
          seen.add(next);
        }
      }
    expect([...seen].sort()).toEqual([...REVISION_STATES].sort());
  });

  it.each(REVISION_STATES)('when the state is %s, then it has a label, a badge and report words', (state) => {
    const s = WORKFLOW[state];
    expect(s.label).toMatch(/^[A-Z][a-z ]+$/);
    expect(STATE_LABELS[state]).toBe(s.label);
    expect(s.badge.glyph).toHaveLength(1);
    // Only the released revision is printed without a "not for construction" or "do not use" mark.
    expect(s.report.mark === null).toBe(state === SIGNATURES.approved.to);
    if (s.report.mark) expect(s.report.mark).toMatch(/NOT FOR CONSTRUCTION|DO NOT USE/);
  });

  it.each(REVISION_STATES.filter((s) => WORKFLOW[s].turn))(
    'when %s waits for someone, then the turn names a role, a relation and a signature',
    (state) => {
      const turn = WORKFLOW[state].turn!;
      expect(ROLES).toContain(turn.role);
      expect(RELATIONS).toContain(turn.relation);
      expect(MEANINGS).toContain(turn.signs);
      expect(turn.may).toContain('sign');
      expect(roleFor(turn.signs)).toBe(turn.role);
      expect(QUEUES.filter((q) => q.state === state)).toHaveLength(1);
    },
  );

  it('when a meaning is signed, then exactly one role signs it and it leads out of the states it is made in', () => {
    for (const meaning of MEANINGS) {
      const from = statesSignedAs(meaning);
      expect(from.length).toBeGreaterThan(0);
      expect(new Set(from.map((s) => WORKFLOW[s].turn!.role)).size).toBe(1);
      expect(from).not.toContain(SIGNATURES[meaning].to);
    }
  });

  it('when a state is editable, then its author holds it and may update it; closed states have no turn', () => {
    expect(statesAllowing('update')).toEqual(EDITABLE_STATES);
    for (const s of EDITABLE_STATES) expect(WORKFLOW[s].turn).toMatchObject({ role: 'author', relation: 'own' });
    expect(CLOSED_STATES).toEqual(['approved', 'superseded', 'withdrawn']);
    expect(REVISION_STATES.filter((s) => WORKFLOW[s].allowsNextRevision).every((s) => CLOSED_STATES.includes(s))).toBe(
      true,
    );
  });

  it('when queues are listed, then their keys are unique, labelled and in the dashboard order', () => {
    expect(QUEUE_KEYS).toEqual(['my-drafts', 'returned-to-me', 'awaiting-my-check', 'awaiting-my-approval']);
    expect(new Set(QUEUE_KEYS).size).toBe(QUEUE_KEYS.length);
    for (const key of QUEUE_KEYS) expect(QUEUE_LABELS[key]).toBeTruthy();
  });
});
