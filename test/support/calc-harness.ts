import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import { RuleSetRecord } from '../../server/db/models';
import { TEST_PASSWORD, createTestProject, signedInAs } from './api-harness';

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
    projectId: project.id, number: `C-${randomUUID().slice(0, 6)}`, title: 'Test head shaft', partRef: 'DRG-1', ruleSetId: await effectiveRuleSetId(), input,
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
export async function sign(s: Session, id: number, meaning: 'authored' | 'checked' | 'approved', extra: Partial<{ key: string; password: string }> = {}) {
  const r = await revisionOf(s, id);
  return s.post(`/api/revisions/${id}/sign`, {
    password: extra.password ?? TEST_PASSWORD, meaning, idempotencyKey: extra.key ?? randomUUID(), lockVersion: r.lockVersion,
  });
}

/** Ticks every manual checklist item as the given checker. */
export async function tickAll(s: Session, id: number) {
  const r = await revisionOf(s, id);
  for (const item of r.checklist?.manual ?? []) await s.put(`/api/revisions/${id}/manual-items/${item.id}`, { done: true, note: '' });
}
