// The steps of a sign-off after the calc is saved (attach, tick, sign) and the ledger of acknowledged writes;
// each step looks, after a 503 or a lost answer, whether its write was stored before trying again.
import { randomUUID } from 'node:crypto';
import { ApiClient, retrying, transient, type Reply } from './client';

/** Writes the server acknowledged (answered 2xx, or proved stored on a retry): none may be lost. */
export interface Ledger {
  calcs: { id: number; number: string }[];
  saves: { revisionId: number; lockVersion: number; title: string }[];
  attachments: { revisionId: number; fileName: string }[];
  ticks: { revisionId: number; itemId: string }[];
  signatures: { revisionId: number; meaning: string; key: string }[];
}

export const newLedger = (): Ledger => ({ calcs: [], saves: [], attachments: [], ticks: [], signatures: [] });

/** A few bytes that are a real PDF as far as content detection is concerned. */
function pdf(text: string): Blob {
  return new Blob([`%PDF-1.4\n% ${text}\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n`], {
    type: 'application/octet-stream',
  });
}

export function fail(step: string, r: Reply): never {
  throw new Error(`${step}: ${r.status} ${JSON.stringify(r.body).slice(0, 400)}`);
}

export const readRevision = (c: ApiClient, id: number) =>
  retrying(`read revision ${id}`, async () => {
    const r = await c.call('GET', `/api/revisions/${id}`);
    if (r.status === 200) return r.body;
    if (!transient(r)) fail('read revision', r);
    return undefined;
  });

/** Uploads one file of each kind the standard's manual items require (a tick needs one as evidence). */
export async function attachRequired(
  author: ApiClient,
  rid: number,
  start: { checklist?: { manual?: { requiresAttachment?: string }[] } },
  number: string,
  ledger: Ledger,
): Promise<void> {
  const kinds = [
    ...new Set(
      (start.checklist?.manual ?? []).map((m: { requiresAttachment?: string }) => m.requiresAttachment).filter(Boolean),
    ),
  ] as string[];
  for (const kind of kinds) {
    const fileName = `${number}-${kind}.pdf`;
    await retrying(`upload ${fileName}`, async () => {
      const form = new FormData();
      form.append('kind', kind);
      form.append('note', 'cluster run');
      form.append('file', pdf(fileName), fileName);
      const r = await author.call('POST', `/api/revisions/${rid}/attachments`, form);
      if (r.status === 201) return true;
      if (!transient(r)) fail('upload', r);
      const list = await author.call('GET', `/api/revisions/${rid}/attachments`);
      return list.status === 200 && list.body.items.some((a: { fileName: string }) => a.fileName === fileName)
        ? true
        : undefined;
    });
    ledger.attachments.push({ revisionId: rid, fileName });
  }
}

/** Ticks every manual item of the revision as its checker, looking after a lost answer whether it was stored. */
export async function tickAll(checker: ApiClient, rid: number, ledger: Ledger): Promise<void> {
  const inCheck = await readRevision(checker, rid);
  for (const item of inCheck.checklist?.manual ?? []) {
    await retrying(`tick ${item.id}`, async () => {
      const r = await checker.call('PUT', `/api/revisions/${rid}/manual-items/${item.id}`, { done: true, note: '' });
      if (r.status === 200) return true;
      if (!transient(r)) fail('tick', r);
      const now = await readRevision(checker, rid);
      return now.manualItems[item.id]?.done ? true : undefined;
    });
    ledger.ticks.push({ revisionId: rid, itemId: item.id });
  }
}

/** Signs once: every retry carries the same idempotency key, so a lost answer never signs twice. */
export async function sign(
  c: ApiClient,
  rid: number,
  meaning: string,
  password: string,
  ledger: Ledger,
): Promise<void> {
  const key = randomUUID();
  const { lockVersion } = await readRevision(c, rid);
  await retrying(`sign ${meaning} ${rid}`, async () => {
    const r = await c.call('POST', `/api/revisions/${rid}/sign`, {
      password,
      meaning,
      idempotencyKey: key,
      lockVersion,
    });
    if (r.status === 200) return true;
    if (!transient(r)) fail(`sign ${meaning}`, r);
    return undefined;
  });
  ledger.signatures.push({ revisionId: rid, meaning, key });
}
