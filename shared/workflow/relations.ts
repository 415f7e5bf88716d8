import type { RestrictedConditions } from '../authz/restricted-conditions';

/** How the person acting must stand to a revision: its author, or someone independent of it. */
export const RELATIONS = ['own', 'independent', 'independent-of-checker'] as const;
export type Relation = (typeof RELATIONS)[number];

/** Who has put their hand to a revision so far; editors are everyone who ever changed the calc. */
export interface RevisionParties {
  authorId: number;
  checkerId: number | null;
  editorIds: readonly number[];
}

interface RelationSpec {
  /** The part CASL can check on the revision row alone (and SQL can filter on). */
  conditions(userId: number): RestrictedConditions;
  /** The whole rule, with the calc's earlier editors, which only the workflow service and the client can see. */
  holds(userId: number, p: RevisionParties): boolean;
}

const isEditor = (userId: number, p: RevisionParties) => userId === p.authorId || p.editorIds.includes(userId);

export const RELATION: Record<Relation, RelationSpec> = {
  own: {
    conditions: (userId) => ({ authorId: userId }),
    holds: (userId, p) => userId === p.authorId,
  },
  // Independence: never your own work. Editors of earlier revisions are excluded by the workflow service.
  independent: {
    conditions: (userId) => ({ authorId: { $ne: userId } }),
    holds: (userId, p) => !isEditor(userId, p),
  },
  // A checker never approves what they checked.
  'independent-of-checker': {
    conditions: (userId) => ({ authorId: { $ne: userId }, checkerId: { $ne: userId } }),
    holds: (userId, p) => !isEditor(userId, p) && userId !== p.checkerId,
  },
};

export { isEditor };
