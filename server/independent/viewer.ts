import { subject } from '@casl/ability';
import type { AppAbility } from '../../shared/authz/app-ability';

export interface Viewer {
  id: number | null;
  mayCheck: boolean;
}

/**
 * Who reads, from the ability alone, so every existing read path (which passes only the ability)
 * can apply the blind rule without new parameters: the person's id is the one condition of their
 * own "change password" rule, and the checker role is the one that may check someone else's calc.
 */
export function viewerOf(ability: AppAbility): Viewer {
  const own = ability.rules.find((r) => r.action === 'changePassword' && r.subject === 'User');
  const id = (own?.conditions as { id?: unknown } | undefined)?.id;
  const mayCheck = ability.can(
    'check',
    subject('Revision', { id: 0, calcId: 0, status: 'in_check', authorId: -1, checkerId: null, approverId: null }),
  );
  return { id: typeof id === 'number' ? id : null, mayCheck };
}
