import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import { Project, RuleSetRecord } from '../../server/db/models';
import { TEST_PASSWORD, createTestProject, expectStatus, signedInAs, uniqueCode, type Session } from './api-harness';
import { attachRequiredFiles } from './attachment-harness';
import { standardWithoutAttachments } from './standard-harness';

/** The engine's five-segment fixture: a valid shaft with features and fatigue data. */
export function fixtureInput(name = 'five-segment-fatigue'): Record<string, unknown> {
  return JSON.parse(fs.readFileSync(path.resolve(__dirname, `../fixtures/calcs/${name}.json`), 'utf8'));
}

export async function effectiveRuleSetId(code = 'KFD-ENG-014'): Promise<number> {
  const record = await RuleSetRecord.findOne({ where: { code, status: 'effective' }, order: [['version', 'DESC']] });
  if (!record) throw new Error(`no effective ${code} in the test database`);
  return record.id;
}

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

export type Meaning = 'authored' | 'checked' | 'approved';

let workflowStandard: Promise<{ id: number; code: string }> | undefined;

/**
 * The standard workflow specs check calcs against: KFD-ENG-014 v3's clauses and manual items under
 * a test-only code, one per spec file, with no item requiring an attachment, so that the sign-off
 * rules are tested on their own (attachments have their own specs).
 */
export function workflowStandardId(): Promise<number> {
  workflowStandard ??= standardWithoutAttachments();
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
