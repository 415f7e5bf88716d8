import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import {
  CalcInputError,
  ENGINE_VERSION,
  evaluateValidInput,
  validateCalcInput,
  type CalcInput,
  type CalcResult,
} from '../../shared/engine';
import { applyRuleSetMethods, evaluateChecklistSync, type Checklist, type RuleSet } from '../../shared/rules';
import type { InputIssue } from '../../shared/schemas/calc-dto';
import { nonFinitePath } from '../../shared/json/finite-json';
import { namePathsIn } from '../../shared/engine/field-places';

/** What the server stores as the record of truth for a revision's content. */
export interface ComputedRecord {
  result: CalcResult | null;
  checklist: Checklist | null;
  verdict: string | null;
  inputIssues: InputIssue[];
  /** What the input schema alone said ([] when the input is valid, even if it then could not be evaluated). */
  schemaIssues: InputIssue[];
}

/**
 * Runs the shared engine and the rule set on the author's input. Incomplete or invalid input is
 * kept (autosave never loses work) and reported as issues; only valid input gets a result.
 */
export async function computeRecord(input: unknown, ruleSet: RuleSet): Promise<ComputedRecord> {
  const validated = validateCalcInput(input);
  if (!validated.ok) return { ...nothing(), inputIssues: validated.issues, schemaIssues: validated.issues };
  const effective: CalcInput = applyRuleSetMethods(validated.value, ruleSet);
  try {
    const result = evaluateValidInput(effective);
    const inResult = nonFinitePath(result);
    if (inResult !== null) return notComputable(`result.${inResult}`);
    // The compiled evaluator: the same checklist as json-rules-engine's (test/shared/rules/equivalence.spec.ts holds
    // them equal on every shipped standard and on generated calcs) at about a tenth of the CPU, on every save.
    const checklist = evaluateChecklistSync(effective, result, ruleSet);
    const inChecklist = nonFinitePath(checklist);
    if (inChecklist !== null) return notComputable(`checklist.${inChecklist}`);
    return { result, checklist, verdict: checklist.verdict, inputIssues: [], schemaIssues: [] };
  } catch (err) {
    // The engine's own non-finite backstop names the input entry; keep its paths.
    if (err instanceof CalcInputError) return { ...nothing(), inputIssues: err.issues };
    const message = err instanceof Error ? err.message : String(err);
    return { ...nothing(), inputIssues: [{ path: '', message: `could not be evaluated: ${message}` }] };
  }
}

/** No result: the caller adds the issues (the schema's, or the evaluation's own for valid input). */
function nothing(): Omit<ComputedRecord, 'inputIssues'> {
  return { result: null, checklist: null, verdict: null, schemaIssues: [] };
}

// result.segments[2].J → segments[2]: the input entry whose values led there.
const INPUT_ENTRY = /^result\.(segments|features|torques)\[(\d+)\]/;

/**
 * A result holding Infinity or NaN is no result: stored, it would read as null ("no load here")
 * and clauses on it as "not applicable", so a shaft that cannot be computed could pass. The input
 * is kept (autosave) with an issue naming where the calculation left the range of numbers.
 */
function notComputable(where: string): ComputedRecord {
  const entry = INPUT_ENTRY.exec(where);
  return {
    ...nothing(),
    inputIssues: [
      {
        path: entry ? `${entry[1]}[${entry[2]}]` : '',
        message: `gives a value that is not a finite number (${namePathsIn(where.replace(/^(result|checklist)\./, ''))}); the input is outside the range the calculation can handle, so nothing was evaluated`,
      },
    ],
  };
}

/** Content format 1 hashed no attachments; format 2 (every signature since) adds the attachment set. */
export const CONTENT_FORMAT = 2;

/** One attachment as a signature covers it: what it is and which bytes. */
export interface SignedAttachment {
  name: string;
  kind: string;
  sizeBytes: number;
  sha256: string;
}

export interface HashedContent {
  calc: { project: string; number: string; title: string; partRef: string };
  revision: string;
  input: unknown;
  result: unknown;
  checklist: unknown;
  engineVersion: string;
  ruleSet: { code: string; version: number; contentHash: string };
  /** Present from format 2 on; format 1 content has neither field, so old hashes recompute unchanged. */
  contentFormat?: number;
  attachments?: SignedAttachment[];
  /** Present from format 3 on: the checker's locked independent model and the comparison (null when none). */
  independentModel?: unknown;
}

type CalcIdentity = { number: string; title: string; partRef: string; Project: { code: string } };
type RuleSetIdentity = { code: string; version: number; contentHash: string } | null | undefined;
type AttachmentRow = { fileName: string; kind: string; sizeBytes: number | string; sha256: string };

/** The attachment set in a stable order, so upload order never changes the hash. */
export function signedAttachments(rows: readonly AttachmentRow[]): SignedAttachment[] {
  return rows
    .map((a) => ({ name: a.fileName, kind: a.kind, sizeBytes: Number(a.sizeBytes), sha256: a.sha256 }))
    .sort((a, b) => (a.sha256 + a.name + a.kind).localeCompare(b.sha256 + b.name + b.kind));
}

/**
 * Exactly what a revision's content hash covers; the one builder for signing, reading and packs.
 * Format 1 (signatures made before attachments were signed) leaves the attachments out.
 */
export function hashedContentOf(
  calc: CalcIdentity,
  label: string,
  input: unknown,
  result: unknown,
  checklist: unknown,
  ruleSet: RuleSetIdentity,
  format = 1,
  attachments: readonly AttachmentRow[] = [],
  independentModel: unknown = null,
): HashedContent {
  const base: HashedContent = {
    calc: { project: calc.Project.code, number: calc.number, title: calc.title, partRef: calc.partRef },
    revision: label,
    input,
    result,
    checklist,
    engineVersion: (result as { engineVersion?: string } | null)?.engineVersion ?? ENGINE_VERSION,
    ruleSet: { code: ruleSet?.code ?? '', version: ruleSet?.version ?? 0, contentHash: ruleSet?.contentHash ?? '' },
  };
  if (format < 2) return base;
  const withFiles = { ...base, contentFormat: format, attachments: signedAttachments(attachments) };
  return format >= 3 ? { ...withFiles, independentModel } : withFiles;
}

/**
 * SHA-256 over the RFC 8785 canonical JSON of exactly what a signature vouches for: inputs,
 * results, engine version, the rule set's identity and content, the checklist and (format 2) the attachments.
 */
export function contentHashOf(content: Omit<HashedContent, 'engineVersion'> & { engineVersion?: string }): string {
  const full: HashedContent = { ...content, engineVersion: content.engineVersion ?? ENGINE_VERSION };
  return createHash('sha256')
    .update(canonicalize(full) ?? '')
    .digest('hex');
}
