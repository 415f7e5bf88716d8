import type { Checklist } from '../../shared/rules';
import { decodeChecklist, encodeChecklist, type StoredChecklist } from '../../shared/rules/stored-checklist';
import { stringifyFinite } from '../../shared/json/finite-json';

/*
 * A revision row keeps its checklist in the stored form of shared/rules/stored-checklist.ts (rows as arrays, each
 * text written once); the browser can be sent that form as it is (server/calcs/revision-answer.ts).
 */

/** The text a revision row keeps for its checklist (null for none). */
export function compactChecklist(checklist: Checklist | null): string | null {
  return checklist ? stringifyFinite(encodeChecklist(checklist)) : null;
}

/** A stored checklist as the evaluator returned it; a whole (older) one as it is. */
export function expandChecklist(text: string | null): Checklist | null {
  return text ? decodeChecklist(JSON.parse(text) as StoredChecklist) : null;
}
