import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import { Op } from 'sequelize';
import { AuditEvent, MailOutbox, Project, RuleSetRecord } from '../../server/db/models';
import { documentHash } from '../../server/rule-sets/rule-set-mapping';
import type { Role } from '../../shared/authz/roles';
import { TEST_PASSWORD, createTestProject, signedInAs, uniqueCode } from './api-harness';
import { attachRequiredFiles } from './attachment-harness';

/** The engine's five-segment fixture: a valid shaft with features and fatigue data. */
export function fixtureInput(name = 'five-segment-fatigue'): Record<string, unknown> {
  return JSON.parse(fs.readFileSync(path.resolve(__dirname, `../fixtures/calcs/${name}.json`), 'utf8'));
}

export async function effectiveRuleSetId(code = 'KFD-ENG-014'): Promise<number> {
  const record = await RuleSetRecord.findOne({ where: { code, status: 'effective' }, order: [['version', 'DESC']] });
  if (!record) throw new Error(`no effective ${code} in the test database`);
  return record.id;
}

export type Session = Awaited<ReturnType<typeof signedInAs>>['session'];

/** An author, a checker and an approver, and a fresh calc written by the author. */
export async function calcTeam(app: Express, input = fixtureInput()) {
  const author = await signedInAs(app, ['author'], 'author');
  const checker = await signedInAs(app, ['checker'], 'checker');
  const approver = await signedInAs(app, ['approver'], 'approver');
  const project = await createTestProject();
  const res = await author.session.post('/api/calcs', {
    projectId: project.id,
    number: `C-${randomUUID().slice(0, 6)}`,
    title: 'Test head shaft',
    partRef: 'DRG-1',
    ruleSetId: await effectiveRuleSetId(),
    input,
  });
  if (res.status !== 201) throw new Error(`calc create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { author, checker, approver, project, calc: res.body, revisionId: res.body.latest.id as number };
}

export async function revisionOf(s: Session, id: number) {
  const res = await s.get(`/api/revisions/${id}`);
  if (res.status !== 200) throw new Error(`revision read failed: ${res.status}`);
  return res.body;
}

/** Signs with a fresh idempotency key unless one is given. */
export async function sign(
  s: Session,
  id: number,
  meaning: 'authored' | 'checked' | 'approved',
  extra: Partial<{ key: string; password: string; withoutRequiredFiles: boolean }> = {},
) {
  // The author attaches what the manual items ask for before submitting, so the author's signature
  // covers it; a file added later leaves that signature over earlier content (signed-attachments.spec.ts).
  if (meaning === 'authored' && !extra.withoutRequiredFiles)
    await attachRequiredFiles(id, (await revisionOf(s, id)).checklist?.manual ?? []);
  const r = await revisionOf(s, id);
  return s.post(`/api/revisions/${id}/sign`, {
    password: extra.password ?? TEST_PASSWORD,
    meaning,
    idempotencyKey: extra.key ?? randomUUID(),
    lockVersion: r.lockVersion,
  });
}

/** Ticks every manual checklist item as the given checker. */
export async function tickAll(s: Session, id: number) {
  const r = await revisionOf(s, id);
  // Items like "material certificate attached" can only be ticked once such a file is attached.
  await attachRequiredFiles(id, r.checklist?.manual ?? []);
  for (const item of r.checklist?.manual ?? [])
    await s.put(`/api/revisions/${id}/manual-items/${item.id}`, { done: true, note: '' });
}

// ---- Additions for the workflow, rule-set and audit specs ----

export type Meaning = 'authored' | 'checked' | 'approved';
type Person = Awaited<ReturnType<typeof signedInAs>>;

/**
 * A signed-in test person whose display name is unique, so a printed name on a signature can
 * only have come from them. `label` is short and lower-case (it is part of the username).
 */
export async function person(app: Express, roles: Role[], label = roles.join('-')) {
  const tag = `${label}-${randomUUID().slice(0, 4)}`;
  const p = await signedInAs(app, roles, tag);
  return { ...p, displayName: `Test ${tag}`, email: `${p.user.username}@example.test` };
}

let workflowStandard: Promise<{ id: number; code: string }> | undefined;

/**
 * The standard workflow specs check calcs against: KFD-ENG-014 v3's clauses and manual items under
 * a test-only code, one per spec file, with no item requiring an attachment, so that the sign-off
 * rules are tested on their own (attachments have their own specs).
 */
export function workflowStandardId(): Promise<number> {
  workflowStandard ??= testStandard((doc) => {
    doc.manualItems = (doc.manualItems as { requiresAttachment?: string }[]).map(
      ({ requiresAttachment: _dropped, ...item }) => item,
    );
  });
  return workflowStandard.then((s) => s.id);
}

/** A fresh calc written by `author`, in a new project of its own (revision scheme and standard as asked). */
export async function createCalc(
  author: Session,
  opts: { input?: Record<string, unknown>; ruleSetId?: number; scheme?: 'letters' | 'numbers' } = {},
) {
  const project = await Project.create({
    code: uniqueCode(),
    name: 'Test drive shaft',
    createdBy: null,
    revisionScheme: opts.scheme ?? 'letters',
  });
  const res = await author.post('/api/calcs', {
    projectId: project.id,
    number: `C-${randomUUID().slice(0, 6)}`,
    title: 'Test head shaft',
    partRef: 'DRG-1',
    ruleSetId: opts.ruleSetId ?? (await workflowStandardId()),
    input: opts.input ?? fixtureInput(),
  });
  if (res.status !== 201) throw new Error(`calc create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return {
    project: { id: project.id, code: project.code },
    calc: res.body,
    calcId: res.body.id as number,
    revisionId: res.body.latest.id as number,
  };
}

/** Fails loudly with the response body when a set-up step does not answer as expected. */
export function expectStatus<T extends { status: number; body: unknown }>(res: T, status: number, step: string): T {
  if (res.status !== status)
    throw new Error(`${step}: expected ${status}, got ${res.status} ${JSON.stringify(res.body)}`);
  return res;
}

export interface Team {
  author: Session;
  checker: Session;
  approver: Session;
}

/** Set-up through the API: takes a draft (or returned) revision forward to `state` with the given team. */
export async function advanceTo(
  state: 'in_check' | 'checked' | 'approved',
  team: Team,
  revisionId: number,
): Promise<void> {
  expectStatus(await sign(team.author, revisionId, 'authored'), 200, 'submit');
  if (state === 'in_check') return;
  await tickAll(team.checker, revisionId);
  expectStatus(await sign(team.checker, revisionId, 'checked'), 200, 'check');
  if (state === 'checked') return;
  expectStatus(await sign(team.approver, revisionId, 'approved'), 200, 'approve');
}

/** Audit rows of one entity, oldest first, read from the table (the API has no per-entity filter). */
export async function auditOf(entityType: string, entityId: number, since = 0) {
  const rows = await AuditEvent.findAll({
    where: { entityType, entityId: String(entityId), id: { [Op.gt]: since } },
    order: [['id', 'ASC']],
  });
  return rows.map((r) => ({
    id: r.id,
    action: r.action,
    actorId: r.actorId,
    actorName: r.actorName,
    payload: JSON.parse(r.payload),
    diff: r.diff,
  }));
}

export async function lastAuditId(): Promise<number> {
  return (await AuditEvent.max<number, AuditEvent>('id')) ?? 0;
}

/** Hand-over mails about one project (its code is unique and is in every subject). */
export async function mailAbout(projectCode: string, event?: string) {
  const rows = await MailOutbox.findAll({
    where: { subject: { [Op.like]: `%${projectCode}%` }, ...(event ? { event } : {}) },
    order: [['id', 'ASC']],
  });
  return rows.map((r) => ({
    event: r.event,
    recipient: r.recipient,
    subject: r.subject,
    body: r.body,
    status: r.status,
  }));
}

/** The shipped KFD-ENG-014 v3 document, as compliance would start from. */
export function standardDocument(): Record<string, unknown> {
  const { $schema: _ignored, ...doc } = JSON.parse(
    fs.readFileSync(path.resolve(__dirname, '../../rules/kfd-eng-014-v3.json'), 'utf8'),
  );
  return doc;
}

/**
 * A test-only design standard (a copy of KFD-ENG-014 v3 under a unique code) inserted as effective
 * version 1, so that drafting, confirming and retiring versions never touches the shipped
 * standards other specs rely on.
 */
export async function testStandard(change: (doc: Record<string, unknown>) => void = () => {}) {
  const code = `TST-${randomUUID().slice(0, 8).toUpperCase()}`;
  const doc = {
    ...standardDocument(),
    code,
    version: 1,
    status: 'effective',
    effectiveDate: '2025-01-01',
    title: `Test standard ${code}`,
  };
  change(doc);
  const record = await RuleSetRecord.create({
    code,
    version: 1,
    title: doc.title,
    status: 'effective',
    effectiveDate: '2025-01-01',
    document: JSON.stringify(doc),
    contentHash: documentHash(doc),
    createdBy: null,
  });
  return { id: record.id, code };
}

/** Sets one numeric parameter of a rule-set document (a copy; the original is left alone). */
export function withParameter(doc: Record<string, unknown>, name: string, value: number): Record<string, unknown> {
  const parameters = (doc.parameters as { name: string; value: unknown }[]).map((p) =>
    p.name === name ? { ...p, value } : p,
  );
  if (!parameters.some((p) => p.name === name)) throw new Error(`no parameter ${name}`);
  return { ...doc, parameters };
}

export type { Person };

/** Saves a rule-set draft as a compliance user would. */
export const saveStandard = (s: Session, id: number, document: Record<string, unknown>, lockVersion: number) =>
  s.put(`/api/rule-sets/${id}`, { document, lockVersion });

/** A test-only standard in effect (v1) and a compliance user's fresh draft of v2 from it. */
export async function draftStandard(app: Express) {
  const standard = await testStandard();
  const drafter = await person(app, ['compliance'], 'drafter');
  const draft = expectStatus(await drafter.session.post('/api/rule-sets', { fromId: standard.id }), 201, 'draft').body;
  return { standard, drafter, draft };
}

/**
 * That draft saved with a tighter twist limit and a change summary, proposed by its drafter: ready for a second person.
 */
export async function proposeStandard(app: Express) {
  const d = await draftStandard(app);
  const document = {
    ...withParameter(d.draft.document, 'maxTwistPerDiameter', 0.04),
    changeSummary: 'Twist limit tightened to 0.04° per diameter',
  };
  const saved = expectStatus(
    await saveStandard(d.drafter.session, d.draft.id, document, d.draft.lockVersion),
    200,
    'save',
  ).body;
  const proposal = expectStatus(
    await d.drafter.session.post(`/api/rule-sets/${d.draft.id}/propose`, {
      effectiveDate: '2026-11-01',
      lockVersion: saved.lockVersion,
    }),
    200,
    'propose',
  ).body;
  return { ...d, proposal };
}
