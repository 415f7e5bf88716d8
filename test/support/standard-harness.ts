import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import { RuleSetRecord } from '../../server/db/models';
import { documentHash } from '../../server/rule-sets/rule-set-mapping';
import { expectStatus, person, type Session } from './api-harness';

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

/** A fresh test standard whose manual items ask for no attachment, so sign-off is tested on its own. */
export function standardWithoutAttachments() {
  return testStandard((doc) => {
    doc.manualItems = (doc.manualItems as { requiresAttachment?: string }[]).map(
      ({ requiresAttachment: _dropped, ...item }) => item,
    );
  });
}

/** Sets one numeric parameter of a rule-set document (a copy; the original is left alone). */
export function withParameter(doc: Record<string, unknown>, name: string, value: number): Record<string, unknown> {
  const parameters = (doc.parameters as { name: string; value: unknown }[]).map((p) =>
    p.name === name ? { ...p, value } : p,
  );
  if (!parameters.some((p) => p.name === name)) throw new Error(`no parameter ${name}`);
  return { ...doc, parameters };
}

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

/** Replaces the standard's v1 by a v2 (effective `on`, today) under which the fixture shaft no longer complies. */
export async function replaceStandard(standard: { id: number; code: string }, on: string) {
  const v1 = (await RuleSetRecord.findByPk(standard.id))!;
  const doc = { ...withParameter(JSON.parse(v1.document), 'asmeSyFraction', 0.03), version: 2, effectiveDate: on };
  await RuleSetRecord.create({
    code: standard.code,
    version: 2,
    title: v1.title,
    status: 'effective',
    effectiveDate: on,
    document: JSON.stringify(doc),
    contentHash: documentHash(doc),
    createdBy: null,
  });
  await v1.update({ status: 'retired' });
}
