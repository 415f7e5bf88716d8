import type { AbilityBuilder } from '@casl/ability';
import type { AbilityUser, AppAbility } from '../authz/app-ability';
import type { Role } from '../authz/roles';
import { RELATION } from './relations';
import { REVISION_STATES, WORKFLOW, type RevisionState, type Turn } from './revision-states';

/**
 * The Revision rules of one role, read from the workflow table: one rule per kind of turn the role
 * holds, for the states it holds it in. CASL sees only what a revision row carries (author,
 * checker); earlier editors are checked by the signing blockers and the client's relation check.
 */
export function defineWorkflowRules(role: Role, user: AbilityUser, can: AbilityBuilder<AppAbility>['can']): void {
  const byTurn = new Map<string, { turn: Turn; states: RevisionState[] }>();
  for (const state of REVISION_STATES) {
    const turn = WORKFLOW[state].turn;
    if (turn?.role !== role) continue;
    const key = `${turn.relation}|${turn.may.join()}`;
    const group = byTurn.get(key) ?? { turn, states: [] };
    group.states.push(state);
    byTurn.set(key, group);
  }
  for (const { turn, states } of byTurn.values()) {
    const status = states.length === 1 ? states[0] : { $in: states };
    can([...turn.may], 'Revision', { ...RELATION[turn.relation].conditions(user.id), status });
  }
}
