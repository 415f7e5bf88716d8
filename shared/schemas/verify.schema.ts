import { z } from 'zod';

/** A record hash as printed on a report: 64 hex digits; spaces and capitals are forgiven. */
export const recordHashSchema = z.object({
  hash: z
    .string()
    .transform((s) => s.replace(/\s+/g, '').toLowerCase())
    .pipe(
      z
        .string()
        .regex(/^[0-9a-f]{64}$/, 'must be the 64 hexadecimal characters of the record hash printed on the report'),
    ),
});

export interface VerifiedSignature {
  printedName: string;
  role: string;
  meaning: string;
  signedAt: string;
  /** True when the signature covers the revision's content as stored now. */
  isValid: boolean;
  /** True when this signature was made over exactly the hash being verified. */
  coversThisHash: boolean;
}

export interface VerifiedRevision {
  calcId: number;
  revisionId: number;
  projectCode: string;
  calcNumber: string;
  calcTitle: string;
  revision: string;
  state: string;
  verdict: string | null;
  ruleSet: string;
  /** `current`: the hash is this revision's content now; `earlier`: it was signed, the content changed since. */
  match: 'current' | 'earlier';
  /** False when the stored content no longer hashes to its recorded hash (tampering or corruption). */
  contentIntact: boolean;
  signatures: VerifiedSignature[];
}

export interface VerifyResult {
  hash: string;
  found: boolean;
  matches: VerifiedRevision[];
  message: string;
  caution: string;
}

export interface PackCheck {
  name: string;
  ok: boolean;
  detail: string;
}

export interface PackVerification {
  ok: boolean;
  calc: string | null;
  checks: PackCheck[];
  caution: string;
}
