import { randomUUID } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { Project, RuleSetRecord } from '../models';
import { CalcsService } from '../../calcs/calcs.service';
import { WorkflowService } from '../../workflow/workflow.service';
import { ReviewService } from '../../workflow/review.service';
import { RuleSetsService } from '../../rule-sets/rule-sets.service';
import { HealthSettingsService } from '../../review-health/health-settings.service';
import type { AttachmentsService } from '../../attachments/attachments.service';
import { readRevision } from '../../calcs/revision-read';
import { DEMO_PASSWORD } from '../demo-data';
import { mixerShaft } from './demo-process-shafts';
import { DEMO_CERTIFICATE, DEMO_DRAWING, demoDocument } from './demo-files';
import { personOf, type Person } from './demo-steps';

/**
 * Review-health material for the demo, through the real services: the organisation lowers two thresholds to
 * suit a small office; two more agitator shafts by Morwenna Hale are checked within minutes by Tobias Okafor
 * (no findings, most of her checks); Ingrid Lindqvist mistypes her password three times and adds an inspection
 * note after the check before approving; then compliance puts a stricter fatigue margin in force, replacing
 * the version those approvals were judged under and changing their verdict.
 */
export async function seedDemoReviewHealth(
  sequelize: Sequelize,
  baseUrl: string,
  attachments: AttachmentsService,
): Promise<void> {
  const calcs = new CalcsService(sequelize);
  const workflow = new WorkflowService(sequelize, baseUrl);
  const review = new ReviewService(sequelize, workflow);
  const [hale, okafor, lindqvist, raman, ashdown] = await Promise.all(
    ['author', 'checker', 'approver', 'compliance', 'compliance2'].map(personOf),
  );
  const settings = new HealthSettingsService(sequelize);
  const current = await settings.get(raman.ability);
  await settings.update(raman.ability, raman, {
    ...current,
    silentCheckerChecks: 3,
    pairingMinChecks: 3,
    lockVersion: current.lockVersion,
  });

  const standard = (await RuleSetRecord.findOne({
    where: { code: 'KFD-ENG-014', status: 'effective' },
    order: [['version', 'DESC']],
  }))!;
  const projectId = (await Project.findOne({ where: { code: 'KFD-MX80' } }))!.id;
  const sign = async (
    p: Person,
    id: number,
    meaning: 'authored' | 'checked' | 'approved',
    password = DEMO_PASSWORD,
  ) => {
    const { lockVersion } = await readRevision(p.ability, id);
    await workflow.sign(p.ability, p, id, { password, meaning, idempotencyKey: randomUUID(), lockVersion });
  };
  const upload = async (
    p: Person,
    id: number,
    kind: 'drawing' | 'material-certificate' | 'other',
    name: string,
    bytes: Promise<Buffer>,
    note: string,
  ) => attachments.upload(p.ability, p, id, { buffer: await bytes, originalname: name }, { kind, note });

  for (const [number, title, lateNote] of [
    ['MX80-SH-003', 'Agitator shaft, tank 2 spare', false],
    ['MX80-SH-004', 'Agitator shaft, tank 3', true],
  ] as const) {
    const created = await calcs.create(hale.ability, hale, {
      projectId,
      number,
      title,
      partRef: `DRG ${number}`,
      ruleSetId: standard.id,
      input: mixerShaft(),
    });
    const id = created.latest.id;
    await upload(hale, id, 'drawing', `${number}.pdf`, DEMO_DRAWING(`DRG ${number}`, title), 'Released drawing');
    await upload(
      hale,
      id,
      'material-certificate',
      `certificate-${number}.pdf`,
      DEMO_CERTIFICATE('AISI 1020 CD', `KF-${number}`),
      'Mill certificate for the tube used',
    );
    await sign(hale, id, 'authored');
    for (const item of ((await readRevision(okafor.ability, id)).checklist as { manual?: { id: string }[] } | null)
      ?.manual ?? []) {
      await review.setManualItem(okafor.ability, okafor, id, item.id, true, 'Seen in the demo record');
    }
    await sign(okafor, id, 'checked');
    if (lateNote) {
      for (let i = 0; i < 3; i++) await sign(lindqvist, id, 'approved', 'kestrel-fen-dmeo').catch(() => undefined);
      await upload(
        lindqvist,
        id,
        'other',
        `inspection-note-${number}.pdf`,
        demoDocument('Inspection note', ['Hub bore measured 90.02 mm after machining.']),
        'Inspection note added at approval',
      );
    }
    await sign(lindqvist, id, 'approved');
  }
  await stricterFatigueMargin(sequelize, standard.id, raman, ashdown);
}

/**
 * KFD-ENG-014 with a fatigue margin of 3 for agitator duty, drafted by one compliance officer and confirmed by the
 * other.
 */
async function stricterFatigueMargin(
  sequelize: Sequelize,
  fromId: number,
  drafter: Person,
  confirmer: Person,
): Promise<void> {
  const ruleSets = new RuleSetsService(sequelize, async () => undefined);
  const draft = await ruleSets.createDraft(drafter.ability, drafter, fromId);
  const doc = draft.document as { parameters: { name: string; value: unknown }[] };
  const document = {
    ...doc,
    parameters: doc.parameters.map((p) => (p.name === 'minFatigueSafety' ? { ...p, value: 3 } : p)),
    changeSummary: 'Minimum fatigue safety raised to 3 after the tank 1 agitator inspection',
  };
  const saved = await ruleSets.updateDraft(drafter.ability, drafter, draft.id, document, draft.lockVersion);
  const proposed = await ruleSets.propose(
    drafter.ability,
    drafter,
    draft.id,
    new Date().toISOString().slice(0, 10),
    saved.lockVersion,
  );
  await ruleSets.confirm(confirmer.ability, confirmer, draft.id, DEMO_PASSWORD, proposed.lockVersion);
}
