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

export interface Team {
  author: ApiClient;
  checker: ApiClient;
  approver: ApiClient;
  password: string;
}

/** A few bytes that are a real PDF as far as content detection is concerned. */
function pdf(text: string): Blob {
  return new Blob([`%PDF-1.4\n% ${text}\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n`], {
    type: 'application/octet-stream',
  });
}

function fail(step: string, r: Reply): never {
  throw new Error(`${step}: ${r.status} ${JSON.stringify(r.body).slice(0, 400)}`);
}

const readRevision = (c: ApiClient, id: number) =>
  retrying(`read revision ${id}`, async () => {
    const r = await c.call('GET', `/api/revisions/${id}`);
    if (r.status === 200) return r.body;
    if (!transient(r)) fail('read revision', r);
    return undefined;
  });

/**
 * One complete sign-off as a careful client does it: create, save, attach, submit, tick, check,
 * approve. After a 503 or a lost answer each step first looks whether its write was stored
 * (by calc number, version and content, file name, item state, or the same idempotency key).
 */
export async function signOff(
  team: Team,
  ctx: { projectId: number; ruleSetId: number; input: Record<string, unknown>; number: string },
  ledger: Ledger,
): Promise<number> {
  const { author, checker, approver, password } = team;
  const created = await retrying(`create ${ctx.number}`, async () => {
    const r = await author.call('POST', '/api/calcs', {
      projectId: ctx.projectId,
      number: ctx.number,
      title: `Cluster run ${ctx.number}`,
      partRef: 'DRG-CL',
      ruleSetId: ctx.ruleSetId,
      input: ctx.input,
    });
    if (r.status === 201) return { id: r.body.id as number, revisionId: r.body.latest.id as number };
    if (r.status === 409 && r.body.fieldErrors?.number) {
      // An earlier attempt whose answer was lost did create it.
      const list = await author.call(
        'GET',
        `/api/calcs?projectId=${ctx.projectId}&q=${encodeURIComponent(ctx.number)}`,
      );
      const calc =
        list.status === 200 ? list.body.items.find((c: { number: string }) => c.number === ctx.number) : undefined;
      return calc ? { id: calc.id as number, revisionId: calc.latest.id as number } : undefined;
    }
    if (!transient(r)) fail('create', r);
    return undefined;
  });
  ledger.calcs.push({ id: created.id, number: ctx.number });
  const rid = created.revisionId;

  const start = await readRevision(author, rid);
  const title = `${start.input.title} (saved)`;
  const saved = await retrying(`save ${ctx.number}`, async () => {
    const r = await author.call('PUT', `/api/revisions/${rid}`, {
      input: { ...start.input, title },
      lockVersion: start.lockVersion,
    });
    if (r.status === 200) return r.body.lockVersion as number;
    if (
      r.status === 409 &&
      r.body.current?.lockVersion === start.lockVersion + 1 &&
      r.body.current.input.title === title
    )
      return r.body.current.lockVersion as number;
    if (!transient(r)) fail('save', r);
    return undefined;
  });
  ledger.saves.push({ revisionId: rid, lockVersion: saved, title });

  await attachRequired(author, rid, start, ctx.number, ledger);
  await sign(author, rid, 'authored', password, ledger);
  await tickAll(checker, rid, ledger);
  await sign(checker, rid, 'checked', password, ledger);
  await sign(approver, rid, 'approved', password, ledger);
  return rid;
}

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
