import type { RevisionState } from './revision.schema';
import type { KeysetPage } from './common.schema';

export interface PersonRef {
  id: number;
  name: string;
}

export interface SignatureDto {
  id: number;
  printedName: string;
  role: string;
  meaning: 'authored' | 'checked' | 'approved';
  signedAt: string;
  contentHash: string;
  /** False once the revision's content no longer hashes to what was signed. */
  isValid: boolean;
  /** 1 = made before attachments were signed (covers none); 2 = covers `attachments`. */
  contentFormat: number;
  /** The attachment set this signature covered; null for format 1. */
  attachments: SignedAttachmentDto[] | null;
}

/** An attachment as a signature covers it (name, kind, size, SHA-256). */
export interface SignedAttachmentDto {
  name: string;
  kind: string;
  sizeBytes: number;
  sha256: string;
}

export interface FindingDto {
  id: number;
  clauseRef: string | null;
  anchorPath: string | null;
  text: string;
  status: 'open' | 'answered' | 'closed';
  raisedBy: PersonRef;
  createdAt: string;
  answer: string | null;
  answeredBy: PersonRef | null;
  answeredAt: string | null;
  closedBy: PersonRef | null;
  closedAt: string | null;
}

export interface ManualItemState {
  done: boolean;
  note: string;
  by: string | null;
  at: string | null;
}

export interface InputIssue {
  path: string;
  message: string;
}

export interface RevisionSummary {
  id: number;
  seq: number;
  label: string;
  status: RevisionState;
  verdict: string | null;
  author: PersonRef;
  checker: PersonRef | null;
  approver: PersonRef | null;
  ruleSet: { id: number; code: string; version: number; title: string };
  reasonForChange: string;
  updatedAt: string;
  approvedAt: string | null;
}

export interface RevisionDto extends RevisionSummary {
  calcId: number;
  lockVersion: number;
  input: Record<string, unknown>;
  result: unknown | null;
  checklist: unknown | null;
  inputIssues: InputIssue[];
  manualItems: Record<string, ManualItemState>;
  contentHash: string | null;
  /** Format of `contentHash` (1 = before attachments were signed, 2 = attachment set included). */
  contentFormat: number;
  signatures: SignatureDto[];
  findings: FindingDto[];
  submittedAt: string | null;
  checkedAt: string | null;
  createdAt: string;
  /** People who ever edited this calc: none of them may check or approve it. */
  editorIds: number[];
  /** Review or independent model, and the model's state (shared/schemas/independent-model.schema.ts). */
  verification?: import('./independent-model.schema').RevisionVerification;
}

export interface CalcDto {
  id: number;
  projectId: number;
  projectCode: string;
  projectName: string;
  /** The project is archived: the calc is a closed, read-only record. */
  projectArchived: boolean;
  number: string;
  title: string;
  partRef: string;
  createdAt: string;
  latest: RevisionSummary;
  revisions: RevisionSummary[];
}

/**
 * A page of the calc list. `stoppedEarly` is true when a search looked through its bound of calcs
 * (the rarest word's, in the list's order) without filling the page: the rows shown are all the
 * matches up to there, more may follow, and `next` goes on searching from where it stopped.
 */
export interface CalcListPage extends KeysetPage<CalcListItem> {
  stoppedEarly: boolean;
}

/** One row of a calc list, read from the summary columns kept on the calc (never the revision texts). */
export interface CalcListItem {
  id: number;
  projectId: number;
  projectCode: string;
  number: string;
  title: string;
  partRef: string;
  /** The project is archived: lists mark the calc as a closed, read-only record. */
  projectArchived: boolean;
  latest: {
    id: number;
    label: string;
    status: RevisionState;
    verdict: string | null;
    author: PersonRef;
    ruleSet: { id: number; code: string; version: number };
    updatedAt: string;
  };
}
