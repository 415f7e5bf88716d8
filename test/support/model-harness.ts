import type { Express } from 'express';
import { advanceTo, createCalc, fixtureInput, revisionOf, type Team } from './calc-harness';
import { expectStatus, person, type Session } from './api-harness';
import { testStandard } from './standard-harness';
import type { Role } from '../../shared/authz/roles';

let standard: Promise<number> | undefined;

/**
 * A test-only standard that asks for an independent model on every calc (KFD-ENG-014 v3's clauses,
 * manual items without attachments, the lifting-duty standard's tolerances).
 */
export function modelStandardId(): Promise<number> {
  standard ??= testStandard((doc) => {
    doc.manualItems = (doc.manualItems as { requiresAttachment?: string }[]).map(
      ({ requiresAttachment: _dropped, ...item }) => item,
    );
    doc.verification = {
      method: 'independent-model',
      scope: { kind: 'all' },
      tolerances: { inputs: 0.001, results: 0.02 },
      origin: 'house choice',
    };
  }).then((s) => s.id);
  return standard;
}

/** A calc under that standard, submitted: in check, waiting for the independent model (checker roles as given). */
export async function modelTeam(app: Express, input = fixtureInput(), checkerRoles: Role[] = ['checker']) {
  const author = await person(app, ['author']);
  const checker = await person(app, checkerRoles);
  const approver = await person(app, ['approver']);
  const { revisionId, calcId } = await createCalc(author.session, {
    ruleSetId: await modelStandardId(),
    input,
  });
  const sessions: Team = { author: author.session, checker: checker.session, approver: approver.session };
  await advanceTo('in_check', sessions, revisionId);
  return { author, checker, approver, revisionId, calcId, sessions };
}

export const modelUrl = (id: number) => `/api/revisions/${id}/independent-model`;

/** Saves the checker's model (from its current lock version) and returns the saved model. */
export async function saveModel(s: Session, revisionId: number, input: Record<string, unknown>) {
  const current = await s.get(modelUrl(revisionId));
  const lockVersion = current.status === 200 ? (current.body.lockVersion as number) : 0;
  return expectStatus(await s.put(modelUrl(revisionId), { input, lockVersion }), 200, 'save model').body;
}

export async function lockModel(s: Session, revisionId: number) {
  const model = expectStatus(await s.get(modelUrl(revisionId)), 200, 'read model').body;
  return expectStatus(
    await s.post(`${modelUrl(revisionId)}/lock`, { lockVersion: model.lockVersion }),
    200,
    'lock model',
  ).body;
}

/** The fixture with one segment 2 mm larger: one input difference (and the results that follow). */
export function differentInput(): Record<string, unknown> {
  const input = fixtureInput();
  const segments = input.segments as { od: number }[];
  segments[1] = { ...segments[1], od: segments[1].od + 2 };
  return input;
}

export { revisionOf };
