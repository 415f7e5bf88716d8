/** What evaluating one clause at one location gave, before it becomes a checklist row. */
export interface ClauseOutcome {
  /** null when the applicability condition threw. */
  applies: boolean | null;
  /** null when not applicable or when the check threw. */
  passes: boolean | null;
  error: string | null;
}

export function errorText(err: unknown): string {
  return err instanceof Error ? err.message : String(err);
}

export const notApplicable = (): ClauseOutcome => ({ applies: false, passes: null, error: null });
export const failed = (err: unknown, applies: boolean | null): ClauseOutcome => ({
  applies,
  passes: null,
  error: errorText(err),
});
