/**
 * The signing rules live in the workflow table (shared/workflow/signing-blockers.ts), so the client
 * reads the same list; a new blocker is one entry there. This module keeps the server's import path.
 */
export { signingBlocker, type SigningContext } from '../../shared/workflow/signing-blockers';
export type { Meaning } from '../../shared/workflow/revision-states';
