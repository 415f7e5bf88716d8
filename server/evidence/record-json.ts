import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import { CAUTION } from '../../shared/engine';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import type { AttachmentDto } from '../../shared/schemas/attachment.schema';
import { hashedContentOf, type HashedContent } from '../calcs/revision-content';
import type { Calc, Project, RuleSetRecord } from '../db/models';

export const RECORD_FORMAT = 'torquetrail-record/1';

export const sha256 = (data: Buffer | string): string => createHash('sha256').update(data).digest('hex');

/** The content hash as the server computes it: SHA-256 over RFC 8785 canonical JSON. */
export const contentHash = (content: unknown): string => sha256(canonicalize(content) ?? '');

/**
 * What a revision's content hash covers, built by the same function the server signs with (same format, same
 * attachments).
 */
export function hashedContent(
  calc: Calc & { Project: Project },
  r: RevisionDto,
  ruleSet: RuleSetRecord | null,
  attachments: readonly AttachmentDto[] = [],
): HashedContent {
  return hashedContentOf(
    calc,
    r.label,
    r.input,
    r.result,
    r.checklist,
    ruleSet,
    r.contentFormat,
    attachments,
    r.verification?.signed ?? null,
  );
}

export interface RecordAttachment {
  kind: string;
  fileName: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  path: string;
}

/** The machine-readable record of one revision as it goes into an evidence pack. */
export function recordJson(
  calc: Calc & { Project: Project },
  r: RevisionDto,
  ruleSet: RuleSetRecord | null,
  attachments: { dto: AttachmentDto; path: string }[],
) {
  return {
    format: RECORD_FORMAT,
    calc: { id: calc.id, project: calc.Project.code, number: calc.number, title: calc.title, partRef: calc.partRef },
    revision: {
      id: r.id,
      label: r.label,
      state: r.status,
      verdict: r.verdict,
      reasonForChange: r.reasonForChange,
      author: r.author.name,
      checker: r.checker?.name ?? null,
      approver: r.approver?.name ?? null,
      createdAt: r.createdAt,
      submittedAt: r.submittedAt,
      checkedAt: r.checkedAt,
      approvedAt: r.approvedAt,
    },
    contentHash: r.contentHash,
    content: r.contentHash
      ? hashedContent(
          calc,
          r,
          ruleSet,
          attachments.map((a) => a.dto),
        )
      : null,
    signatures: r.signatures.map((s) => ({
      printedName: s.printedName,
      role: s.role,
      meaning: s.meaning,
      signedAt: s.signedAt,
      contentHash: s.contentHash,
      contentFormat: s.contentFormat,
      attachmentsCovered: s.attachments,
    })),
    findings: r.findings,
    // The checker's independent model and the comparison; signed from content format 3 on (content.independentModel).
    verification: r.verification
      ? { need: r.verification.need, model: r.verification.model, signed: r.verification.signed }
      : null,
    manualItems: r.manualItems,
    attachments: attachments.map(({ dto, path }): RecordAttachment => ({
      kind: dto.kind,
      fileName: dto.fileName,
      mediaType: dto.mediaType,
      sizeBytes: dto.sizeBytes,
      sha256: dto.sha256,
      path,
    })),
    caution: CAUTION,
  };
}
