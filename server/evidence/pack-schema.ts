import { z } from 'zod';
import { parseStrictJson } from '../../shared/json/strict-json';
import { RECORD_FORMAT } from './record-json';
import { chainedContentSchema } from '../audit/audit-chain';

/*
 * The JSON files of an evidence pack as the verifier accepts them. A pack comes from outside (it
 * may have been edited by hand or crafted), so each file is parsed strictly and checked against
 * its schema before any field is used; a file that does not fit is a failed check naming the
 * field, never an exception.
 */
export const MANIFEST_FORMAT = 'torquetrail-evidence/1';

const sha256Hex = z.string().regex(/^[0-9a-f]{64}$/, 'must be a SHA-256 in hex');
const packPath = z.string().min(1).max(1000);
const signedAttachment = z.object({
  name: z.string().max(300),
  kind: z.string().max(40),
  sizeBytes: z.number().int().min(0),
  sha256: sha256Hex,
});

export const manifestSchema = z.object({
  format: z.literal(MANIFEST_FORMAT),
  calc: z.string().max(300),
  exportedAt: z.string().max(40),
  exportedBy: z.string().max(300),
  files: z.array(z.object({ path: packPath, sha256: sha256Hex, size: z.number().int().min(0) })).max(100_000),
});
export type Manifest = z.infer<typeof manifestSchema>;

export const packRecordSchema = z.object({
  format: z.literal(RECORD_FORMAT),
  contentHash: sha256Hex.nullable(),
  content: z.unknown(),
  signatures: z
    .array(
      z.object({
        meaning: z.string().max(40),
        printedName: z.string().max(300),
        contentHash: sha256Hex,
        // From content format 2 on: the format and the attachment set the signature covered.
        contentFormat: z.number().int().min(1).max(99).optional(),
        attachmentsCovered: z.array(signedAttachment).max(10_000).nullable().optional(),
      }),
    )
    .max(100),
  attachments: z
    .array(
      z.object({
        path: packPath,
        sha256: sha256Hex,
        fileName: z.string().max(300),
        kind: z.string().max(40),
        sizeBytes: z.number().int().min(0),
      }),
    )
    .max(10_000),
});
export type PackRecord = z.infer<typeof packRecordSchema>;

/** Exactly the columns an audit row's hash covers, plus its id and hashes: nothing more, nothing less. */
export const auditRowSchema = z.strictObject({
  id: z.number().int(),
  ...chainedContentSchema.shape,
  prevHash: sha256Hex,
  hash: sha256Hex,
});
export const auditTrailSchema = z.object({ events: z.array(auditRowSchema).max(1_000_000) });
export type AuditRow = z.infer<typeof auditRowSchema>;

export type PackJson<T> = { ok: true; value: T } | { ok: false; detail: string };

const pathText = (path: readonly PropertyKey[]): string =>
  path.reduce<string>(
    (acc, k) => (typeof k === 'number' ? `${acc}[${k}]` : acc ? `${acc}.${String(k)}` : String(k)),
    '',
  );

/** One JSON file of the pack, strictly parsed and checked; `detail` names the first bad field. */
export function readPackJson<T>(files: Map<string, Buffer>, name: string, schema: z.ZodType<T>): PackJson<T> {
  const bytes = files.get(name);
  if (!bytes) return { ok: false, detail: 'missing from the pack' };
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return { ok: false, detail: 'is not UTF-8 text' };
  }
  const parsed = parseStrictJson(text);
  if (!parsed.ok) return { ok: false, detail: `${parsed.issue.path} ${parsed.issue.message}` };
  const checked = schema.safeParse(parsed.value);
  if (checked.success) return { ok: true, value: checked.data };
  const issue = checked.error.issues[0];
  return { ok: false, detail: `${pathText(issue.path) || '(file)'}: ${issue.message}` };
}
