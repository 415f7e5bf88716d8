import type { Express } from 'express';
import { advanceTo, createCalc, revisionOf, type Team } from './calc-harness';
import { expectStatus, person } from './api-harness';

/** An author with a fresh calc, an independent checker and an approver. */
export async function findingsTeam(app: Express) {
  const author = await person(app, ['author']);
  const checker = await person(app, ['checker']);
  const approver = await person(app, ['approver']);
  const { revisionId } = await createCalc(author.session);
  const sessions: Team = { author: author.session, checker: checker.session, approver: approver.session };
  return { author, checker, approver, revisionId, sessions };
}

/** In check, returned by the checker with a reason: one open finding waits for the author. */
export async function returnedWithFindingOf(app: Express) {
  const t = await findingsTeam(app);
  await advanceTo('in_check', t.sessions, t.revisionId);
  const lockVersion = (await revisionOf(t.sessions.author, t.revisionId)).lockVersion as number;
  const returned = expectStatus(
    await t.checker.session.post(`/api/revisions/${t.revisionId}/return`, {
      reason: 'Name the chart behind the keyseat Kts',
      lockVersion,
    }),
    200,
    'return',
  );
  return { ...t, findingId: returned.body.findings[0].id as number };
}
