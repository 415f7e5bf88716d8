import type { PackCheck } from '../../shared/schemas/verify.schema';
import type { SignedAttachment } from '../calcs/revision-content';
import { contentHash } from './record-json';

export interface PackSignature {
  meaning: string;
  printedName: string;
  contentHash: string;
  contentFormat?: number;
  attachmentsCovered?: SignedAttachment[] | null;
}
type Content = { contentFormat?: unknown; attachments?: unknown } & Record<string, unknown>;
type ListedAttachment = { fileName: string; kind: string; sizeBytes: number; sha256: string };

const asContent = (c: unknown): Content => (c && typeof c === 'object' && !Array.isArray(c) ? (c as Content) : {});
const setOf = (c: Content): SignedAttachment[] =>
  Array.isArray(c.attachments) ? (c.attachments as SignedAttachment[]) : [];

const key = (a: SignedAttachment) => `${a.sha256}|${a.name}|${a.kind}|${a.sizeBytes}`;
const names = (list: SignedAttachment[]) => (list.length ? list.map((a) => a.name).join(', ') : 'none');

/**
 * The attachment files a record lists must be exactly the set its signed content names: a file
 * dropped from, added to or renamed in the list fails, even when the content itself is intact.
 */
export function attachmentListCheck(path: string, raw: unknown, listed: readonly ListedAttachment[]): PackCheck[] {
  const content = asContent(raw);
  if (typeof content.contentFormat !== 'number' || content.contentFormat < 2) return [];
  const signed = setOf(content).map(key).sort();
  const files = listed
    .map((a) => key({ name: a.fileName, kind: a.kind, sizeBytes: Number(a.sizeBytes), sha256: a.sha256 }))
    .sort();
  const ok = signed.length === files.length && signed.every((k, i) => k === files[i]);
  return [
    {
      name: `${path} attachment list`,
      ok,
      detail: ok
        ? `the ${files.length} attachments listed are the set the content hash covers`
        : 'the attachments listed differ from the set the content hash covers: the list was altered',
    },
  ];
}

/**
 * What each signature covers, judged in the content format it was made in: format 1 signatures
 * (made before attachments were signed) are checked against the content without the attachment
 * set, exactly as before; format 2 signatures over an earlier attachment set say which set.
 */
export function signatureCheck(
  path: string,
  recordHash: string,
  actual: string,
  raw: unknown,
  s: PackSignature,
): PackCheck {
  const earlier = asEarlierFormat(raw, s);
  if (earlier)
    return signatureCheck(path, actual === recordHash ? contentHash(earlier) : '', contentHash(earlier), earlier, s);
  const name = `${path} signature ${s.meaning} by ${s.printedName}`;
  const content = asContent(raw);
  if (s.contentHash === actual)
    return { name, ok: true, detail: `covers the content in this pack, attachments: ${names(setOf(content))}` };
  const intact = actual === recordHash;
  const { contentFormat: _f, attachments: _a, ...core } = content;
  if ((s.contentFormat ?? 1) < 2 && contentHash(core) === s.contentHash) {
    return {
      name,
      ok: intact,
      detail:
        'covers the content in this pack (made before attachments were part of what is signed; covers no attachments)',
    };
  }
  if (s.attachmentsCovered && contentHash({ ...content, attachments: s.attachmentsCovered }) === s.contentHash) {
    // Same inputs, results and checklist, fewer files: a later stage added evidence (e.g. the checker's
    // material certificate). The signature is proven over exactly that earlier set, so it holds for what
    // it covered; a file removed since (one the signer relied on) is a failure.
    const now = new Set(setOf(content).map(key));
    const removed = s.attachmentsCovered.filter((a) => !now.has(key(a)));
    const earlier = new Set(s.attachmentsCovered.map(key));
    const added = setOf(content).filter((a) => !earlier.has(key(a)));
    if (intact && removed.length === 0) {
      return {
        name,
        ok: true,
        detail: `covers this content as it stood when signed: the same inputs, results and checklist with attachments ${names(s.attachmentsCovered)}; added after this signature: ${names(added)}`,
      };
    }
    return {
      name,
      ok: false,
      detail: `made over an earlier attachment set (${names(s.attachmentsCovered)}); since removed: ${names(removed)}: not valid for this content`,
    };
  }
  const detail =
    s.contentHash === recordHash
      ? 'made over the recorded content, which this pack no longer holds: not valid for this content'
      : 'made over earlier content: not valid for this content';
  return { name, ok: false, detail };
}

/**
 * A signature made before the independent model was locked (format 2, e.g. the author's) over
 * content now in format 3: judged on the same content without the model, exactly as it was signed.
 */
function asEarlierFormat(raw: unknown, s: PackSignature): Content | null {
  const content = asContent(raw);
  if (typeof content.contentFormat !== 'number' || content.contentFormat < 3 || (s.contentFormat ?? 1) >= 3)
    return null;
  const { independentModel: _model, ...rest } = content;
  return { ...rest, contentFormat: 2 };
}
