import { REVISION_STATES, WORKFLOW, type RevisionState, type WorkflowAction } from './revision-states';

/** States in which the holder may do this (e.g. `return`: in check and checked). */
export const statesAllowing = (action: WorkflowAction): RevisionState[] =>
  REVISION_STATES.filter((s) => WORKFLOW[s].turn?.may.includes(action));

/** States in which the author may still change the content. */
export const EDITABLE_STATES: readonly RevisionState[] = REVISION_STATES.filter((s) => WORKFLOW[s].isEditable);

/** Once a revision is released or closed nobody acts on it: its file set is part of the record. */
export const CLOSED_STATES: readonly RevisionState[] = REVISION_STATES.filter((s) => WORKFLOW[s].turn === null);

export const STATE_LABELS = Object.fromEntries(REVISION_STATES.map((s) => [s, WORKFLOW[s].label])) as Record<
  RevisionState,
  string
>;
