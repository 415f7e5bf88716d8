// A complete sign-off through the API as the cluster run's and the write benchmark's clients do it.
import { ApiClient, retrying, transient } from './client';
import { attachRequired, fail, readRevision, sign, tickAll, type Ledger } from './signoff-steps';

export interface Team {
  author: ApiClient;
  checker: ApiClient;
  approver: ApiClient;
  password: string;
}

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
