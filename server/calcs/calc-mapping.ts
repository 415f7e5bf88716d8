import type {
  CalcDto,
  FindingDto,
  SignedAttachmentDto,
  ManualItemState,
  PersonRef,
  RevisionDto,
  RevisionSummary,
  SignatureDto,
} from '../../shared/schemas/calc-dto';
import { Calc, Finding, Project, Revision, RuleSetRecord, Signature, User } from '../db/models';
import { REVISION_RULE_SET_ATTRIBUTES } from '../rule-sets/rule-set-cache';

/** Associations every revision read needs, loaded in one query. */
export const REVISION_INCLUDE = [
  {
    model: RuleSetRecord,
    as: 'ruleSet',
    attributes: REVISION_RULE_SET_ATTRIBUTES,
  },
  { model: User, as: 'author', attributes: ['id', 'displayName'] },
  { model: User, as: 'checker', attributes: ['id', 'displayName'] },
  { model: User, as: 'approver', attributes: ['id', 'displayName'] },
];

type Loaded = Revision & { ruleSet?: RuleSetRecord; author?: User; checker?: User | null; approver?: User | null };

const person = (u: User | null | undefined): PersonRef | null => (u ? { id: u.id, name: u.displayName } : null);
const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);

export function toRevisionSummary(r: Loaded): RevisionSummary {
  return {
    id: r.id,
    seq: r.seq,
    label: r.label,
    status: r.status,
    verdict: r.verdict,
    author: person(r.author) ?? { id: r.authorId, name: 'unknown' },
    checker: person(r.checker),
    approver: person(r.approver),
    ruleSet: {
      id: r.ruleSetId,
      code: r.ruleSet?.code ?? '',
      version: r.ruleSet?.version ?? 0,
      title: r.ruleSet?.title ?? '',
    },
    reasonForChange: r.reasonForChange,
    updatedAt: r.updatedAt.toISOString(),
    approvedAt: iso(r.approvedAt),
  };
}

/** A signature holds while the content, hashed in the format it was made in, still hashes to what was signed. */
export function toSignatureDto(s: Signature, currentHashes: Map<number, string | null>): SignatureDto {
  const current = currentHashes.get(s.contentFormat ?? 1) ?? null;
  return {
    id: s.id,
    printedName: s.printedName,
    role: s.role,
    meaning: s.meaning,
    signedAt: s.signedAt.toISOString(),
    contentHash: s.contentHash,
    isValid: current !== null && s.contentHash === current,
    contentFormat: s.contentFormat ?? 1,
    attachments: s.attachments ? (JSON.parse(s.attachments) as SignedAttachmentDto[]) : null,
  };
}

export function toFindingDto(f: Finding, names: Map<number, string>): FindingDto {
  const ref = (id: number | null) => (id == null ? null : { id, name: names.get(id) ?? 'unknown' });
  return {
    id: f.id,
    clauseRef: f.clauseRef,
    anchorPath: f.anchorPath ?? null,
    text: f.text,
    status: f.status,
    raisedBy: ref(f.raisedBy)!,
    createdAt: f.createdAt.toISOString(),
    answer: f.answer,
    answeredBy: ref(f.answeredBy),
    answeredAt: iso(f.answeredAt),
    closedBy: ref(f.closedBy),
    closedAt: iso(f.closedAt),
  };
}

export interface RevisionParts {
  /**
   * The result with its units and formulas put back (server/calcs/stored-result.ts) and the checklist as evaluated,
   * or in the stored form both texts as stored (revision-answer.ts).
   */
  result: unknown | null;
  checklist: unknown | null;
  signatures: Signature[];
  findings: Finding[];
  names: Map<number, string>;
  editorIds: number[];
  currentHashes: Map<number, string | null>;
  inputIssues: RevisionDto['inputIssues'];
}

export function toRevisionDto(r: Loaded, parts: RevisionParts): RevisionDto {
  return {
    ...toRevisionSummary(r),
    calcId: r.calcId,
    lockVersion: r.lockVersion,
    input: JSON.parse(r.input),
    result: parts.result,
    checklist: parts.checklist,
    inputIssues: parts.inputIssues,
    manualItems: JSON.parse(r.manualItems) as Record<string, ManualItemState>,
    contentHash: r.contentHash,
    contentFormat: r.contentFormat ?? 1,
    signatures: parts.signatures.map((s) => toSignatureDto(s, parts.currentHashes)),
    findings: parts.findings.map((f) => toFindingDto(f, parts.names)),
    submittedAt: iso(r.submittedAt),
    checkedAt: iso(r.checkedAt),
    createdAt: r.createdAt.toISOString(),
    editorIds: parts.editorIds,
  };
}

export function toCalcDto(calc: Calc & { Project?: Project }, revisions: Loaded[]): CalcDto {
  const summaries = revisions.map(toRevisionSummary).sort((a, b) => a.seq - b.seq);
  return {
    id: calc.id,
    projectId: calc.projectId,
    projectCode: calc.Project?.code ?? '',
    projectName: calc.Project?.name ?? '',
    projectArchived: calc.Project?.status === 'archived',
    number: calc.number,
    title: calc.title,
    partRef: calc.partRef,
    createdAt: calc.createdAt.toISOString(),
    latest: summaries[summaries.length - 1],
    revisions: summaries,
  };
}
